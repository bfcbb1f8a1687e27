using FinWatch.Statistics.Rules;
using static FinWatch.Statistics.Tests.Rules.RuleTestHelpers;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// The edge conventions of docs/statistics.md §3.3, items 1–10, one group of hand-built series per item (the item number is in
/// each test's comment). z-scores are used as plotted values (CL 0, sigma 1) unless values are given.
/// </summary>
public class EdgeConventionTests
{
    private const double Nan = double.NaN;

    // §3.3 item 1: beyond is strict; a point exactly on the 3-sigma limit is not out of control.
    [Fact]
    public void Item1_PointsExactlyOnThreeSigmaLimits_NotBeyond() =>
        Assert.Empty(FlagsOf(RunRule.WE1, 3.0, -3.0, 0, 3.0));

    // §3.3 item 1: a point exactly on the 3-sigma line is in zone A, so it counts as beyond 2 sigma for WE2.
    [Fact]
    public void Item1_PointsOnThreeSigmaLine_CountForTwoOfThree()
    {
        var result = RunRuleEvaluation.Evaluate([3.0, 3.0], [3.0, 3.0], [RunRule.WE1, RunRule.WE2]);
        Assert.Empty(result.Flags[RunRule.WE1]!);
        Assert.Equal([1], result.Flags[RunRule.WE2]!);
    }

    // §3.3 item 1: points on the 2-sigma line are in zone B, not beyond 2 sigma; a point just beyond is.
    [Fact]
    public void Item1_PointsOnTwoSigmaLine_NotBeyondTwoSigma()
    {
        Assert.Empty(FlagsOf(RunRule.WE2, 2.0, 2.0, 2.0, -2.0, -2.0));
        Assert.Equal([2], FlagsOf(RunRule.WE2, 2.0, 2.5, 2.0001));
    }

    // §3.3 item 1: points on the 1-sigma line are in zone C: not beyond for WE3 and N8, within for N7.
    [Fact]
    public void Item1_PointsOnOneSigmaLine_InZoneC()
    {
        Assert.Empty(FlagsOf(RunRule.WE3, 1.0, 1.0, 1.0, 1.0, 1.0, -1.0, -1.0, -1.0, -1.0));
        Assert.Empty(FlagsOf(RunRule.WE3, 1.5, 1.0, 1.5, 1.5, 1.0));
        Assert.Equal([3], FlagsOf(RunRule.WE3, 1.5, 1.01, 1.5, 1.5, 1.0));
        Assert.Empty(FlagsOf(RunRule.N8, 1.5, -1.5, 1.5, -1.5, 1.0, 1.5, -1.5, 1.5, -1.5));
        Assert.Equal([14], FlagsOf(RunRule.N7, Repeat(1.0, 15)));
    }

    // §3.3 item 2: a point exactly on the centre line is on neither side and ends a same-side run (WE4).
    [Fact]
    public void Item2_CentreLinePoint_EndsWE4Run()
    {
        Assert.Empty(FlagsOf(RunRule.WE4, Concat(Repeat(0.5, 4), [0.0], Repeat(0.5, 4))));
        Assert.Equal([7, 8], FlagsOf(RunRule.WE4, Concat(Repeat(0.5, 4), [0.1], Repeat(0.5, 4))));
    }

    // §3.3 item 2 for N2, and negative zero is on the centre line too.
    [Fact]
    public void Item2_CentreLinePoint_EndsN2Run()
    {
        Assert.Empty(FlagsOf(RunRule.N2, Concat(Repeat(-0.5, 5), [0.0], Repeat(-0.5, 5))));
        Assert.Empty(FlagsOf(RunRule.N2, Concat(Repeat(-0.5, 5), [-0.0], Repeat(-0.5, 5))));
        Assert.Equal([8, 9, 10], FlagsOf(RunRule.N2, Concat(Repeat(-0.5, 5), [-0.1], Repeat(-0.5, 5))));
    }

    // §3.3 item 2: the centre-line point is in zone C for N7 (it is |z| ≤ 1) and ends nothing there.
    [Fact]
    public void Item2_CentreLinePoint_CountsWithinZoneCForN7() =>
        Assert.Equal([14], FlagsOf(RunRule.N7, Concat(Repeat(0.5, 7), [0.0], Repeat(-0.5, 7))));

    // §3.3 item 3 (Montgomery & Runger): (+2.5σ, −2.4σ, +2.2σ) signals WE2 at the third point.
    [Fact]
    public void Item3_OddPointBeyondOtherSide_SignalsWE2()
    {
        var signal = Assert.Single(SignalsOf(RunRule.WE2, 2.5, -2.4, 2.2));
        Assert.Equal(2, signal.Index);
        Assert.Equal([0, 2], signal.Pattern);
    }

