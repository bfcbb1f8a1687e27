using FinWatch.Server.Infrastructure;
namespace FinWatch.Server.Features.Spc;

/// <summary>Checks an analysis request field by field; each problem is keyed by the field's JSON path.</summary>
public static class AnalysisRules
{
    public const int MaxPoints = 1_000_000;
    public const double MaxMagnitude = 1e100;

    /// <summary>Each rule id or set name that <see cref="Statistics.Rules.RunRules.TryParse"/> does not know, under "rules".</summary>
    public static void CheckRuleIds(IEnumerable<string?>? ids, ValidationErrors e)
    {
        foreach (var id in ids ?? [])
        {
            if (!Statistics.Rules.RunRules.TryParse(id ?? "", out _))
            {
                e.Add("rules", $"'{id}' is not a rule: use WE1–WE4, N1–N8, westernElectric or nelson");
            }
        }
    }

    public static void Check(AnalysisRequest r, ValidationErrors e)
    {

        var hasValues = r.Values is not null;
        var hasSubgroups = r.Subgroups is not null;
        if (hasValues == hasSubgroups)
        {
            e.Add("values", "give either values (numbers, null for a missing one) or subgroups (arrays of numbers), not both and not neither");
        }

        var count = r.Values?.Length ?? r.Subgroups?.Length ?? 0;
        if ((hasValues || hasSubgroups) && count == 0)
        {
            e.Add(hasValues ? "values" : "subgroups", "the series is empty");
        }

        if (count > MaxPoints)
        {
            e.Add(hasValues ? "values" : "subgroups", $"at most {MaxPoints} points per analysis");
        }

        // Squares of larger magnitudes overflow double precision; no measured quantity comes near this.
        var tooLarge = (r.Values ?? []).Select((v, i) => (v, i)).FirstOrDefault(p => p.v is { } x && Math.Abs(x) > MaxMagnitude);
        if (tooLarge.v is not null)
        {
            e.Add("values", $"values[{tooLarge.i}] = {tooLarge.v} is beyond ±{MaxMagnitude:0e0}");
        }

        if ((r.Subgroups ?? []).Any(g => g is not null && g.Any(v => v is { } x && Math.Abs(x) > MaxMagnitude)))
        {
            e.Add("subgroups", $"a value is beyond ±{MaxMagnitude:0e0}");
        }

        var chart = r.Chart ?? (hasSubgroups ? "Xbar-R" : "I-MR");
        if (chart is not ("I-MR" or "Xbar-R" or "Xbar-S"))
        {
            e.Add("chart", $"'{r.Chart}' is not one of I-MR, Xbar-R, Xbar-S");
        }
        else if (chart == "I-MR" && hasSubgroups)
        {
            e.Add("chart", "I-MR charts individual values: send values, or choose Xbar-R or Xbar-S for subgroups");
        }
        else if (chart != "I-MR" && hasValues)
        {
            e.Add("chart", $"{chart} needs subgroups (arrays of values), not single values");
        }

        for (var i = 0; hasSubgroups && i < r.Subgroups!.Length; i++)
        {
            var g = r.Subgroups[i];
            if (g is null)
            {
                e.Add($"subgroups[{i}]", "a subgroup is an array (use [] or nulls for missing values)");
            }
            else if (g.Count(v => v is not null) > 25)
            {
                e.Add($"subgroups[{i}]", "a subgroup holds at most 25 values (the chart constants are defined for 2 to 25)");
            }
        }

        if (r.Constants is not (null or "exact" or "table"))
        {
            e.Add("constants", $"'{r.Constants}' is not 'exact' or 'table'");
        }

        CheckLimits(r.Limits, count, e.Add);
        if (r.SigmaMultiplier is { } m && !(m > 0 && m <= 10))
        {
            e.Add("sigma_multiplier", "the sigma multiplier must be above 0 and at most 10");
        }

        CheckRuleIds(r.Rules, e);

        if (r.Ewma is { } ewma)
        {
            if (ewma.Lambda is not { } lambda || !(lambda > 0 && lambda <= 1))
            {
                e.Add("ewma.lambda", "lambda is required, 0 < lambda ≤ 1");
            }

            if (ewma.L is not { } l || !(l > 0))
            {
                e.Add("ewma.l", "L is required and must be positive");
            }

            if (ewma.Sigma is { } s && !(s > 0))
            {
                e.Add("ewma.sigma", "sigma must be positive");
            }
        }

        if (r.Cusum is { } cusum)
        {
            if (cusum.K is not { } k || !(k >= 0))
            {
                e.Add("cusum.k", "k is required and must be ≥ 0");
            }

            if (cusum.H is not { } h || !(h > 0))
            {
                e.Add("cusum.h", "h is required and must be positive");
            }

            if (cusum.Units is not (null or "sigma" or "data"))
            {
                e.Add("cusum.units", "units is 'sigma' or 'data'");
            }

            if (cusum.HeadStart is { } hs && !(hs >= 0 && (cusum.H is not { } hh || hs <= hh)))
            {
                e.Add("cusum.head_start", "the head start must lie between 0 and h");
            }

            if (cusum.Sigma is { } s && !(s > 0))
            {
                e.Add("cusum.sigma", "sigma must be positive");
            }
        }

        if (r.Capability is { } cap)
        {
            CheckSpec("capability", cap.Lsl, cap.Usl, e.Add);
            if (cap.Confidence is { } c && !(c > 0 && c < 1))
            {
                e.Add("capability.confidence", "the confidence level lies strictly between 0 and 1, e.g. 0.95");
            }
        }

        if (r.PercentileCapability is { } pc)
        {
            CheckSpec("percentile_capability", pc.Lsl, pc.Usl, e.Add);
            if (pc.Distribution is not (null or "lognormal"))
            {
                e.Add("percentile_capability.distribution", "the percentile method fits 'lognormal' only");
            }
        }

    }

    private static void CheckLimits(LimitsRequest? limits, int count, Action<string, string> add)
    {
        if (limits is null)
        {
            return;
        }

        switch (limits.Source)
        {
            case "data":
                break;
            case "baseline":
                if (limits.Count is not { } k || k < 1 || k > count)
                {
                    add("limits.count", $"a baseline count from 1 to the number of points ({count}) is required");
                }

                break;
            case "known":
                if (limits.Mean is null)
                {
                    add("limits.mean", "known limits need the mean");
                }

                if (limits.Sigma is not { } s || !(s >= 0))
                {
                    add("limits.sigma", "known limits need the sigma of individual values (≥ 0)");
                }

                break;
            default:
                add("limits.source", $"'{limits.Source}' is not one of data, baseline, known");
                break;
        }

        foreach (var (x, i) in (limits.Exclude ?? []).Select((x, i) => (x, i)))
        {
            if (x.Index < 0 || x.Index >= count)
            {
                add($"limits.exclude[{i}].index", $"{x.Index} is not a position of the series (0 to {count - 1})");
            }

            if (string.IsNullOrWhiteSpace(x.Reason))
            {
                add($"limits.exclude[{i}].reason", "say why the point is left out of the limits");
            }
        }
    }

    private static void CheckSpec(string prefix, double? lsl, double? usl, Action<string, string> add)
    {
        if (lsl is null && usl is null)
        {
            add(prefix, "give lsl, usl or both");
        }
        else if (lsl >= usl)
        {
            add(prefix, $"lsl ({lsl}) must be below usl ({usl})");
        }
    }
}
