using FinWatch.Statistics.Rules;
using FinWatch.Statistics.Shewhart;
using FsCheck.Xunit;

namespace FinWatch.Statistics.Tests.Shewhart;

public class ShewhartMonitorTests
{
    private static double[] Series(int seed, int n)
    {
        var random = new Random(seed);
        var values = new double[n];
        for (var i = 0; i < n; i++)
        {
            // A drifting, sometimes missing series so that every rule gets chances to fire.
            values[i] = random.NextDouble() < 0.05 ? double.NaN : (i * 0.01) + (2 * (random.NextDouble() - 0.5)) + (random.NextDouble() < 0.03 ? 4 : 0);
        }

        return values;
    }

    // Consistency property (incremental equals batch): appending point by point to frozen limits gives the same
    // limits, zone scores, beyond-limit points and rule signals as charting the whole series at once.
    [Property(MaxTest = 60)]
    public bool Append_PointByPoint_EqualsBatchEvaluation(int seed)
    {
        var values = Series(seed, 300);
        var all = RunRules.WesternElectric.Concat(RunRules.Nelson).ToArray();
        var batch = ShewhartCharts.Individuals(values, new LimitRequest(LimitSource.Known, KnownMean: 0.5, KnownSigma: 0.6));
        var batchRules = RunRuleEvaluation.Evaluate(values, batch.ZoneScores, all);

        var monitor = new ShewhartMonitor(ShewhartChartType.IndividualsMovingRange, 0.5, 0.6, all);
        var signals = new List<RuleSignal>();
        var beyond = new List<int>();
        var secondaryBeyond = new List<int>();
        for (var i = 0; i < values.Length; i++)
        {
            var p = monitor.Append(values[i], signals);
            if (p.Beyond)
            {
                beyond.Add(i);
            }

            if (p.SecondaryBeyond)
            {
                secondaryBeyond.Add(i);
            }

            if (!double.IsNaN(p.Z) && p.Z != batch.ZoneScores[i])
            {
                return false;
            }
        }

        var sameSignals = signals.Select(s => (s.Rule, s.Index)).SequenceEqual(batchRules.Signals.Select(s => (s.Rule, s.Index)));
        return sameSignals && beyond.SequenceEqual(batch.Primary.BeyondLimits()) && secondaryBeyond.SequenceEqual(batch.Secondary!.BeyondLimits());
    }

    [Fact]
    public void Append_Subgroups_MatchesBatchLimits()
    {
        double[][] groups = [[1, 2, 3], [2, 2, 9, 4], [3], [double.NaN, 1, 5, 2, 2]];
        var batch = ShewhartCharts.Subgroups(groups, ShewhartChartType.MeanStandardDeviation, new LimitRequest(LimitSource.Known, KnownMean: 2.5, KnownSigma: 1.2));
        var monitor = new ShewhartMonitor(ShewhartChartType.MeanStandardDeviation, 2.5, 1.2, RunRules.WesternElectric);
        for (var i = 0; i < groups.Length; i++)
        {
            var p = monitor.Append(groups[i], null);
            Assert.Equal(batch.Primary.Upper[i], p.Upper, 12);
            Assert.Equal(batch.Primary.Values[i], p.Value, 12);
            Assert.Equal(batch.Secondary!.Values[i], p.Secondary, 12);
            Assert.Equal(batch.Secondary.Upper[i], p.SecondaryUpper, 12);
        }
    }

    [Fact]
    public void Append_FirstPoint_HasNoMovingRange()
    {
        var monitor = new ShewhartMonitor(ShewhartChartType.IndividualsMovingRange, 0, 1, RunRules.WesternElectric);
        Assert.True(double.IsNaN(monitor.Append(0.2, null).Secondary));
        Assert.Equal(0.3, monitor.Append(0.5, null).Secondary, 12);
    }