    // §3.3 item 3 (Montgomery & Runger): (+2.5σ, −2.5σ) does not signal.
    [Fact]
    public void Item3_AboveThenBelow_DoesNotSignalWE2() => Assert.Empty(FlagsOf(RunRule.WE2, 2.5, -2.5));

    // §3.3 item 3 for 4-of-5: the odd point may be beyond on the other side.
    [Fact]
    public void Item3_OddPointBeyondOtherSide_SignalsWE3()
    {
        var signal = Assert.Single(SignalsOf(RunRule.WE3, 1.5, 1.5, -2.5, 1.5, 1.5));
        Assert.Equal(4, signal.Index);
        Assert.Equal([0, 1, 3, 4], signal.Pattern);
    }

    // §3.3 item 3: one-sided counting — two up and two down in five is no signal on either side.
    [Fact]
    public void Item3_BeyondOnBothSides_NotPooled() =>
        Assert.Empty(FlagsOf(RunRule.WE3, 1.5, -1.5, 1.5, -1.5, 1.5, -1.5));

    // §3.3 item 4: (b, b, b, b, inside) flags the 4th point, not the inside one.
    [Fact]
    public void Item4_FourBeyondThenInside_FlagsFourth()
    {
        var signal = Assert.Single(SignalsOf(RunRule.WE3, 1.5, 1.5, 1.5, 1.5, 0.5));
        Assert.Equal(3, signal.Index);
        Assert.Equal([0, 1, 2, 3], signal.Pattern);
    }

    // §3.3 item 4 for 2-of-3: (b, b, inside) flags the 2nd; (b, inside, b) flags the 3rd.
    [Fact]
    public void Item4_TwoOfThree_FlagsOnlyParticipatingPoint()
    {
        Assert.Equal([1], FlagsOf(RunRule.WE2, 2.5, 2.5, 0.1));
        Assert.Equal([2], FlagsOf(RunRule.WE2, 2.5, 0.1, 2.5));
    }

    // §3.3 item 4 for run rules: a run of 10 on one side flags the 9th and 10th under N2, the 8th–10th under WE4.
    [Fact]
    public void Item4_RunOfTen_FlagsEveryPointEndingARunOfRequiredLength()
    {
        var z = Concat(Repeat(0.7, 10), [-0.7]);
        var result = RunRuleEvaluation.Evaluate(z, z, [RunRule.WE4, RunRule.N2]);
        Assert.Equal([7, 8, 9], result.Flags[RunRule.WE4]!);
        Assert.Equal([8, 9], result.Flags[RunRule.N2]!);
    }

    // §3.3 item 5: windows are truncated at the start: beyond-2σ points at positions 0 and 1 signal WE2.
    [Fact]
    public void Item5_BeyondTwoSigmaAtPositionsZeroAndOne_SignalsWE2()
    {
        var signal = Assert.Single(SignalsOf(RunRule.WE2, 2.5, 2.1));
        Assert.Equal(1, signal.Index);
        Assert.Equal([0, 1], signal.Pattern);
    }

    // §3.3 item 5 for 4-of-5: four beyond 1σ at positions 0–3 signal at position 3; one point alone never signals WE2.
    [Fact]
    public void Item5_TruncatedWindows_AtStart()
    {
        Assert.Equal([3], FlagsOf(RunRule.WE3, 1.5, 1.5, 1.5, 1.5));
        Assert.Empty(FlagsOf(RunRule.WE3, 1.5, 1.5, 1.5));
        Assert.Empty(FlagsOf(RunRule.WE2, 2.5));
    }

    // §3.3 item 6: a tie ends a trend (N3 needs strict increases): 1,2,3,3,4,5,6 has no five successive increases.
    [Fact]
    public void Item6_TieEndsTrend()
    {
        Assert.Empty(FlagsOf(RunRule.N3, [1, 2, 3, 3, 4, 5, 6], Repeat(0, 7)));
        Assert.Equal([8], FlagsOf(RunRule.N3, [1, 2, 3, 3, 4, 5, 6, 7, 8], Repeat(0, 9)));
    }

    // §3.3 item 6: a zero difference ends an alternation (N4); fourteen points = thirteen differences.
    [Fact]
    public void Item6_ZeroDifferenceEndsAlternation()
    {
        double[] values = [0, 1, 0, 1, 0, 1, 0, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1, 0, 1];
        var flags = FlagsOf(RunRule.N4, values, Repeat(0, values.Length));
        // Differences 1..6 alternate, difference 7 is zero, differences 8..20 are thirteen alternating ones.
        Assert.Equal([20], flags);
    }

