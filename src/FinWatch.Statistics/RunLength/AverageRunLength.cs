using FinWatch.Statistics.Rules;
using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.RunLength;

/// <summary>
/// Average run lengths (expected number of points to the first signal, counting the signalling point) of Shewhart,
/// EWMA and tabular CUSUM charts for normally distributed, independent points with known in-control mean and σ
/// (docs/statistics.md §4.3). Shifts δ are in sigma units of the plotted statistic (σ/√n for subgroup means); δ = 0 gives the
/// in-control ARL. All functions are deterministic; each call takes from microseconds (Shewhart) to about 10 ms
/// (EWMA with a small λ, the largest linear system).
/// </summary>
public static class AverageRunLength
{
    /// <summary>
    /// ARL of a Shewhart chart with limits at ±L sigma: 1/[Φ(−L − δ) + Φ(−L + δ)] (geometric run length).
    /// </summary>
    /// <param name="L">Limit width in sigma units, L &gt; 0 (3 for the usual chart: 370.4 in control).</param>
    /// <param name="shift">Mean shift δ in sigma units; any finite value.</param>
    /// <returns>The ARL, ≥ 1, exact to double precision (MathNet's normal CDF); +∞ when the signal probability
    /// underflows (L above about 37).</returns>
    /// <exception cref="ArgumentOutOfRangeException">L is not positive and finite, or δ is not finite.</exception>
    public static double Shewhart(double L, double shift)
    {
        RequirePositive(L, nameof(L));
        RequireFinite(shift, nameof(shift));
        return 1 / (Normal.CDF(0, 1, -L - shift) + Normal.CDF(0, 1, -L + shift));
    }

    /// <summary>
    /// ARL of an EWMA chart z_i = λx_i + (1 − λ)z_{i−1} with the asymptotic limits ±L·√(λ/(2 − λ)) (sigma units of the
    /// data), started at the target (z_0 = μ0), as tabulated by Lucas &amp; Saccucci (1990).
    /// </summary>
    /// <remarks>
    /// Method: Nyström solution of Crowder's (1987) integral equation with composite Gauss–Legendre quadrature (panels
    /// at most 2λ wide, 10 nodes each, at most 300 nodes), solved by LU, then Nyström interpolation at the target.
    /// Accuracy: relative error below 1e-10 for λ ≥ 0.005 and L ≤ 4 (measured against finer rules; the tests also
    /// cross-check a Lucas–Saccucci Markov chain and the printed tables); below λ = 0.005 the node cap is reached and the error grows (about 1e-6 at
    /// λ = 0.001, L = 3.5). ARLs above 1e12, beyond what double precision resolves, are returned as +∞.
    /// λ = 1 reproduces <see cref="Shewhart"/>.
    /// </remarks>
    /// <param name="lambda">Smoothing weight λ, 0 &lt; λ ≤ 1.</param>
    /// <param name="L">Limit width L &gt; 0 in sigma units of the EWMA's asymptotic standard deviation.</param>
    /// <param name="shift">Mean shift δ in sigma units of the data; any finite value.</param>
    /// <returns>The ARL, ≥ 1, or +∞ (see remarks).</returns>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside its valid range.</exception>
    public static double Ewma(double lambda, double L, double shift)
    {
        if (!(lambda > 0 && lambda <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(lambda), lambda, "λ must satisfy 0 < λ ≤ 1.");
        }

        RequirePositive(L, nameof(L));
        RequireFinite(shift, nameof(shift));
        return EwmaRunLength.FromTarget(lambda, L, shift);
    }

