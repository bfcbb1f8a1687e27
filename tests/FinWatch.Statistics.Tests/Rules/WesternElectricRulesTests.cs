using FinWatch.Statistics.Rules;
using static FinWatch.Statistics.Tests.Rules.RuleTestHelpers;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// Hand-built series for the Western Electric zone rules. Source of each rule: Montgomery &amp; Runger's restatement
/// of the Western Electric (1956) rules, via docs/statistics.md §3.1; the edge readings cite docs/statistics.md §3.3 by item number.
/// z-scores are used as plotted values (CL 0, sigma 1).
/// </summary>
public class WesternElectricRulesTests
{
    // Montgomery & Runger rule 1: one point outside the 3-sigma limits.
    [Fact]
    public void WE1_PointBeyondUpperLimit_FlagsThatPointOnly()
    {
        var signals = SignalsOf(RunRule.WE1, 0.5, 3.01, -0.2);
        var signal = Assert.Single(signals);
        Assert.Equal(1, signal.Index);
        Assert.Equal([1], signal.Pattern);
    }

    // Montgomery & Runger rule 1, lower limit.
    [Fact]
    public void WE1_PointBeyondLowerLimit_FlagsThatPoint() =>
        Assert.Equal([1], FlagsOf(RunRule.WE1, -0.1, -3.5, 2.9));

    // Montgomery & Runger rule 1: points inside the limits (zones A, B, C) do not signal.
    [Fact]
    public void WE1_PointsInsideLimits_NoFlags() =>
        Assert.Empty(FlagsOf(RunRule.WE1, 2.99, -2.99, 0, 1.5, -2.5));

    // Montgomery & Runger rule 2: two of three consecutive points beyond a 2-sigma limit; docs/statistics.md §3.3 item 4: the
    // completing point is flagged and the pattern is the two beyond points.
    [Fact]
    public void WE2_TwoOfThreeBeyondUpperTwoSigma_FlagsCompletingPointWithPattern()
    {
        var signals = SignalsOf(RunRule.WE2, 0, 2.5, 0.3, 2.1);
        var signal = Assert.Single(signals);
        Assert.Equal(3, signal.Index);
        Assert.Equal([1, 3], signal.Pattern);
    }

    // Montgomery & Runger rule 2, lower side.
    [Fact]
    public void WE2_TwoOfThreeBeyondLowerTwoSigma_Flags()
    {
        var signals = SignalsOf(RunRule.WE2, -2.1, 0, -2.9);
        Assert.Equal([0, 2], PatternAt(signals, 2));
        Assert.Single(signals);
    }

    // Montgomery & Runger rule 2: the window is three consecutive points; beyond points three apart do not signal.
    [Fact]
    public void WE2_BeyondPointsOutsideOneWindow_NoFlag() =>
        Assert.Empty(FlagsOf(RunRule.WE2, 2.5, 0, 0, 2.5));

    // Montgomery & Runger rule 2 with docs/statistics.md §3.3 item 4: three in a row beyond flags the 2nd and the 3rd; the 3rd's
    // pattern holds all three beyond points of its window.
    [Fact]
    public void WE2_ThreeConsecutiveBeyond_FlagsSecondAndThird()
    {
        var signals = SignalsOf(RunRule.WE2, 2.1, 2.2, 2.3);
        Assert.Equal([1, 2], signals.Select(s => s.Index));
        Assert.Equal([0, 1, 2], PatternAt(signals, 2));
    }

    // Montgomery & Runger rule 2: a point beyond 3 sigma is also beyond the 2-sigma limit.
    [Fact]
    public void WE2_PointBeyondThreeSigma_CountsAsBeyondTwoSigma() =>
        Assert.Equal([1], FlagsOf(RunRule.WE2, 3.5, 2.1));

    // Montgomery & Runger: "a point above the upper 2-sigma limit followed immediately by a point below the lower
    // 2-sigma limit would not signal".
    [Fact]
    public void WE2_AboveThenBelowTwoSigma_NoSignal() =>
        Assert.Empty(FlagsOf(RunRule.WE2, -2.5, 2.5, 0, -2.5));

    // Montgomery & Runger rule 3: four of five consecutive points beyond 1 sigma on one side.
    [Fact]
    public void WE3_FourOfFiveBeyondUpperOneSigma_FlagsCompletingPointWithPattern()
    {
        var signals = SignalsOf(RunRule.WE3, 0.2, 1.5, 1.2, 0.4, 1.1, 1.9);
        var signal = Assert.Single(signals);
        Assert.Equal(5, signal.Index);
        Assert.Equal([1, 2, 4, 5], signal.Pattern);
    }

    // Montgomery & Runger rule 3, lower side (the 4th point completes only three of four, the 5th four of five).
    [Fact]
    public void WE3_FourOfFiveBeyondLowerOneSigma_Flags()
    {
        var signals = SignalsOf(RunRule.WE3, -1.2, -1.3, -0.2, -1.4, -1.5);
        Assert.Equal([0, 1, 3, 4], PatternAt(signals, 4));
        Assert.Single(signals);
    }

    // Montgomery & Runger rule 3: three of five is not enough.
    [Fact]
    public void WE3_ThreeOfFive_NoFlag() =>
        Assert.Empty(FlagsOf(RunRule.WE3, 1.5, 0, 1.5, 0, 1.5, 0, 1.5));

    // Montgomery & Runger rule 3 with docs/statistics.md §3.3 items 4 and 5: six beyond in a row flag the 4th (four of the first
    // four), 5th and 6th; the 6th's pattern is its whole window.
    [Fact]
    public void WE3_SixConsecutiveBeyond_FlagsFourthFifthSixth()
    {
        var signals = SignalsOf(RunRule.WE3, Repeat(1.5, 6));
        Assert.Equal([3, 4, 5], signals.Select(s => s.Index));
        Assert.Equal([1, 2, 3, 4, 5], PatternAt(signals, 5));
    }

    // Montgomery & Runger rule 4: eight consecutive points on one side; docs/statistics.md §3.3 item 4: a run of 10 flags the
    // 8th, 9th and 10th points, each with the last eight points as its pattern.
    [Fact]
    public void WE4_RunOfTenAbove_FlagsEighthNinthTenth()
    {
        var signals = SignalsOf(RunRule.WE4, Concat(Repeat(0.5, 10), [-0.5]));
        Assert.Equal([7, 8, 9], signals.Select(s => s.Index));
        Assert.Equal(Range(0, 8), PatternAt(signals, 7));
        Assert.Equal(Range(2, 8), PatternAt(signals, 9));
    }

    // Montgomery & Runger rule 4: seven on one side, a crossing, seven again: no run of eight.
    [Fact]
    public void WE4_RunsOfSevenSeparatedByCrossing_NoFlag() =>
        Assert.Empty(FlagsOf(RunRule.WE4, Concat(Repeat(0.5, 7), [-0.5], Repeat(0.5, 7))));

    // Montgomery & Runger rule 4, lower side, points of any distance from the centre line.
    [Fact]
    public void WE4_EightBelowAtAnyDistance_FlagsEighth() =>
        Assert.Equal([7], FlagsOf(RunRule.WE4, -0.1, -2.5, -3.5, -0.01, -1, -2, -1.5, -0.2));
}
