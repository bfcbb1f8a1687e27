using FinWatch.Statistics.Constants;
using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// A live Shewhart chart with frozen limits (phase II): each appended point is placed against the limits, its zone score
/// goes to the run rules, and the signals it completes are returned, in constant time per point. Appending a series
/// point by point gives exactly what <see cref="ShewhartCharts"/> with <see cref="LimitSource.Known"/> limits and
/// <see cref="RunRuleEvaluation.Evaluate"/> give for the whole series.
/// </summary>
public sealed class ShewhartMonitor
{
    private readonly ShewhartChartType type;
    private readonly ConstantsMode mode;
    private readonly double multiplier;
    private readonly RunRuleEvaluator rules;
    private double previous = double.NaN;
    private int index;

    /// <param name="type">Chart type.</param>
    /// <param name="center">Frozen centre line of the primary chart.</param>
    /// <param name="sigma">Frozen sigma of individual values (≥ 0).</param>
    /// <param name="rules">Run rules to evaluate.</param>
    /// <param name="mode">Constants mode.</param>
    /// <param name="multiplier">Sigma multiplier of the limits.</param>
    public ShewhartMonitor(ShewhartChartType type, double center, double sigma, IEnumerable<RunRule> rules,
        ConstantsMode mode = ConstantsMode.Exact, double multiplier = ShewhartCharts.DefaultMultiplier)
        : this(type, center, sigma, new RunRuleEvaluator(rules), mode, multiplier)
    {
    }

    private ShewhartMonitor(ShewhartChartType type, double center, double sigma, RunRuleEvaluator rules, ConstantsMode mode, double multiplier)
    {
        if (!double.IsFinite(center) || !(sigma >= 0) || !double.IsFinite(sigma))
        {
            throw new ArgumentOutOfRangeException(nameof(sigma), "A frozen chart needs a finite centre and a finite sigma ≥ 0.");
        }

        this.type = type;
        this.mode = mode;
        this.multiplier = multiplier;
        Center = center;
        Sigma = sigma;
        this.rules = rules;
    }

    public double Center { get; }

    public double Sigma { get; }

    /// <summary>Number of positions appended so far, missing ones included (the next point's index).</summary>
    public int Count => index;

    /// <summary>Appends an individual value (I-MR); NaN appends a missing position.</summary>
    public MonitorPoint Append(double value, ICollection<RuleSignal>? signals)
    {
        if (type != ShewhartChartType.IndividualsMovingRange)
        {
            throw new InvalidOperationException("This monitor charts subgroups; append a subgroup.");
        }

        var i = index++;
        var half = multiplier * Sigma;
        var c2 = ControlChartConstants.Get(2, mode);
        var mr = double.NaN;
        if (!double.IsNaN(value) && !double.IsNaN(previous))
        {
            mr = Math.Abs(value - previous);
        }

        if (!double.IsNaN(value))
        {
            previous = value;
        }

        var (_, ru, rl) = SpreadLimits(c2, useRange: true);
        return Place(i, value, Center + half, Center - half, mr, ru, rl, signals);
    }

    /// <summary>Appends a subgroup (Xbar-R or Xbar-S); NaN entries are missing sites; an empty subgroup is a missing position.</summary>
    public MonitorPoint Append(ReadOnlySpan<double> subgroup, ICollection<RuleSignal>? signals)
    {
        if (type == ShewhartChartType.IndividualsMovingRange)
        {
            throw new InvalidOperationException("This monitor charts individual values; append a value.");
        }

        var m = new RunningMoments();
        double min = double.PositiveInfinity, max = double.NegativeInfinity;
        foreach (var v in subgroup)
        {
            if (!double.IsNaN(v))
            {
                m.Add(v);
                min = Math.Min(min, v);
                max = Math.Max(max, v);
            }
        }

        var useRange = type == ShewhartChartType.MeanRange;
        return AppendSummary(m.Mean, (int)m.Count, useRange ? max - min : m.SampleStandardDeviation, signals);
    }

    /// <summary>
    /// Appends a subgroup known only by its summary: its mean, its number of values and its spread (the range on an
    /// Xbar-R chart, the sample standard deviation on an Xbar-S chart; NaN when unknown or n = 1). Gives exactly what
    /// appending the values themselves gives. n = 0 is a missing position. On an I-MR chart n must be 1.
    /// </summary>
    public MonitorPoint AppendSummary(double mean, int n, double spread, ICollection<RuleSignal>? signals)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(n);
        if (type == ShewhartChartType.IndividualsMovingRange)
        {
            if (n > 1)
            {
                throw new InvalidOperationException("This monitor charts individual values; a summary of more than one value is a subgroup.");
            }

            return Append(n == 0 ? double.NaN : mean, signals);
        }

        var i = index++;
        if (n == 0)
        {
            return Place(i, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, signals);
        }

        if (n == 1)
        {
            return Place(i, mean, Center + (multiplier * Sigma), Center - (multiplier * Sigma), double.NaN, double.NaN, double.NaN, signals);
        }

        if (n > ControlChartConstants.MaxSubgroupSize)
        {
            // Beyond the constants' range the mean's limits are still exact for a known sigma (L·σ/√n); the spread
            // chart has no limits there.
            var wide = multiplier * Sigma / Math.Sqrt(n);
            return Place(i, mean, Center + wide, Center - wide, spread, double.NaN, double.NaN, signals);
        }

        var c = ControlChartConstants.Get(n, mode);
        var useRange = type == ShewhartChartType.MeanRange;
        var half = ShewhartCharts.MeanHalfWidth(c, useRange, mode, multiplier, Sigma);
        var (_, su, sl) = SpreadLimits(c, useRange);
        return Place(i, mean, Center + half, Center - half, spread, su, sl, signals);
    }

    /// <summary>
    /// The same chart under revised frozen limits: a monitor with the new centre and sigma that continues this one's
    /// positions and run-rule state, so a pattern that began under the old limits completes under the new ones (the
    /// zone scores already placed are kept as they were judged). This monitor must not be appended to afterwards.
    /// </summary>
    public ShewhartMonitor Continue(double center, double sigma) =>
        new(type, center, sigma, rules, mode, multiplier) { previous = previous, index = index };

    private (double Center, double Upper, double Lower) SpreadLimits(ChartConstants c, bool useRange) =>
        useRange ? ShewhartCharts.RangeLimits(c, mode, multiplier, Sigma) : ShewhartCharts.DeviationLimits(c, mode, multiplier, Sigma);

    private MonitorPoint Place(int i, double value, double upper, double lower, double spread, double spreadUpper, double spreadLower,
        ICollection<RuleSignal>? signals)
    {
        var sigmaPoint = (upper - Center) / multiplier;
        var z = !double.IsNaN(value) && sigmaPoint > 0 ? (value - Center) / sigmaPoint : double.NaN;
        if (!double.IsNaN(value))
        {
            rules.Append(i, value, z, signals);
        }

        return new MonitorPoint(i, value, Center, upper, lower, z, value > upper || value < lower,
            spread, spreadUpper, spreadLower, spread > spreadUpper || spread < spreadLower);
    }
}