    /// <summary>
    /// ARL of the two-sided tabular CUSUM with reference value k and decision interval h (sigma units), combined from
    /// the one-sided ARLs by 1/ARL = 1/ARL⁺ + 1/ARL⁻ (Lucas &amp; Crosier 1982), where ARL⁺ =
    /// <see cref="CusumOneSided"/>(k, h, δ) and ARL⁻ = <see cref="CusumOneSided"/>(k, h, −δ) by symmetry.
    /// </summary>
    /// <remarks>
    /// The combination is the one the published tables use (Montgomery Table 9.3, NIST §6.3.2.3). With the zero start
    /// it agrees with direct simulation of the two-sided scheme (at h = 5: 465.44 against 465.2 ± 1.0 from 200 000
    /// seeded runs). With a head start it is an approximation: accurate out of control, but it overstates the in-control
    /// ARL by several per cent because both sums start positive (h = 5, head start 2.5: 447.9 against about 429
    /// simulated; h = 4, head start 2: 158.2 against about 148). Accuracy of each one-sided ARL: see
    /// <see cref="CusumOneSided"/>.
    /// </remarks>
    /// <param name="k">Reference value k ≥ 0, sigma units.</param>
    /// <param name="h">Decision interval h, 0 &lt; h ≤ 20, sigma units.</param>
    /// <param name="shift">Mean shift δ in sigma units; any finite value.</param>
    /// <param name="headStart">Fast-initial-response head start for both sums, 0 ≤ headStart ≤ h, sigma units.</param>
    /// <returns>The two-sided ARL, ≥ 1, or +∞ when both one-sided ARLs are.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside its valid range.</exception>
    public static double Cusum(double k, double h, double shift, double headStart = 0)
    {
        var upper = CusumOneSided(k, h, shift, headStart);
        var lower = CusumOneSided(k, h, -shift, headStart);
        return 1 / ((1 / upper) + (1 / lower));
    }

    /// <summary>
    /// ARL of the one-sided upper CUSUM S_i = max(0, S_{i−1} + x_i − k), signal when S_i &gt; h, started at
    /// S_0 = headStart, for x ~ N(δ, 1). The lower one-sided CUSUM's ARL at shift δ equals this one at −δ.
    /// </summary>
    /// <remarks>
    /// Method: Nyström solution of Page's (1954) integral equation, the atom at 0 (the probability of S falling back to 0)
    /// carried as its own unknown, with composite Gauss–Legendre quadrature on [0, h] (panels at most one sigma wide,
    /// 12 nodes each), solved by LU; a non-zero head start is evaluated by Nyström interpolation. Accuracy: relative error
    /// below 1e-10 for ARLs up to 1e6 and below 1e-8 up to 1e9 (measured against finer rules; the tests also
    /// cross-check a Brook &amp; Evans Markov chain and the printed tables); the linear system's condition number grows with the ARL, so ARLs above 1e12 (a large
    /// h with δ well below k) are returned as +∞.
    /// </remarks>
    /// <param name="k">Reference value k ≥ 0, sigma units.</param>
    /// <param name="h">Decision interval h, 0 &lt; h ≤ 20, sigma units.</param>
    /// <param name="shift">Mean shift δ in sigma units; any finite value.</param>
    /// <param name="headStart">Head start S_0, 0 ≤ headStart ≤ h, sigma units.</param>
    /// <returns>The one-sided ARL, ≥ 1, or +∞ (see remarks).</returns>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside its valid range.</exception>
    public static double CusumOneSided(double k, double h, double shift, double headStart = 0)
    {
        if (!(k >= 0) || !double.IsFinite(k))
        {
            throw new ArgumentOutOfRangeException(nameof(k), k, "k must be non-negative and finite.");
        }

        if (!(h > 0 && h <= 20))
        {
            throw new ArgumentOutOfRangeException(nameof(h), h, "h must satisfy 0 < h ≤ 20 (sigma units).");
        }

        RequireFinite(shift, nameof(shift));
        if (!(headStart >= 0 && headStart <= h))
        {
            throw new ArgumentOutOfRangeException(nameof(headStart), headStart, "The head start must satisfy 0 ≤ headStart ≤ h.");
        }

        return CusumRunLength.UpperOneSided(k, h, shift, headStart);
    }

