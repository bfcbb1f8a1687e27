using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// The incremental evaluator: signals raised on the point that completes them, argument checks, counts, and the
/// FinWatch convention for a NaN z (the zone rules skip the point as if missing; N3/N4 still use its value),
/// which extends docs/statistics.md §3.3 items 8 and 9.
/// </summary>
public class RunRuleEvaluatorTests
{
    private static readonly RunRule[] All = Enum.GetValues<RunRule>();

    // docs/statistics.md §3.3 item 4: the signal arrives with the point that completes the pattern, not before.
    [Fact]
    public void Append_TwoOfThree_SignalRaisedOnCompletingPoint()
    {
        var evaluator = new RunRuleEvaluator([RunRule.WE2]);
        var signals = new List<RuleSignal>();
        evaluator.Append(10, 2.5, 2.5, signals);
        Assert.Empty(signals);
        evaluator.Append(11, 0.1, 0.1, signals);
        Assert.Empty(signals);
        evaluator.Append(12, 2.2, 2.2, signals);
        var signal = Assert.Single(signals);
        Assert.Equal(new RuleSignal(RunRule.WE2, 12, signal.Pattern), signal);
        Assert.Equal([10, 12], signal.Pattern);
    }

    // Reported indices are the caller's, however sparse (docs/statistics.md §3.3 item 8).
    [Fact]
    public void Append_SparseIndices_ReportedUnchanged()
    {
        var evaluator = new RunRuleEvaluator([RunRule.WE4]);
        var signals = new List<RuleSignal>();
        for (var i = 0; i < 8; i++)
        {
            evaluator.Append(i * 7, -0.3, -0.3, signals);
        }

        var signal = Assert.Single(signals);
        Assert.Equal(49, signal.Index);
        Assert.Equal([0, 7, 14, 21, 28, 35, 42, 49], signal.Pattern);
    }

    // With a null collection the state still advances, so later signals see the earlier points.
    [Fact]
    public void Append_NullSignals_StateStillUpdated()
    {
        var evaluator = new RunRuleEvaluator([RunRule.WE2]);
        evaluator.Append(0, 2.5, 2.5, null);
        evaluator.Append(1, 2.5, 2.5, null);
        var signals = new List<RuleSignal>();
        evaluator.Append(2, 2.5, 2.5, signals);
        Assert.Equal([0, 1, 2], Assert.Single(signals).Pattern);
        Assert.Equal(3, evaluator.Count);
    }

    // Several rules completed by one point are reported in RunRule order.
    [Fact]
    public void Append_SeveralRulesOnOnePoint_ReportedInRuleOrder()
    {
        var evaluator = new RunRuleEvaluator([RunRule.N5, RunRule.N1, RunRule.WE2, RunRule.WE1]);
        var signals = new List<RuleSignal>();
        evaluator.Append(0, 2.5, 2.5, signals);
        evaluator.Append(1, 3.5, 3.5, signals);
        Assert.Equal([RunRule.WE1, RunRule.WE2, RunRule.N1, RunRule.N5], signals.Select(s => s.Rule));
        Assert.All(signals, s => Assert.Equal(1, s.Index));
    }

    // Convention for NaN z: zone windows skip the point, as if it were missing.
    [Fact]
    public void Append_NaNZInsideWindow_ZoneRulesSkipIt()
    {
        var result = RunRuleEvaluation.Evaluate([2.5, 9.0, 9.0, 2.5], [2.5, double.NaN, double.NaN, 2.5], [RunRule.WE2]);
        var signal = Assert.Single(result.Signals);
        Assert.Equal(3, signal.Index);
        Assert.Equal([0, 3], signal.Pattern);
    }

    // Convention for NaN z: a NaN-z point neither ends nor extends a same-side run.
    [Fact]
    public void Append_NaNZInsideRun_RunContinuesWithoutIt()
    {
        double[] values = [1, 1, 1, 1, 0, 1, 1, 1, 1];
        double[] z = [1, 1, 1, 1, double.NaN, 1, 1, 1, 1];
        var signal = Assert.Single(RunRuleEvaluation.Evaluate(values, z, [RunRule.WE4]).Signals);
        Assert.Equal(8, signal.Index);
        Assert.Equal([0, 1, 2, 3, 5, 6, 7, 8], signal.Pattern);
    }

    // Convention for NaN z: N3 and N4 still use the value of a NaN-z point.
    [Fact]
    public void Append_NaNZPoint_StillInTrend()
    {
        double[] values = [1, 2, 3, 4, 5, 6];
        double[] z = [0.1, 0.2, double.NaN, 0.4, 0.5, 0.6];
        var result = RunRuleEvaluation.Evaluate(values, z, [RunRule.N3]);
        Assert.Equal([0, 1, 2, 3, 4, 5], Assert.Single(result.Signals).Pattern);
    }

