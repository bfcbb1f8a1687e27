using FinWatch.Statistics.Charts;
using FinWatch.Statistics.Constants;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.Shewhart;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// The analysis use case: turns a validated <see cref="AnalysisRequest"/> into calls of the pure SPC engine and its answer
/// into the contract's shapes (null for NaN, a number for a constant limit, an array for a varying one).
/// </summary>
public static class RunAnalysis
{
    public static AnalysisResponse Run(AnalysisRequest r)
    {
        var mode = r.Constants == "table" ? ConstantsMode.Table : ConstantsMode.Exact;
        var multiplier = r.SigmaMultiplier ?? ShewhartCharts.DefaultMultiplier;
        var limits = ToLimits(r.Limits);
        var chartName = r.Chart ?? (r.Subgroups is not null ? "Xbar-R" : "I-MR");
        ShewhartChart chart;
        double[] individuals;
        if (r.Values is { } values)
        {
            var x = values.Select(v => v ?? double.NaN).ToArray();
            chart = ShewhartCharts.Individuals(x, limits, mode, multiplier);
            individuals = x;
        }
        else
        {
            var groups = r.Subgroups!.Select(g => g.Select(v => v ?? double.NaN).ToArray()).ToList();
            var type = chartName == "Xbar-S" ? ShewhartChartType.MeanStandardDeviation : ShewhartChartType.MeanRange;
            chart = ShewhartCharts.Subgroups(groups, type, limits, mode, multiplier);
            individuals = [.. groups.SelectMany(g => g)];
        }

        var warnings = chart.Warnings.ToList();
        return new AnalysisResponse(
            ToChart(chart, chartName, mode, r.Limits?.Exclude ?? [], warnings),
            Rules(r.Rules, chart),
            Ewma(r.Ewma, chart, warnings),
            Cusum(r.Cusum, chart, warnings),
            SpcCapability.Capability(r.Capability, individuals, chart.Sigma),
            r.Normality == true ? SpcCapability.Normality(individuals) : null,
            SpcCapability.Percentile(r.PercentileCapability, individuals));
    }

    private static LimitRequest ToLimits(LimitsRequest? l)
    {
        var excluded = l?.Exclude is { Length: > 0 } x ? x.Select(e => e.Index).ToHashSet() : null;
        return l?.Source switch
        {
            "baseline" => new LimitRequest(LimitSource.Baseline, BaselineCount: l.Count, Excluded: excluded),
            "known" => new LimitRequest(LimitSource.Known, KnownMean: l.Mean, KnownSigma: l.Sigma),
            _ => new LimitRequest(LimitSource.Data, Excluded: excluded),
        };
    }

    internal static ChartResponse ToChart(ShewhartChart c, string name, ConstantsMode mode, IReadOnlyList<ExclusionRequest> excluded, List<string> warnings) =>
        new(name,
            c.Source,
            mode == ConstantsMode.Table ? "table" : "exact",
            Nullable(c.Center),
            c.Sigma,
            ToSeries(c.Primary),
            c.Secondary is null ? null : ToSeries(c.Secondary),
            c.Primary.BeyondLimits(),
            c.Secondary?.BeyondLimits() ?? [],
            excluded,
            warnings);

    private static RulesResponse? Rules(string[]? ids, ShewhartChart chart)
    {
        if (ids is not { Length: > 0 })
        {
            return null;
        }

        var rules = new List<RunRule>();
        foreach (var id in ids)
        {
            if (RunRules.TryParse(id, out var parsed))
            {
                rules.AddRange(parsed.Where(p => !rules.Contains(p)));
            }
        }

        var e = RunRuleEvaluation.Evaluate(chart.Primary.Values, chart.ZoneScores, rules);
        return new RulesResponse(
            rules.ToDictionary(RunRules.Id, rule => e.Flags[rule]),
            rules.ToDictionary(RunRules.Id, rule => e.First[rule]),
            e.Signals.Select(s => new SignalResponse(RunRules.Id(s.Rule), s.Index, s.Pattern)).ToList());
    }

    // EWMA and CUSUM run on the primary chart's statistic; its sigma is the chart's sigma_point (sigma/√n for means).
    private static (double Target, double Sigma)? Defaults(ShewhartChart chart, double? target, double? sigma, List<string> warnings, string name)
    {
        var sigmaPoint = sigma ?? PointSigma(chart);
        var t = target ?? chart.Center;
        if (!(sigmaPoint > 0) || !double.IsFinite(t))
        {
            warnings.Add($"{name} is not evaluable: the chart's sigma is zero or cannot be estimated; give sigma explicitly.");
            return null;
        }

        if (sigma is null && chart.SubgroupSizes.Where(n => n > 0).Distinct().Skip(1).Any())
        {
            warnings.Add($"{name} uses sigma/√n̄ of the average subgroup size because the sizes differ.");
        }

        return (t, sigmaPoint);
    }

    private static double PointSigma(ShewhartChart chart)
    {
        if (chart.Sigma is not { } s)
        {
            return double.NaN;
        }

        var sizes = chart.SubgroupSizes.Where(n => n > 0).ToList();
        return chart.Type == ShewhartChartType.IndividualsMovingRange || sizes.Count == 0 ? s : s / Math.Sqrt(sizes.Average());
    }

    private static EwmaResponse? Ewma(EwmaRequest? q, ShewhartChart chart, List<string> warnings)
    {
        if (q is null || Defaults(chart, q.Target, q.Sigma, warnings, "EWMA") is not { } d)
        {
            return null;
        }

        var e = Statistics.Charts.Ewma.Compute(chart.Primary.Values, q.Lambda!.Value, q.L!.Value, d.Target, d.Sigma);
        return new EwmaResponse(Nulls(e.Z), Nulls(e.Ucl), Nulls(e.Lcl), e.Signals, d.Target, d.Sigma);
    }

    private static CusumResponse? Cusum(CusumRequest? q, ShewhartChart chart, List<string> warnings)
    {
        if (q is null || Defaults(chart, q.Target, q.Sigma, warnings, "CUSUM") is not { } d)
        {
            return null;
        }

        var units = q.Units == "data" ? CusumUnits.Data : CusumUnits.Sigma;
        var c = Statistics.Charts.Cusum.Compute(chart.Primary.Values, q.K!.Value, q.H!.Value, d.Target, d.Sigma, units, q.HeadStart ?? 0);
        return new CusumResponse(Nulls(c.CPlus), Nulls(c.CMinus), c.SignalsUpper, c.SignalsLower, d.Target, d.Sigma);
    }

    internal static ChartLineResponse ToSeries(ChartSeries s) => new(Nulls(s.Values), Line(s.Center), Line(s.Upper), Line(s.Lower));

    /// <summary>A constant line as one number, a varying one as an array (null where a point has no limit).</summary>
    private static object? Line(double[] line)
    {
        var finite = line.Where(double.IsFinite).Distinct().Take(2).ToList();
        return finite.Count switch
        {
            0 => null,
            1 when !line.Any(double.IsNaN) => finite[0],
            _ => Nulls(line),
        };
    }

    public static double?[] Nulls(double[] values) => values.Select(Nullable).ToArray();

    public static double? Nullable(double v) => double.IsFinite(v) ? v : null;
}
