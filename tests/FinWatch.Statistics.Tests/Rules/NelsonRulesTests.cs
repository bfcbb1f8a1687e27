using FinWatch.Statistics.Rules;
using static FinWatch.Statistics.Tests.Rules.RuleTestHelpers;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// Hand-built series for Nelson's tests. Source of each test: Nelson (1984) via the table of docs/statistics.md §3.2 (FinWatch
/// reading column); the edge readings cite docs/statistics.md §3.3 by item number. Unless values are given, z-scores are used as
/// plotted values (CL 0, sigma 1).
/// </summary>
public class NelsonRulesTests
{
    private static readonly double[] Mixed =
        [0.5, 3.01, -3.0, -3.2, 3.0, 2.5, -2.4, 2.2, 1.5, 1.2, -2.5, 1.1, 1.9, 0, -2.1, -2.2, 1.0, 1.5, 1.5, 1.5, 0.5];

    // docs/statistics.md §3.2: N1 (one point beyond zone A) reads |z| > 3, the same flags as WE1.
    [Fact]
    public void N1_MixedSeries_SameFlagsAsWE1()
    {
        var result = RunRuleEvaluation.Evaluate(Mixed, Mixed, [RunRule.N1, RunRule.WE1]);
        Assert.Equal([1, 3], result.Flags[RunRule.N1]!);
        Assert.Equal(result.Flags[RunRule.WE1]!, result.Flags[RunRule.N1]!);
        Assert.Equal([3], PatternAt([.. result.Signals.Where(s => s.Rule == RunRule.N1)], 3));
    }

    // docs/statistics.md §3.2: N2, nine in a row on one side; §3.3 item 4: a run of 10 flags the 9th and 10th.
    [Fact]
    public void N2_RunOfTen_FlagsNinthAndTenth()
    {
        var signals = SignalsOf(RunRule.N2, Repeat(0.5, 10));
        Assert.Equal([8, 9], signals.Select(s => s.Index));
        Assert.Equal(Range(1, 9), PatternAt(signals, 9));
    }

    // docs/statistics.md §3.2: N2 needs nine; eight on one side do not signal (WE4 would).
    [Fact]
    public void N2_RunOfEight_NoFlag() =>
        Assert.Empty(FlagsOf(RunRule.N2, Concat(Repeat(-0.5, 8), [0.5])));

    // docs/statistics.md §3.2: N3, six points steadily increasing = five successive strict increases; pattern the six points.
    [Fact]
    public void N3_SixIncreasing_FlagsSixthWithPattern()
    {
        double[] values = [1, 2, 3, 4, 5, 6];
        var signals = SignalsOf(RunRule.N3, values, Repeat(0, 6));
        var signal = Assert.Single(signals);
        Assert.Equal(5, signal.Index);
        Assert.Equal(Range(0, 6), signal.Pattern);
    }

    // docs/statistics.md §3.2: N3 decreasing; §3.3 item 4: seven decreasing flag the 6th and 7th.
    [Fact]
    public void N3_SevenDecreasing_FlagsSixthAndSeventh() =>
        Assert.Equal([5, 6], FlagsOf(RunRule.N3, [7, 6, 5, 4, 3, 2, 1], Repeat(0, 7)));

    // docs/statistics.md §3.2: five increasing points (four steps) do not signal.
    [Fact]
    public void N3_FiveIncreasing_NoFlag() =>
        Assert.Empty(FlagsOf(RunRule.N3, [1, 2, 3, 4, 5, 4, 5, 6, 7, 8], Repeat(0, 10)));

    // docs/statistics.md §3.2: an increasing trend then a decreasing one: each completes separately (the peak is shared).
    [Fact]
    public void N3_UpThenDown_FlagsEachTrend() =>
        Assert.Equal([5, 10], FlagsOf(RunRule.N3, [1, 2, 3, 4, 5, 6, 5, 4, 3, 2, 1], Repeat(0, 11)));

    // docs/statistics.md §3.2: N3 looks at the plotted values, not at zones: the same trend signals wherever it lies.
    [Fact]
    public void N3_TrendAcrossZones_Flags() =>
        Assert.Equal([5], FlagsOf(RunRule.N3, -2.9, -2.0, -0.5, 0, 1.2, 2.8));

    // docs/statistics.md §3.2: N4, fourteen points alternating = thirteen differences alternating in sign; pattern 14 points.
    [Fact]
    public void N4_FourteenAlternating_FlagsFourteenthWithPattern()
    {
        var values = Enumerable.Range(0, 14).Select(i => (double)(i % 2)).ToArray();
        var signals = SignalsOf(RunRule.N4, values, Repeat(0.5, 14));
        var signal = Assert.Single(signals);
        Assert.Equal(13, signal.Index);
        Assert.Equal(Range(0, 14), signal.Pattern);
    }

