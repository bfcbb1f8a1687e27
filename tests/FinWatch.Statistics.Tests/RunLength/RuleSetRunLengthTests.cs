using FinWatch.Statistics.Rules;
using FinWatch.Statistics.RunLength;
using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Tests.RunLength;

/// <summary>
/// Run lengths of any rule set (docs/statistics.md §4.5): the chain extended to N2 and the Nelson names of the Western
/// Electric rules, the seeded simulation through the monitor's rule evaluator, and the choice between them.
/// </summary>
public class RuleSetRunLengthTests
{
    private const int Seed = 4242;

    /// <summary>
    /// Expected waiting time for a run of r consecutive successes of probability p (Feller, An Introduction to
    /// Probability Theory and Its Applications, vol. 1, ch. XIII, recurrent events: run of successes; formula from
    /// memory [M], and it gives the chain's 255 = 2⁸ − 1 for WE4 alone, pinned in AverageRunLengthTests).
    /// </summary>
    private static double RunOfSuccesses(double p, int r) => (1 - Math.Pow(p, r)) / ((1 - p) * Math.Pow(p, r));

    // N2 alone in control: a run of 9 points on one side. The first point opens a run on its side, then 8 matches of
    // probability ½ are needed: 1 + RunOfSuccesses(½, 8) = 2⁹ − 1 = 511 (Feller, vol. 1, ch. XIII [M]).
    [Fact]
    public void ShewhartWithRunRules_NelsonTwoAloneInControl_Is511()
    {
        Assert.Equal(511, AverageRunLength.ShewhartWithRunRules([RunRule.N2], 0), 1e-9);
        Assert.Equal(511, 1 + RunOfSuccesses(0.5, 8), 1e-9); // the same number from the formula, as a check of the comment
    }

    // Out of control a run on the shifted side has p = Φ(δ) per point and one on the other side 1 − Φ(δ); the chain must
    // agree with the seeded simulation through the monitor's evaluator within 3 standard errors (internal consistency).
    [Theory]
    [InlineData(0.0)]
    [InlineData(1.0)]
    public void Simulation_NelsonTwoAlone_AgreesWithChainWithinThreeStandardErrors(double shift)
    {
        var exact = AverageRunLength.ShewhartWithRunRules([RunRule.N2], shift);

        var simulated = RunLengthSimulation.AverageRunLength([RunRule.N2], shift, Seed);

        Assert.InRange(exact, simulated.Points - (3 * simulated.StandardError), simulated.Points + (3 * simulated.StandardError));
    }

    // Nelson's tests 1, 5 and 6 flag the points WE1, WE2 and WE3 flag (docs/statistics.md §3.2), so their ARL is Champ &
    // Woodall's (1987) 132.89 for rules 1 + 2 + 3 (value from memory [M], reproduced by the chain).
    [Fact]
    public void ShewhartWithRunRules_NelsonOneFiveSix_EqualChampWoodallRulesOneToThree()
    {
        Assert.Equal(132.89, AverageRunLength.ShewhartWithRunRules([RunRule.N1, RunRule.N5, RunRule.N6], 0), 0.005);
    }

    // With WE4 enabled N2 never signals first: a run of nine contains a run of eight that ended one point earlier.
    [Theory]
    [InlineData(0.0)]
    [InlineData(0.8)]
    public void ShewhartWithRunRules_NelsonTwoBesideWesternElectricFour_ChangesNothing(double shift)
    {
        Assert.Equal(
            AverageRunLength.ShewhartWithRunRules([RunRule.WE1, RunRule.WE4], shift),
            AverageRunLength.ShewhartWithRunRules([RunRule.WE1, RunRule.WE4, RunRule.N2], shift),
            1e-9);
    }

    // Internal consistency: the library's simulation (the monitor's evaluator on seeded normal points) against the exact
    // chain on Western Electric sets and N2 mixes, within 3 standard errors.
    [Theory]
    [InlineData(new[] { RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4 }, 0.0)]
    [InlineData(new[] { RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4 }, 1.0)]
    [InlineData(new[] { RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4 }, 2.0)]
    [InlineData(new[] { RunRule.WE1, RunRule.WE2 }, 0.0)]
    [InlineData(new[] { RunRule.WE3, RunRule.WE4 }, 0.5)]
    [InlineData(new[] { RunRule.N1, RunRule.N2, RunRule.N5, RunRule.N6 }, 0.0)]
    public void Simulation_ChainRuleSets_AgreesWithChainWithinThreeStandardErrors(RunRule[] rules, double shift)
    {
        var exact = AverageRunLength.ShewhartWithRunRules(rules, shift);

        var simulated = RunLengthSimulation.AverageRunLength(rules, shift, Seed);

        Assert.InRange(simulated.Runs, 8_000, RunLengthSimulation.DefaultMaxRuns); // 2·10⁶ points hold about 8 900 runs of 225 points
        Assert.InRange(simulated.StandardError, 1e-3 * exact, 0.02 * exact); // about ARL/√runs for a roughly geometric run length
        Assert.InRange(exact, simulated.Points - (3 * simulated.StandardError), simulated.Points + (3 * simulated.StandardError));
    }

