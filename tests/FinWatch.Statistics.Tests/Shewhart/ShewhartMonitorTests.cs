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
}
