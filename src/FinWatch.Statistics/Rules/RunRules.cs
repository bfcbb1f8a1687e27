namespace FinWatch.Statistics.Rules;

/// <summary>Rule sets, identifiers and classification of the <see cref="RunRule"/> values (docs/statistics.md §3.1, §3.2).</summary>
public static class RunRules
{
    private static readonly string[] Ids = ["WE1", "WE2", "WE3", "WE4", "N1", "N2", "N3", "N4", "N5", "N6", "N7", "N8"];

    /// <summary>The Western Electric zone rules WE1..WE4 (docs/statistics.md §3.1), in that order.</summary>
    public static IReadOnlyList<RunRule> WesternElectric { get; } =
        Array.AsReadOnly([RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4]);

    /// <summary>Nelson's tests N1..N8 (docs/statistics.md §3.2), in that order.</summary>
    public static IReadOnlyList<RunRule> Nelson { get; } =
        Array.AsReadOnly([RunRule.N1, RunRule.N2, RunRule.N3, RunRule.N4, RunRule.N5, RunRule.N6, RunRule.N7, RunRule.N8]);

    /// <summary>
    /// Parses a rule identifier ("WE1".."WE4", "N1".."N8") or a set name ("westernElectric", "nelson").
    /// Matching is ordinal and ignores case; surrounding white space is not accepted.
    /// </summary>
    /// <param name="id">The identifier; <see langword="null"/> fails.</param>
    /// <param name="rules">The rule (a one-element list) or the set; an empty list when parsing fails.</param>
    /// <returns><see langword="true"/> when <paramref name="id"/> names a rule or a set.</returns>
    public static bool TryParse(string? id, out IReadOnlyList<RunRule> rules)
    {
        if (id is not null)
        {
            if (string.Equals(id, "westernElectric", StringComparison.OrdinalIgnoreCase))
            {
                rules = WesternElectric;
                return true;
            }

            if (string.Equals(id, "nelson", StringComparison.OrdinalIgnoreCase))
            {
                rules = Nelson;
                return true;
            }

            for (var i = 0; i < Ids.Length; i++)
            {
                if (string.Equals(id, Ids[i], StringComparison.OrdinalIgnoreCase))
                {
                    rules = Array.AsReadOnly([(RunRule)i]);
                    return true;
                }
            }
        }

        rules = Array.Empty<RunRule>();
        return false;
    }

    /// <summary>The identifier of a rule: "WE1".."WE4", "N1".."N8".</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="rule"/> is not a defined value.</exception>
    public static string Id(RunRule rule) => Ids[Checked(rule)];

    /// <summary>
    /// Whether the rule needs z (the zone position of the point): every rule except <see cref="RunRule.N3"/> and
    /// <see cref="RunRule.N4"/>, which look at the plotted values only. Zone rules are not evaluable when
    /// sigma_point = 0 (docs/statistics.md §3.3 item 9).
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="rule"/> is not a defined value.</exception>
    public static bool IsZoneRule(RunRule rule)
    {
        Checked(rule);
        return rule is not (RunRule.N3 or RunRule.N4);
    }

    internal static int Checked(RunRule rule)
    {
        var i = (int)rule;
        if (i < 0 || i >= Ids.Length)
        {
            throw new ArgumentOutOfRangeException(nameof(rule), rule, "Not a defined run rule.");
        }

        return i;
    }

    internal const int RuleCount = 12;
}
