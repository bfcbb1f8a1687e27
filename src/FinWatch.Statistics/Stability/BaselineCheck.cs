using FinWatch.Statistics.Capability;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.Shewhart;

namespace FinWatch.Statistics.Stability;

/// <summary>
/// Checks the points a set of limits was computed from before anyone approves them: the enabled run rules, run over the
/// baseline against the draft limits (a baseline that breaks its own limits is not in control); the Mann–Kendall trend
/// test (a drifting baseline gives limits that are too wide and centred on a moving mean); the number of subgroups; and,
/// for information only, the Anderson–Darling normality test of the plotted values. The verdict is "stable" when no rule
/// fires, no trend is significant and there are enough subgroups; otherwise the list of reasons.
/// </summary>
public static class BaselineCheck
{
    /// <summary>Fewer subgroups than this is a reason (common practice: 20–25 subgroups before limits are trusted; no single source).</summary>
    public const int RecommendedSubgroups = 25;

    /// <summary>Significance level of the trend test.</summary>
    public const double TrendAlpha = 0.05;

    /// <param name="type">The chart type the limits are for.</param>
    /// <param name="center">Draft centre line.</param>
    /// <param name="sigma">Draft sigma of one value (sites on a subgroup chart; the plotted point on an I-MR chart).</param>
    /// <param name="points">The baseline subgroups in time order: mean, number of values, spread (NaN if unknown).</param>
    /// <param name="rules">The chart's enabled rules.</param>
    public static BaselineCheckResult Run(ShewhartChartType type, double center, double sigma,
        IReadOnlyList<(double Mean, int N, double Spread)> points, IReadOnlyCollection<RunRule> rules)
    {
        ArgumentNullException.ThrowIfNull(points);
        var monitor = new ShewhartMonitor(type, center, sigma, rules);
        var signals = new List<RuleSignal>();
        var beyond = 0;
        foreach (var (mean, n, spread) in points)
        {
            var placed = type == ShewhartChartType.IndividualsMovingRange
                ? monitor.Append(mean, signals)
                : monitor.AppendSummary(mean, n, spread, signals);
            beyond += placed.Beyond ? 1 : 0;
        }

        var means = points.Select(p => p.Mean).ToArray();
        var trend = MannKendall.Test(means);
        var normality = AndersonDarling.Test(means);
        var byRule = signals.GroupBy(s => s.Rule).OrderBy(g => g.Key)
            .Select(g => new RuleCount(g.Key, g.Count(), g.Select(s => s.Index).Distinct().Count())).ToList();
        var flagged = signals.Select(s => s.Index).Distinct().Count();

        var reasons = new List<string>();
        if (points.Count < RecommendedSubgroups)
        {
            reasons.Add($"only {points.Count} subgroups; {RecommendedSubgroups} or more are usual before limits are trusted (common practice)");
        }

        if (flagged > 0)
        {
            reasons.Add($"{flagged} of the {points.Count} baseline points break the chart's own rules against these limits ("
                + string.Join(", ", byRule.Select(r => $"{RunRules.Id(r.Rule)} on {r.Points}")) + ")");
        }

        if (trend.PValue < TrendAlpha)
        {
            reasons.Add($"the baseline is {trend.Direction(TrendAlpha)} (Mann–Kendall trend test, p = {trend.PValue:0.####})");
        }

        return new BaselineCheckResult(points.Count, byRule, flagged, beyond, trend, normality, reasons);
    }
}

/// <summary>How often one rule fired over the baseline: signals and distinct flagged points.</summary>
public readonly record struct RuleCount(RunRule Rule, int Signals, int Points);

/// <summary>The baseline check: subgroups, rule signals, the trend and normality tests, and the reasons it is not stable (empty when stable).</summary>
public sealed record BaselineCheckResult(
    int Subgroups, IReadOnlyList<RuleCount> Rules, int FlaggedPoints, int BeyondLimits, TrendResult Trend, NormalityResult Normality,
    IReadOnlyList<string> Reasons)
{
    public bool Stable => Reasons.Count == 0;
}
