using FinWatch.Server.Infrastructure;
namespace FinWatch.Server.Features.Spc;

/// <summary>Checks an ARL request; shifts and designs must be finite and in the ranges the run-length methods cover.</summary>
public static class ArlRules
{
    public const int MaxShifts = 50, MaxDesigns = 20;

    private static readonly string[] WesternElectric = ["WE1", "WE2", "WE3", "WE4"];

    public static void Check(ArlRequest r, ValidationErrors e)
    {
        if (r.Shifts is not { Length: > 0 and <= MaxShifts } shifts)
        {
            e["shifts"] = $"give 1 to {MaxShifts} shifts, in sigmas of the plotted statistic";
        }
        else if (shifts.Any(s => !double.IsFinite(s) || Math.Abs(s) > 10))
        {
            e["shifts"] = "shifts must be numbers between −10 and 10 sigma";
        }

        if ((r.Shewhart?.Length ?? 0) + (r.Cusum?.Length ?? 0) + (r.Ewma?.Length ?? 0) == 0 && r.Rules is not { Length: > 0 })
        {
            e["shewhart"] = "give at least one design: shewhart, cusum, ewma or rules";
        }

        if ((r.Shewhart?.Length ?? 0) > MaxDesigns || (r.Cusum?.Length ?? 0) > MaxDesigns || (r.Ewma?.Length ?? 0) > MaxDesigns)
        {
            e["designs"] = $"at most {MaxDesigns} designs of each kind";
        }

        foreach (var (l, i) in (r.Shewhart ?? []).Select((l, i) => (l, i)))
        {
            if (!(l > 0 && l <= 6))
            {
                e[$"shewhart[{i}]"] = "L must lie in (0, 6]";
            }
        }

        foreach (var (c, i) in (r.Cusum ?? []).Select((c, i) => (c, i)))
        {
            if (c.K is not { } k || !(k >= 0 && k <= 3))
            {
                e[$"cusum[{i}].k"] = "k is required, 0 ≤ k ≤ 3 (sigmas)";
            }

            if (c.H is not { } h || !(h > 0 && h <= 20))
            {
                e[$"cusum[{i}].h"] = "h is required, 0 < h ≤ 20 (sigmas)";
            }

            if (c.HeadStart is { } hs && !(hs >= 0 && hs < (c.H ?? double.PositiveInfinity)))
            {
                e[$"cusum[{i}].head_start"] = "the head start lies in [0, h)";
            }
        }

        foreach (var (w, i) in (r.Ewma ?? []).Select((w, i) => (w, i)))
        {
            if (w.Lambda is not { } lambda || !(lambda > 0 && lambda <= 1))
            {
                e[$"ewma[{i}].lambda"] = "lambda is required, 0 < lambda ≤ 1";
            }

            if (w.L is not { } l || !(l > 0 && l <= 6))
            {
                e[$"ewma[{i}].l"] = "L is required, 0 < L ≤ 6";
            }
        }

        if (r.Rules is { Length: > 0 } rules && rules.Any(id => id != "westernElectric" && !WesternElectric.Contains(id)))
        {
            e["rules"] = "run lengths with rules are computed for the Western Electric rules WE1–WE4 (or 'westernElectric')";
        }

    }

    public static string[] ExpandWesternElectric(IEnumerable<string> ids) =>
        ids.SelectMany(id => id == "westernElectric" ? WesternElectric : [id]).Distinct().Order(StringComparer.Ordinal).ToArray();
}