    // docs/statistics.md §3.2: thirteen alternating points (twelve differences) do not signal.
    [Fact]
    public void N4_ThirteenAlternating_NoFlag()
    {
        var values = Enumerable.Range(0, 13).Select(i => (double)(i % 2)).ToArray();
        Assert.Empty(FlagsOf(RunRule.N4, values, Repeat(0.5, 13)));
    }

    // docs/statistics.md §3.3 item 4 for N4: fifteen alternating points flag the 14th and 15th.
    [Fact]
    public void N4_FifteenAlternating_FlagsLastTwo()
    {
        var values = Enumerable.Range(0, 15).Select(i => (double)(i % 2)).ToArray();
        Assert.Equal([13, 14], FlagsOf(RunRule.N4, values, Repeat(0.5, 15)));
    }

    // docs/statistics.md §3.2: only the signs of the differences matter, not their sizes.
    [Fact]
    public void N4_AlternatingWithVaryingSteps_Flags() =>
        Assert.Equal([13], FlagsOf(RunRule.N4, [10, 12, 11, 15, 3, 4, 2, 9, 8, 8.5, 1, 30, -5, 0], Repeat(0, 14)));

    // docs/statistics.md §3.2: N5 = WE2 (two of three in zone A or beyond, one side), flags and patterns.
    [Fact]
    public void N5_MixedSeries_SameSignalsAsWE2()
    {
        var result = RunRuleEvaluation.Evaluate(Mixed, Mixed, [RunRule.N5, RunRule.WE2]);
        Assert.Equal([3, 5, 7, 15], result.Flags[RunRule.N5]!);
        AssertSameSignals(result, RunRule.WE2, RunRule.N5);
    }

    // docs/statistics.md §3.2: N6 = WE3 (four of five in zone B or beyond, one side), flags and patterns. Index 19 is not flagged:
    // its window holds index 16 at exactly 1.0, which is in zone C (§3.3 item 1).
    [Fact]
    public void N6_MixedSeries_SameSignalsAsWE3()
    {
        var result = RunRuleEvaluation.Evaluate(Mixed, Mixed, [RunRule.N6, RunRule.WE3]);
        Assert.Equal([8, 9, 11, 12], result.Flags[RunRule.N6]!);
        AssertSameSignals(result, RunRule.WE3, RunRule.N6);
    }

    // docs/statistics.md §3.2: N7, fifteen in a row within 1 sigma (|z| ≤ 1, so ±1 and 0 count, §3.3 item 1); pattern 15 points.
    [Fact]
    public void N7_FifteenWithinOneSigma_FlagsFifteenthWithPattern()
    {
        double[] z = [1.0, -1.0, 0, 0.5, -0.5, 1.0, 0.9, -0.9, 0.1, -0.1, 0.3, 1.0, -1.0, 0.2, 0];
        var signals = SignalsOf(RunRule.N7, z);
        var signal = Assert.Single(signals);
        Assert.Equal(14, signal.Index);
        Assert.Equal(Range(0, 15), signal.Pattern);
    }

    // docs/statistics.md §3.2: one point beyond 1 sigma ends the run.
    [Fact]
    public void N7_PointBeyondOneSigma_EndsRun()
    {
        double[] z = [1.0, -1.0, 0, 0.5, -0.5, 1.0, 0.9, 1.01, 0.1, -0.1, 0.3, 1.0, -1.0, 0.2, 0];
        Assert.Empty(FlagsOf(RunRule.N7, z));
    }

    // docs/statistics.md §3.3 item 4 for N7: sixteen in a row flag the 15th and 16th.
    [Fact]
    public void N7_SixteenWithin_FlagsLastTwo() => Assert.Equal([14, 15], FlagsOf(RunRule.N7, Repeat(0.3, 16)));

    // docs/statistics.md §3.2: N8, eight in a row beyond 1 sigma on both sides; pattern the eight points.
    [Fact]
    public void N8_EightBeyondOneSigmaBothSides_FlagsEighthWithPattern()
    {
        var z = Enumerable.Range(0, 8).Select(i => i % 2 == 0 ? 1.5 : -1.5).ToArray();
        var signals = SignalsOf(RunRule.N8, z);
        var signal = Assert.Single(signals);
        Assert.Equal(7, signal.Index);
        Assert.Equal(Range(0, 8), signal.Pattern);
    }

    // docs/statistics.md §3.2: seven beyond then a zone-C point: no signal.
    [Fact]
    public void N8_SevenBeyond_NoFlag() =>
        Assert.Empty(FlagsOf(RunRule.N8, 1.5, -1.5, 2.5, -3.5, 1.1, -1.1, 2, 0.5, 1.5));

    private static void AssertSameSignals(RuleEvaluation result, RunRule a, RunRule b)
    {
        var sa = result.Signals.Where(s => s.Rule == a).ToArray();
        var sb = result.Signals.Where(s => s.Rule == b).ToArray();
        Assert.Equal(sa.Length, sb.Length);
        for (var i = 0; i < sa.Length; i++)
        {
            Assert.Equal(sa[i].Index, sb[i].Index);
            Assert.Equal(sa[i].Pattern, sb[i].Pattern);
        }
    }
}
