namespace FinWatch.Statistics.Rules;

/// <summary>Batch evaluation of run rules over a whole series (docs/statistics.md §3).</summary>
public static class RunRuleEvaluation
{
    /// <summary>
    /// Evaluates the rules over a series by feeding a <see cref="RunRuleEvaluator"/> point by point, so the result is
    /// the incremental one by construction.
    /// </summary>
    /// <param name="values">The plotted values; NaN marks a missing point, which is skipped and keeps its index (docs/statistics.md §3.3 item 8). Infinite values are rejected.</param>
    /// <param name="z">(value − CL)/sigma_point for each row, same length; NaN where the zone rules are not evaluable (item 9; see <see cref="RunRuleEvaluator"/>). Ignored on missing rows.</param>
    /// <param name="rules">The rules to evaluate.</param>
    /// <exception cref="ArgumentException">The spans differ in length.</exception>
    /// <exception cref="ArgumentOutOfRangeException">A value is infinite, a z of a non-missing row is infinite, or a rule is undefined.</exception>
    public static RuleEvaluation Evaluate(ReadOnlySpan<double> values, ReadOnlySpan<double> z, IEnumerable<RunRule> rules)
    {
        if (values.Length != z.Length)
        {
            throw new ArgumentException($"values has {values.Length} rows but z has {z.Length}.", nameof(z));
        }

        var evaluator = new RunRuleEvaluator(rules);
        var signals = new List<RuleSignal>();
        for (var i = 0; i < values.Length; i++)
        {
            if (!double.IsNaN(values[i]))
            {
                evaluator.Append(i, values[i], z[i], signals);
            }
        }

        return new RuleEvaluation(evaluator.Rules, evaluator.ZoneCount > 0, signals);
    }
}