    // Consistency property: a subgroup given by its summary (mean, n, standard deviation) is placed exactly as the
    // subgroup's values are, including its rule signals.
    [Property(MaxTest = 40)]
    public bool AppendSummary_EqualsAppendingTheValues(int seed)
    {
        var random = new Random(seed);
        var all = RunRules.WesternElectric.Concat(RunRules.Nelson).ToArray();
        var byValues = new ShewhartMonitor(ShewhartChartType.MeanStandardDeviation, 0, 1, all);
        var bySummary = new ShewhartMonitor(ShewhartChartType.MeanStandardDeviation, 0, 1, all);
        List<RuleSignal> a = [], b = [];
        for (var i = 0; i < 200; i++)
        {
            var n = random.Next(0, 6);
            var values = Enumerable.Range(0, n).Select(_ => (i * 0.004) + (2 * random.NextDouble()) - 1).ToArray();
            var mean = n == 0 ? double.NaN : values.Average();
            var sd = n < 2 ? double.NaN : Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (n - 1));
            var p = byValues.Append(values, a);
            var q = bySummary.AppendSummary(mean, n, sd, b);
            if (!Same(p.Value, q.Value) || !Same(p.Upper, q.Upper) || !Same(p.Z, q.Z) || p.Beyond != q.Beyond || !Same(p.Secondary, q.Secondary))
            {
                return false;
            }
        }

        return a.Select(s => (s.Rule, s.Index)).SequenceEqual(b.Select(s => (s.Rule, s.Index)));

        static bool Same(double x, double y) => (double.IsNaN(x) && double.IsNaN(y)) || Math.Abs(x - y) <= 1e-12 * Math.Max(1, Math.Abs(x));
    }

    // Consistency property: revising the limits part-way keeps the run-rule state, so the signals are those of the rule
    // engine run over the zone scores each point got under the limits in force at its position.
    [Property(MaxTest = 40)]
    public bool Continue_KeepsTheRuleStateAcrossRevisedLimits(int seed)
    {
        var values = Series(seed, 240);
        var all = RunRules.WesternElectric.Concat(RunRules.Nelson).ToArray();
        var monitor = new ShewhartMonitor(ShewhartChartType.IndividualsMovingRange, 0.5, 0.6, all);
        var signals = new List<RuleSignal>();
        var z = new double[values.Length];
        for (var i = 0; i < values.Length; i++)
        {
            if (i == 120)
            {
                monitor = monitor.Continue(1.4, 0.8);
            }

            z[i] = monitor.Append(values[i], signals).Z;
            var expected = double.IsNaN(values[i]) ? double.NaN : (values[i] - (i < 120 ? 0.5 : 1.4)) / (i < 120 ? 0.6 : 0.8);
            if (!(double.IsNaN(expected) ? double.IsNaN(z[i]) : Math.Abs(expected - z[i]) < 1e-12))
            {
                return false;
            }
        }

        var reference = RunRuleEvaluation.Evaluate(values, z, all);
        return signals.Select(s => (s.Rule, s.Index)).SequenceEqual(reference.Signals.Select(s => (s.Rule, s.Index)));
    }

    [Fact]
    public void AppendSummary_OnAnIndividualsChart_TakesOneValue()
    {
        var monitor = new ShewhartMonitor(ShewhartChartType.IndividualsMovingRange, 0, 1, RunRules.WesternElectric);
        Assert.Equal(3.5, monitor.AppendSummary(3.5, 1, double.NaN, null).Z, 12);
        Assert.Throws<InvalidOperationException>(() => monitor.AppendSummary(1, 4, 0.3, null));
    }

    // Analytic: with a known sigma the mean of n values has standard deviation σ/√n (Montgomery, Introduction to
    // Statistical Quality Control, §6.2), also beyond the tabulated subgroup sizes, where the spread chart has no limits.
    [Fact]
    public void AppendSummary_BeyondTheTabulatedSizes_UsesSigmaOverRootN()
    {
        var monitor = new ShewhartMonitor(ShewhartChartType.MeanStandardDeviation, 10, 2, [RunRule.WE1]);
        var p = monitor.AppendSummary(10.9, 36, 1.8, null);
        Assert.Equal(0.9 / (2 / 6.0), p.Z, 12);
        Assert.Equal(10 + (3 * 2 / 6.0), p.Upper, 12);
        Assert.True(double.IsNaN(p.SecondaryUpper));
    }
}