    /// <summary>
    /// Exact ARL of a Shewhart chart with zones at 1, 2 and 3 sigma and any non-empty subset of the Western Electric
    /// rules (docs/statistics.md §3.1): "WE1" one point beyond 3 sigma; "WE2" two of three consecutive beyond 2 sigma on one side;
    /// "WE3" four of five beyond 1 sigma on one side; "WE4" eight in a row on one side. Every point is N(δ, 1) in sigma
    /// units, independent; the windows are truncated at the start of the series (docs/statistics.md §3.3).
    /// </summary>
    /// <remarks>
    /// Method: Markov chain over the zone history (Champ &amp; Woodall 1987), reduced to its distinct states and solved
    /// by LU; exact up to rounding (relative error about 1e-12). With all four rules the in-control ARL is 91.75; with
    /// WE1 alone it equals <see cref="Shewhart"/>(3, δ). Points exactly on a zone line have probability zero, so the
    /// boundary conventions of docs/statistics.md §3.3 do not affect the ARL. Nelson's tests (N1–N8) are out of scope for this exact
    /// chain: their trend and alternation tests depend on the values, not only the zones.
    /// </remarks>
    /// <param name="ruleIds">Rule identifiers, each exactly "WE1", "WE2", "WE3" or "WE4" (ordinal, duplicates allowed).</param>
    /// <param name="shift">Mean shift δ in sigma units of the plotted statistic; any finite value.</param>
    /// <returns>The ARL, ≥ 1.</returns>
    /// <exception cref="ArgumentException">The set is empty or holds an identifier other than WE1–WE4.</exception>
    /// <exception cref="ArgumentOutOfRangeException">δ is not finite.</exception>
    public static double ShewhartWithRules(IReadOnlyCollection<string> ruleIds, double shift)
    {
        ArgumentNullException.ThrowIfNull(ruleIds);
        RequireFinite(shift, nameof(shift));
        var mask = 0;
        foreach (var id in ruleIds)
        {
            mask |= id switch
            {
                "WE1" => 1,
                "WE2" => 2,
                "WE3" => 4,
                "WE4" => 8,
                _ => throw new ArgumentException(
                    $"Unknown rule '{id}': the exact chain covers the Western Electric rules WE1–WE4 only.", nameof(ruleIds)),
            };
        }

        if (mask == 0)
        {
            throw new ArgumentException("At least one rule is needed; with none the chart never signals.", nameof(ruleIds));
        }

        return WesternElectricChain.For(mask).AverageRunLength(shift);
    }

    /// <summary>
    /// Exact ARL of a 3-sigma Shewhart chart with run rules given as <see cref="RunRule"/> values, for the rules the zone
    /// chain covers: WE1–WE4, their equals N1, N5 and N6 (docs/statistics.md §3.2), and N2 (nine in a row on one side).
    /// Same model and method as <see cref="ShewhartWithRules"/>; use <see cref="HasExactChain"/> to ask first and
    /// <see cref="RuleSetRunLength"/> for any rule set.
    /// </summary>
    /// <remarks>N2 alone in control gives 2⁹ − 1 = 511 (a run of nine equal outcomes of a fair coin); with WE4 also
    /// enabled N2 never signals first, since every run of nine contains a run of eight that ended a point earlier.</remarks>
    /// <param name="rules">The enabled rules (duplicates allowed).</param>
    /// <param name="shift">Mean shift δ in sigma units of the plotted statistic; any finite value.</param>
    /// <returns>The ARL, ≥ 1.</returns>
    /// <exception cref="ArgumentException">The set is empty or holds N3, N4, N7 or N8 (no exact chain here).</exception>
    /// <exception cref="ArgumentOutOfRangeException">δ is not finite.</exception>
    public static double ShewhartWithRunRules(IEnumerable<RunRule> rules, double shift)
    {
        ArgumentNullException.ThrowIfNull(rules);
        RequireFinite(shift, nameof(shift));
        var mask = ChainMask(rules);
        if (mask is null or 0)
        {
            throw new ArgumentException(
                "The exact chain needs at least one rule, all of them among WE1–WE4, N1, N2, N5 and N6.", nameof(rules));
        }

        return WesternElectricChain.For(mask.Value).AverageRunLength(shift);
    }

    /// <summary>
    /// Whether <see cref="ShewhartWithRunRules"/> covers the set: not empty, and every rule among WE1–WE4, N1, N2, N5 and N6.
    /// </summary>
    public static bool HasExactChain(IEnumerable<RunRule> rules) => ChainMask(rules) is > 0;

    /// <summary>The chain's rule mask (N1, N5, N6 flag exactly what WE1, WE2, WE3 flag), or null for a rule it does not cover.</summary>
    private static int? ChainMask(IEnumerable<RunRule> rules)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var mask = 0;
        foreach (var rule in rules)
        {
            var bit = rule switch
            {
                RunRule.WE1 or RunRule.N1 => 1,
                RunRule.WE2 or RunRule.N5 => 2,
                RunRule.WE3 or RunRule.N6 => 4,
                RunRule.WE4 => 8,
                RunRule.N2 => WesternElectricChain.N2Bit,
                _ => 0,
            };
            if (bit == 0)
            {
                return null;
            }

            mask |= bit;
        }

        return mask;
    }

    private static void RequirePositive(double value, string name)
    {
        if (!(value > 0) || !double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(name, value, "The value must be positive and finite.");
        }
    }

    internal static void RequireFinite(double value, string name)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(name, value, "The value must be finite.");
        }
    }
}