    // N7 (15 in a row with |z| ≤ 1) and N8 (8 in a row with |z| > 1) alone are runs of successes with p = P(|z| ≤ 1) and
    // P(|z| > 1) under N(δ, 1): their ARL is RunOfSuccesses(p, r) (Feller, vol. 1, ch. XIII [M]); the simulation, the
    // only method the library has for them, must agree within 3 standard errors. In control N7 gives 964.7 and N8 about
    // 14 230 points (the latter simulated from a few hundred runs within the point budget).
    [Theory]
    [InlineData(RunRule.N7, 15, true, 0.0)]
    [InlineData(RunRule.N7, 15, true, 0.5)]
    [InlineData(RunRule.N8, 8, false, 0.0)]
    [InlineData(RunRule.N8, 8, false, 2.0)]
    public void Simulation_ZoneRunRule_AgreesWithRunOfSuccessesFormula(RunRule rule, int length, bool inside, double shift)
    {
        var pInside = Normal.CDF(0, 1, 1 - shift) - Normal.CDF(0, 1, -1 - shift);
        var expected = RunOfSuccesses(inside ? pInside : 1 - pInside, length);

        var simulated = RunLengthSimulation.AverageRunLength([rule], shift, Seed);

        Assert.True(simulated.IsResolved);
        Assert.InRange(expected, simulated.Points - (3 * simulated.StandardError), simulated.Points + (3 * simulated.StandardError));
    }

    [Fact]
    public void Simulation_SameSeed_GivesTheSameNumbers_AnotherSeedOthers()
    {
        RunRule[] rules = [RunRule.N1, RunRule.N3, RunRule.N4];

        var first = RunLengthSimulation.AverageRunLength(rules, 0.5, Seed, maxRuns: 2_000);
        var again = RunLengthSimulation.AverageRunLength(rules, 0.5, Seed, maxRuns: 2_000);
        var other = RunLengthSimulation.AverageRunLength(rules, 0.5, Seed + 1, maxRuns: 2_000);

        Assert.Equal(first, again);
        Assert.NotEqual(first.Points, other.Points);
    }

    // N7 alone cannot see a 2σ shift (the points leave zone C): its ARL is RunOfSuccesses(0.157, 15) ≈ 10¹² points, far
    // beyond any budget, so the simulation says it cannot resolve it instead of returning the few runs it finished.
    [Fact]
    public void Simulation_RuleThatAlmostNeverSignals_IsNotResolved()
    {
        var simulated = RunLengthSimulation.AverageRunLength([RunRule.N7], 2.0, Seed, pointBudget: 100_000);

        Assert.False(simulated.IsResolved);
        Assert.Equal(double.PositiveInfinity, simulated.Points);
        Assert.True(double.IsNaN(simulated.StandardError));
        Assert.True(simulated.Runs < RunLengthSimulation.MinRuns);
    }

    [Fact]
    public void Simulation_BudgetStopsEarly_WithFewerRunsAndALargerStandardError()
    {
        var simulated = RunLengthSimulation.AverageRunLength([RunRule.N8], 0, Seed, pointBudget: 1_000_000);

        Assert.InRange(simulated.Runs, RunLengthSimulation.MinRuns, 200); // ARL ≈ 14 230: about 70 runs fit in 10⁶ points
        Assert.True(simulated.StandardError > 0.05 * simulated.Points);
    }

    [Fact]
    public void Estimate_ChainRuleSet_IsExactWithZeroStandardError()
    {
        var estimate = RuleSetRunLength.Estimate([RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4], 0);

        Assert.Equal(RunLengthMethod.MarkovChain, estimate.Method);
        Assert.Equal(AverageRunLength.ShewhartWithRules(["WE1", "WE2", "WE3", "WE4"], 0), estimate.Points, 1e-9);
        Assert.Equal(0, estimate.StandardError);
        Assert.True(RuleSetRunLength.IsExact([RunRule.N1, RunRule.N2]));
    }

    [Fact]
    public void Estimate_TrendOrAlternationRule_IsSimulatedWithTheFixedSeed()
    {
        RunRule[] nelson = [RunRule.N1, RunRule.N2, RunRule.N3, RunRule.N4, RunRule.N5, RunRule.N6, RunRule.N7, RunRule.N8];

        var estimate = RuleSetRunLength.Estimate(nelson, 1.0);

        Assert.Equal(RunLengthMethod.Simulation, estimate.Method);
        Assert.False(RuleSetRunLength.IsExact(nelson));
        Assert.Equal(RunLengthSimulation.AverageRunLength(nelson, 1.0, RuleSetRunLength.Seed), estimate);
    }

    // N1 flags what WE1 flags, so both spellings share one cached answer (the simulation of a mix included).
    [Fact]
    public void Estimate_NelsonAndWesternElectricSpellings_GiveTheSameAnswer()
    {
        Assert.Equal(RuleSetRunLength.Estimate([RunRule.WE1, RunRule.N3], 0), RuleSetRunLength.Estimate([RunRule.N1, RunRule.N3, RunRule.N3], 0));
    }

    [Fact]
    public void Estimate_InvalidArguments_Throw()
    {
        Assert.Throws<ArgumentException>(() => RuleSetRunLength.Estimate([], 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => RuleSetRunLength.Estimate([RunRule.WE1], double.NaN));
        Assert.Throws<ArgumentOutOfRangeException>(() => RuleSetRunLength.Estimate([(RunRule)99], 0));
        Assert.Throws<ArgumentException>(() => AverageRunLength.ShewhartWithRunRules([RunRule.WE1, RunRule.N3], 0));
        Assert.Throws<ArgumentOutOfRangeException>(() => RunLengthSimulation.AverageRunLength([RunRule.WE1], 0, Seed, maxRuns: 10));
    }
}
