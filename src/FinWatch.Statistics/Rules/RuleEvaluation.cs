namespace FinWatch.Statistics.Rules;

/// <summary>The result of evaluating run rules over a whole series (<see cref="RunRuleEvaluation.Evaluate"/>).</summary>
public sealed class RuleEvaluation
{
    internal RuleEvaluation(IReadOnlySet<RunRule> rules, bool zoneEvaluable, List<RuleSignal> signals)
    {
        var perRule = new List<int>?[RunRules.RuleCount];
        for (var r = 0; r < perRule.Length; r++)
        {
            var rule = (RunRule)r;
            if (rules.Contains(rule) && (zoneEvaluable || !RunRules.IsZoneRule(rule)))
            {
                perRule[r] = [];
            }
        }

        foreach (var signal in signals)
        {
            perRule[(int)signal.Rule]!.Add(signal.Index);
        }

        var flags = new Dictionary<RunRule, IReadOnlyList<int>?>(rules.Count);
        var first = new Dictionary<RunRule, int?>(rules.Count);
        for (var r = 0; r < perRule.Length; r++)
        {
            var rule = (RunRule)r;
            if (!rules.Contains(rule))
            {
                continue;
            }

            var list = perRule[r];
            flags[rule] = list?.AsReadOnly();
            first[rule] = list is { Count: > 0 } ? list[0] : null;
        }

        Flags = flags.AsReadOnly();
        First = first.AsReadOnly();
        Signals = signals.AsReadOnly();
    }

    /// <summary>
    /// For each evaluated rule, the input indices of the flagged points, ascending. <see langword="null"/> when the rule
    /// was not evaluable at all: a zone rule (<see cref="RunRules.IsZoneRule"/>) when no non-missing point had a
    /// non-NaN z (sigma_point = 0, docs/statistics.md §3.3 item 9, or an empty series). N3 and N4 are always evaluable.
    /// </summary>
    public IReadOnlyDictionary<RunRule, IReadOnlyList<int>?> Flags { get; }

    /// <summary>For each evaluated rule, the first flagged input index; <see langword="null"/> when none was flagged or the rule was not evaluable.</summary>
    public IReadOnlyDictionary<RunRule, int?> First { get; }

    /// <summary>Every signal, ordered by point and, for one point, by <see cref="RunRule"/>.</summary>
    public IReadOnlyList<RuleSignal> Signals { get; }
}
