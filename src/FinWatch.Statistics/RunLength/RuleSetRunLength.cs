using System.Collections.Concurrent;
using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.RunLength;

/// <summary>
/// The average run length of a 3-sigma Shewhart chart with any set of run rules (docs/statistics.md §4.5): exact from
/// the zone chain where one exists (<see cref="AverageRunLength.HasExactChain"/>: WE1–WE4, N1, N2, N5, N6), otherwise
/// by the seeded simulation (<see cref="RunLengthSimulation"/> with <see cref="Seed"/> and its default budget).
/// </summary>
/// <remarks>
/// Results are cached per rule set (N1, N5 and N6 count as WE1, WE2 and WE3, which flag the same points) and shift, so
/// a page that asks again while rules are being chosen gets the answer at once; a first simulated answer takes up to
/// about 0.1 s (0.2 s when not resolved) on one core. Thread-safe: concurrent first calls for one key compute it once.
/// </remarks>
public static class RuleSetRunLength
{
    /// <summary>The fixed seed of the simulation, so that every caller gets the same numbers for a rule set.</summary>
    public const int Seed = 19_870_401;

    private static readonly ConcurrentDictionary<(int Rules, double Shift), Lazy<RunLengthEstimate>> Cache = new();

    /// <summary>ARL of the chart with <paramref name="rules"/> at mean shift <paramref name="shift"/>.</summary>
    /// <param name="rules">The enabled rules; at least one (duplicates allowed).</param>
    /// <param name="shift">Mean shift δ in sigma units of the plotted statistic; finite.</param>
    /// <returns>The exact or simulated estimate; +∞ points when the ARL cannot be resolved.</returns>
    /// <exception cref="ArgumentException">No rule is given.</exception>
    /// <exception cref="ArgumentOutOfRangeException">δ is not finite, or a value is not a defined <see cref="RunRule"/>.</exception>
    public static RunLengthEstimate Estimate(IEnumerable<RunRule> rules, double shift)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var canonical = rules.Select(Canonical).Distinct().Order().ToArray();
        if (canonical.Length == 0)
        {
            throw new ArgumentException("At least one rule is needed; with none the chart never signals.", nameof(rules));
        }

        AverageRunLength.RequireFinite(shift, nameof(shift));

        var key = (canonical.Aggregate(0, (mask, rule) => mask | (1 << (int)rule)), shift);
        return Cache.GetOrAdd(key, _ => new Lazy<RunLengthEstimate>(() => Compute(canonical, shift))).Value;
    }

    /// <summary>Whether <see cref="Estimate"/> answers from the exact chain for this set (else by simulation).</summary>
    public static bool IsExact(IEnumerable<RunRule> rules) => AverageRunLength.HasExactChain(rules);

    private static RunLengthEstimate Compute(RunRule[] rules, double shift) => AverageRunLength.HasExactChain(rules)
        ? new RunLengthEstimate(RunLengthGuard.Checked(AverageRunLength.ShewhartWithRunRules(rules, shift)), 0, RunLengthMethod.MarkovChain, 0)
        : RunLengthSimulation.AverageRunLength(rules, shift, Seed);

    /// <summary>N1, N5 and N6 flag exactly the points WE1, WE2 and WE3 flag (docs/statistics.md §3.2).</summary>
    private static RunRule Canonical(RunRule rule)
    {
        RunRules.Checked(rule);
        return rule switch
        {
            RunRule.N1 => RunRule.WE1,
            RunRule.N5 => RunRule.WE2,
            RunRule.N6 => RunRule.WE3,
            _ => rule,
        };
    }
}