    // Convention for NaN z: one evaluable point makes the zone rules evaluable (empty list, not null).
    [Fact]
    public void Evaluate_SomeZFinite_ZoneFlagsNotNull()
    {
        var result = RunRuleEvaluation.Evaluate([1, 2, 3], [double.NaN, 0.5, double.NaN], All);
        Assert.All(result.Flags.Values, f => Assert.NotNull(f));
    }

    [Fact]
    public void Count_MixedZ_CountsAppendedAndZoneEvaluablePoints()
    {
        var evaluator = new RunRuleEvaluator(All);
        evaluator.Append(0, 1, double.NaN, null);
        evaluator.Append(3, 1, 0.5, null);
        evaluator.Append(4, 1, double.NaN, null);
        Assert.Equal(3, evaluator.Count);
        Assert.Equal(1, evaluator.ZoneCount);
    }

    [Fact]
    public void Constructor_DuplicateRules_SetHoldsEachOnce()
    {
        var evaluator = new RunRuleEvaluator([RunRule.N7, RunRule.WE1, RunRule.N7]);
        Assert.Equal(2, evaluator.Rules.Count);
        Assert.True(evaluator.Rules.SetEquals([RunRule.WE1, RunRule.N7]));
    }

    [Fact]
    public void Constructor_UndefinedRule_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => new RunRuleEvaluator([RunRule.WE1, (RunRule)99]));

    [Fact]
    public void Append_NonIncreasingOrNegativeIndex_Throws()
    {
        var evaluator = new RunRuleEvaluator(All);
        Assert.Throws<ArgumentOutOfRangeException>(() => evaluator.Append(-1, 0, 0, null));
        evaluator.Append(5, 0, 0, null);
        Assert.Throws<ArgumentOutOfRangeException>(() => evaluator.Append(5, 0, 0, null));
        Assert.Throws<ArgumentOutOfRangeException>(() => evaluator.Append(4, 0, 0, null));
        Assert.Equal(1, evaluator.Count);
    }

    [Theory]
    [InlineData(double.NaN, 0.0)]
    [InlineData(double.PositiveInfinity, 0.0)]
    [InlineData(1.0, double.NegativeInfinity)]
    [InlineData(1.0, double.PositiveInfinity)]
    public void Append_NonFiniteValueOrInfiniteZ_Throws(double value, double z)
    {
        var evaluator = new RunRuleEvaluator(All);
        Assert.Throws<ArgumentOutOfRangeException>(() => evaluator.Append(0, value, z, null));
        Assert.Equal(0, evaluator.Count);
    }

    [Fact]
    public void Evaluate_LengthMismatch_Throws() =>
        Assert.Throws<ArgumentException>(() => RunRuleEvaluation.Evaluate([1, 2], [1], All));

    // A missing row (value NaN) is skipped before its z is looked at, so its z may be anything.
    [Fact]
    public void Evaluate_MissingRowWithInfiniteZ_Ignored()
    {
        var result = RunRuleEvaluation.Evaluate([3.5, double.NaN], [3.5, double.PositiveInfinity], [RunRule.WE1]);
        Assert.Equal([0], result.Flags[RunRule.WE1]!);
    }

    // An empty series: N3/N4 evaluated (empty), zone rules not evaluable (no point had a z).
    [Fact]
    public void Evaluate_EmptySeries_ZoneRulesNullTrendRulesEmpty()
    {
        var result = RunRuleEvaluation.Evaluate([], [], All);
        Assert.Equal(12, result.Flags.Count);
        Assert.All(result.Flags, kv => Assert.Equal(RunRules.IsZoneRule(kv.Key), kv.Value is null));
        Assert.Empty(result.Signals);
    }

    [Fact]
    public void Evaluate_First_IsFirstFlaggedIndexOrNull()
    {
        double[] z = [0.5, 3.5, 0.5, -3.5];
        var result = RunRuleEvaluation.Evaluate(z, z, [RunRule.WE1, RunRule.WE2]);
        Assert.Equal(1, result.First[RunRule.WE1]);
        Assert.Null(result.First[RunRule.WE2]);
        Assert.Equal([RunRule.WE1, RunRule.WE2], result.First.Keys.Order());
    }

    // Signals are ordered by point, then by rule.
    [Fact]
    public void Evaluate_Signals_OrderedByPointThenRule()
    {
        var z = Enumerable.Repeat(2.5, 10).ToArray();
        var result = RunRuleEvaluation.Evaluate(z, z, All);
        for (var i = 1; i < result.Signals.Count; i++)
        {
            var (a, b) = (result.Signals[i - 1], result.Signals[i]);
            Assert.True(a.Index < b.Index || (a.Index == b.Index && a.Rule < b.Rule));
        }

        Assert.Equal([1, 2, 3, 4, 5, 6, 7, 8, 9], result.Flags[RunRule.WE2]!);
        Assert.Equal([7, 8, 9], result.Flags[RunRule.N8]!);
    }
}
