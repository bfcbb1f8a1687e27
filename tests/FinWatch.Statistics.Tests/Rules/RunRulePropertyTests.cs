using FinWatch.Statistics.Rules;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// FsCheck properties over generated series (<see cref="RuleSeriesGenerators"/>): agreement with a naive transcription
/// of docs/statistics.md §3 (<see cref="RuleOracle"/>), incremental = batch, symmetry under negation, and invariance under inserted
/// missing rows (docs/statistics.md §3.3 item 8).
/// </summary>
public class RunRulePropertyTests
{
    private static readonly RunRule[] All = Enum.GetValues<RunRule>();

    // docs/statistics.md §3.1–3.3: the O(1) evaluator gives the same flags, patterns and null-ness as re-reading every window.
    [Property(MaxTest = 300)]
    public Property Evaluate_RandomSeries_MatchesNaiveOracle() =>
        Prop.ForAll(RuleSeriesGenerators.SeriesArb, s =>
        {
            var result = RunRuleEvaluation.Evaluate(s.Values, s.Z, s.Rules);
            Assert.Equal(s.Rules.Distinct().Order(), result.Flags.Keys.Order());
            foreach (var rule in s.Rules)
            {
                var expected = RuleOracle.Signals(s.Values, s.Z, rule);
                var flags = result.Flags[rule];
                if (expected is null)
                {
                    Assert.Null(flags);
                    continue;
                }

                Assert.NotNull(flags);
                Assert.Equal(expected.Select(e => e.Index), flags);
                var actual = result.Signals.Where(x => x.Rule == rule).ToArray();
                Assert.Equal(expected.Count, actual.Length);
                for (var i = 0; i < actual.Length; i++)
                {
                    Assert.Equal(expected[i].Pattern, actual[i].Pattern);
                }
            }
        });

    // Appending row by row to a RunRuleEvaluator gives exactly the batch result, signal for signal.
    [Property(MaxTest = 200)]
    public Property Append_RandomSeriesAndRules_EqualsBatch() =>
        Prop.ForAll(RuleSeriesGenerators.SeriesArb, s =>
        {
            var evaluator = new RunRuleEvaluator(s.Rules);
            var incremental = new List<RuleSignal>();
            var present = 0;
            for (var i = 0; i < s.Values.Length; i++)
            {
                if (!double.IsNaN(s.Values[i]))
                {
                    evaluator.Append(i, s.Values[i], s.Z[i], incremental);
                    present++;
                }
            }

            var batch = RunRuleEvaluation.Evaluate(s.Values, s.Z, s.Rules);
            Assert.Equal(present, evaluator.Count);
            AssertSameSignals(batch.Signals, incremental);
            foreach (var rule in s.Rules)
            {
                var flags = batch.Flags[rule];
                Assert.Equal(RunRules.IsZoneRule(rule) && evaluator.ZoneCount == 0, flags is null);
                if (flags is not null)
                {
                    Assert.Equal(incremental.Where(x => x.Rule == rule).Select(x => x.Index), flags);
                }
            }
        });

    // Every rule is symmetric about the centre line (one-sided rules apply to each side, trends up and down):
    // negating the series mirrors up and down, which leaves every flag and pattern unchanged.
    [Property(MaxTest = 200)]
    public Property Evaluate_NegatedSeries_MirrorsUpAndDownRules() =>
        Prop.ForAll(RuleSeriesGenerators.SeriesArb, s =>
        {
            var result = RunRuleEvaluation.Evaluate(s.Values, s.Z, All);
            var mirrored = RunRuleEvaluation.Evaluate(s.Values.Select(v => -v).ToArray(), s.Z.Select(v => -v).ToArray(), All);
            AssertSameSignals(result.Signals, mirrored.Signals);
            foreach (var rule in All)
            {
                Assert.Equal(result.Flags[rule], mirrored.Flags[rule]);
            }
        });

    // docs/statistics.md §3.3 item 8: inserting missing rows (whatever their z) shifts the reported indices and nothing else.
    [Property(MaxTest = 200)]
    public Property Evaluate_InsertedMissingRows_ShiftOnlyIndices() =>
        Prop.ForAll(
            RuleSeriesGenerators.Series.SelectMany(s => Gen.Choose(0, 2).ArrayOf(s.Values.Length + 1), (s, gaps) => (s, gaps)).ToArbitrary(),
            t =>
            {
                var (s, gaps) = t;
                var values = new List<double>();
                var z = new List<double>();
                var map = new int[s.Values.Length];
                for (var i = 0; i <= s.Values.Length; i++)
                {
                    for (var g = 0; g < gaps[i]; g++)
                    {
                        values.Add(double.NaN);
                        z.Add(g % 2 == 0 ? 3.7 : double.NaN);
                    }

                    if (i < s.Values.Length)
                    {
                        map[i] = values.Count;
                        values.Add(s.Values[i]);
                        z.Add(s.Z[i]);
                    }
                }

                var original = RunRuleEvaluation.Evaluate(s.Values, s.Z, All);
                var expanded = RunRuleEvaluation.Evaluate(values.ToArray(), z.ToArray(), All);
                var shifted = original.Signals
                    .Select(x => new RuleSignal(x.Rule, map[x.Index], x.Pattern.Select(i => map[i]).ToArray())).ToList();
                AssertSameSignals(shifted, expanded.Signals);
                foreach (var rule in All)
                {
                    Assert.Equal(original.Flags[rule]?.Select(i => map[i]), expanded.Flags[rule]);
                }
            });

    // docs/statistics.md §3.2: N1 = WE1, N5 = WE2, N6 = WE3 (same flags).
    [Property(MaxTest = 200)]
    public Property Evaluate_RandomSeries_NelsonAliasesEqualWesternElectric() =>
        Prop.ForAll(RuleSeriesGenerators.SeriesArb, s =>
        {
            var result = RunRuleEvaluation.Evaluate(s.Values, s.Z, All);
            Assert.Equal(result.Flags[RunRule.WE1], result.Flags[RunRule.N1]);
            Assert.Equal(result.Flags[RunRule.WE2], result.Flags[RunRule.N5]);
            Assert.Equal(result.Flags[RunRule.WE3], result.Flags[RunRule.N6]);
        });

    private static void AssertSameSignals(IReadOnlyList<RuleSignal> expected, IReadOnlyList<RuleSignal> actual)
    {
        Assert.Equal(expected.Count, actual.Count);
        for (var i = 0; i < expected.Count; i++)
        {
            Assert.Equal(expected[i].Rule, actual[i].Rule);
            Assert.Equal(expected[i].Index, actual[i].Index);
            Assert.Equal(expected[i].Pattern, actual[i].Pattern);
        }
    }
}