    // §3.3 item 7: N8 does not require both sides (|z| > 1 for 8 in a row, all above).
    [Fact]
    public void Item7_EightBeyondOneSigmaOnOneSide_SignalsN8() =>
        Assert.Equal([7], FlagsOf(RunRule.N8, 1.5, 2.5, 1.1, 3.5, 1.2, 1.9, 2.0, 1.01));

    // §3.3 item 8: missing values are skipped; "consecutive" means consecutive non-missing; indices are the input's.
    [Fact]
    public void Item8_MissingBetweenTwoBeyondPoints_SignalsWE2WithInputIndices()
    {
        var signal = Assert.Single(SignalsOf(RunRule.WE2, 2.5, Nan, Nan, 2.5));
        Assert.Equal(3, signal.Index);
        Assert.Equal([0, 3], signal.Pattern);
    }

    // §3.3 item 8: a missing row neither ends a run nor counts in it (WE4 over a gap).
    [Fact]
    public void Item8_MissingInsideRun_SkippedByWE4()
    {
        var signal = Assert.Single(SignalsOf(RunRule.WE4, Concat(Repeat(0.5, 4), [Nan], Repeat(0.5, 4))));
        Assert.Equal(8, signal.Index);
        Assert.Equal([0, 1, 2, 3, 5, 6, 7, 8], signal.Pattern);
    }

    // §3.3 item 8: a trend is taken across a gap (N3), with input indices.
    [Fact]
    public void Item8_MissingInsideTrend_SkippedByN3()
    {
        var signal = Assert.Single(SignalsOf(RunRule.N3, [1, 2, Nan, 3, 4, 5, 6], Repeat(0, 7)));
        Assert.Equal(6, signal.Index);
        Assert.Equal([0, 1, 3, 4, 5, 6], signal.Pattern);
    }

    // §3.3 item 8: WE1 reports the input index after leading missing rows.
    [Fact]
    public void Item8_LeadingMissingRows_IndicesAreTheInputs() =>
        Assert.Equal([2], FlagsOf(RunRule.WE1, Nan, Nan, 3.5, Nan));

    // §3.3 item 9: sigma_point = 0 (every z NaN): zone rules are not evaluable (null, not empty); N3 and N4 are still
    // evaluated (here empty on constant data).
    [Fact]
    public void Item9_ConstantData_ZoneRulesNullTrendRulesEvaluated()
    {
        var values = Repeat(5.0, 20);
        var result = RunRuleEvaluation.Evaluate(values, NaNs(20), RunRules.Nelson.Concat(RunRules.WesternElectric));
        foreach (var rule in result.Flags.Keys)
        {
            if (RunRules.IsZoneRule(rule))
            {
                Assert.Null(result.Flags[rule]);
            }
            else
            {
                Assert.NotNull(result.Flags[rule]);
                Assert.Empty(result.Flags[rule]!);
            }

            Assert.Null(result.First[rule]);
        }

        Assert.Equal(12, result.Flags.Count);
        Assert.Empty(result.Signals);
    }

    // §3.3 item 9: with every z NaN, N3 still finds a trend in the values.
    [Fact]
    public void Item9_NoZoneEvaluable_N3StillSignals()
    {
        var result = RunRuleEvaluation.Evaluate([1, 2, 3, 4, 5, 6], NaNs(6), [RunRule.N3, RunRule.WE4]);
        Assert.Equal([5], result.Flags[RunRule.N3]!);
        Assert.Equal(5, result.First[RunRule.N3]);
        Assert.Null(result.Flags[RunRule.WE4]);
    }

    // §3.3 item 10: the secondary chart gets the beyond-limits test only — asking for WE1 alone reports WE1 alone,
    // although the series would also signal WE2, WE3 and WE4.
    [Fact]
    public void Item10_BeyondLimitsOnly_ReportsOnlyWE1()
    {
        var z = Concat(Repeat(2.5, 9), [3.5]);
        var result = RunRuleEvaluation.Evaluate(z, z, [RunRule.WE1]);
        Assert.Equal([RunRule.WE1], result.Flags.Keys);
        Assert.Equal([9], result.Flags[RunRule.WE1]!);
        Assert.All(result.Signals, s => Assert.Equal(RunRule.WE1, s.Rule));
        Assert.Single(result.Signals);
    }
}
