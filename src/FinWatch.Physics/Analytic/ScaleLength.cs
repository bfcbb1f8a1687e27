namespace FinWatch.Physics.Analytic;

/// <summary>
/// Electrostatic natural length λ (docs/model.md §B.1–B.3): the slowest source/drain perturbation
/// decays as exp(−y/λ). This is the Yan/Young convention; Frank–Taur–Wong's λ_FTW equals π·λ (B.1).
/// </summary>
/// <remarks>
/// All lengths are in nm (in and out). The dielectric thickness is the EOT with ε_ox = 3.9 ε₀ (A.6).
/// Valid for a fully depleted, first-mode description; any positive finite thickness is accepted.
/// Caller mistakes (non-finite or non-positive lengths) throw <see cref="ArgumentOutOfRangeException"/>.
/// </remarks>
public static class ScaleLength
{
    private const double EpsSi = PhysicalConstants.SiliconRelativePermittivity;
    private const double EpsOx = PhysicalConstants.OxideRelativePermittivity;

    /// <summary>
    /// Exact lowest mode of the symmetric double gate (B.2): λ = 1/k with ε_Si·tan(k t_si/2)·tan(k t_ox) = ε_ox,
    /// the root in 0 &lt; k &lt; min(π/t_si, π/(2 t_ox)), found by bracketed Brent to a relative 1e-13 in k.
    /// </summary>
    /// <param name="siliconThicknessNm">t_si, film thickness between the two gates, in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox as EOT, in nm; finite and &gt; 0.</param>
    /// <returns>λ in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A thickness is non-finite or ≤ 0.</exception>
    public static double DoubleGateExactNm(double siliconThicknessNm, double oxideThicknessNm) =>
        DoubleGateExactNm(siliconThicknessNm, oxideThicknessNm, double.NaN);

    /// <summary>
    /// The exact double-gate root of <see cref="DoubleGateExactNm(double, double)"/>, first trying the sub-bracket
    /// k ∈ [0.99, 1.01]/λ_guess of the stated interval (a neighbouring slice's root) and falling back to the full
    /// interval when that does not bracket the sign change. Same root and tolerance; fewer function evaluations.
    /// </summary>
    /// <param name="siliconThicknessNm">t_si in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox (EOT) in nm; finite and &gt; 0.</param>
    /// <param name="guessNm">A nearby λ in nm, or NaN for no guess.</param>
    /// <returns>λ in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A thickness is non-finite or ≤ 0.</exception>
    public static double DoubleGateExactNm(double siliconThicknessNm, double oxideThicknessNm, double guessNm)
    {
        RequirePositive(siliconThicknessNm);
        RequirePositive(oxideThicknessNm);
        double tsi = siliconThicknessNm, tox = oxideThicknessNm;

        // Work in x = k·t_si/2 ∈ (0, x_max); f is monotonic increasing from −ε_ox to +∞ there.
        double xMax = Math.Min(Math.PI / 2, Math.PI * tsi / (4 * tox));
        double ratio = 2 * tox / tsi;
        double F(double x) => (EpsSi * Math.Tan(x) * Math.Tan(x * ratio)) - EpsOx;
        double upper = xMax * (1 - 1e-12);
        double tolerance = 1e-13 * xMax;
        if (double.IsFinite(guessNm) && guessNm > 0)
        {
            double xg = tsi / (2 * guessNm);
            double lo = Math.Min(0.99 * xg, upper), hi = Math.Min(1.01 * xg, upper);
            if (lo < hi && BrentRootFinder.TrySolve(F, lo, hi, tolerance, out double xNear))
            {
                return tsi / (2 * xNear);
            }
        }

        if (!BrentRootFinder.TrySolve(F, 0, upper, tolerance, out double x))
        {
            // Unreachable for finite positive input (f(0) = −ε_ox < 0, f(upper) ≫ 0); kept as a guard.
            throw new InvalidOperationException("Scale-length root not bracketed.");
        }

        return tsi / (2 * x);
    }

    /// <summary>Thin-oxide symmetric double gate λ₂ = √(ε_Si t_si t_ox/(2ε_ox)) (Yan et al. 1992; Colinge 2004, n = 2), in nm.</summary>
    /// <param name="siliconThicknessNm">t_si in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox (EOT) in nm; finite and &gt; 0.</param>
    /// <returns>λ in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A thickness is non-finite or ≤ 0.</exception>
    public static double DoubleGateThinOxideNm(double siliconThicknessNm, double oxideThicknessNm) =>
        EquivalentGatesNm(siliconThicknessNm, oxideThicknessNm, 2);

    /// <summary>
    /// Suzuki et al. (1993) double-gate form λ = √(ε_Si t_si t_ox/(2ε_ox)·(1 + ε_ox t_si/(4 ε_Si t_ox))), in nm (B.2; formula [M]).
    /// </summary>
    /// <param name="siliconThicknessNm">t_si in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox (EOT) in nm; finite and &gt; 0.</param>
    /// <returns>λ in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A thickness is non-finite or ≤ 0.</exception>
    public static double DoubleGateSuzukiNm(double siliconThicknessNm, double oxideThicknessNm)
    {
        RequirePositive(siliconThicknessNm);
        RequirePositive(oxideThicknessNm);
        double tsi = siliconThicknessNm, tox = oxideThicknessNm;
        return Math.Sqrt(EpsSi * tsi * tox / (2 * EpsOx) * (1 + (EpsOx * tsi / (4 * EpsSi * tox))));
    }

    /// <summary>
    /// Colinge's "equivalent gates" form λ_n = √(ε_Si t_si t_ox/(n ε_ox)), in nm (B.2): n = 1 single, 2 double,
    /// ≈ 3 tri-gate, 4 gate-all-around.
    /// </summary>
    /// <param name="siliconThicknessNm">t_si in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox (EOT) in nm; finite and &gt; 0.</param>
    /// <param name="equivalentGates">n; finite and &gt; 0.</param>
    /// <returns>λ in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is non-finite or ≤ 0.</exception>
    public static double EquivalentGatesNm(double siliconThicknessNm, double oxideThicknessNm, double equivalentGates)
    {
        RequirePositive(siliconThicknessNm);
        RequirePositive(oxideThicknessNm);
        RequirePositive(equivalentGates);
        return Math.Sqrt(EpsSi * siliconThicknessNm * oxideThicknessNm / (equivalentGates * EpsOx));
    }

    /// <summary>
    /// Top-gate term λ_H of a gated top over a silicon height H with a Neumann foot (B.3): the exact double-gate
    /// root with t_si = 2H, in nm.
    /// </summary>
    /// <param name="heightNm">H in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox (EOT) in nm; finite and &gt; 0.</param>
    /// <returns>λ_H in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A length is non-finite or ≤ 0.</exception>
    public static double TopGateNm(double heightNm, double oxideThicknessNm)
    {
        RequirePositive(heightNm);
        return DoubleGateExactNm(2 * heightNm, oxideThicknessNm);
    }

    /// <summary>Combines the sidewall and top terms as 1/λ² = 1/λ_W² + 1/λ_H² (B.3), in nm.</summary>
    /// <param name="sidewallNm">λ_W in nm; finite and &gt; 0.</param>
    /// <param name="topNm">λ_H in nm; finite and &gt; 0.</param>
    /// <returns>λ in nm (always below both inputs).</returns>
    /// <exception cref="ArgumentOutOfRangeException">A length is non-finite or ≤ 0.</exception>
    public static double CombineNm(double sidewallNm, double topNm)
    {
        RequirePositive(sidewallNm);
        RequirePositive(topNm);
        return 1 / Math.Sqrt((1 / (sidewallNm * sidewallNm)) + (1 / (topNm * topNm)));
    }

    /// <summary>
    /// Rectangular fin λ (B.3, A.7): tri-gate 1/λ² = 1/λ_W(W)² + 1/λ_H(2H)² with both exact roots; double gate
    /// (hard mask) λ = λ_W(W). In nm.
    /// </summary>
    /// <param name="widthNm">W (local fin width) in nm; finite and &gt; 0.</param>
    /// <param name="heightNm">H (gated height) in nm; finite and &gt; 0.</param>
    /// <param name="oxideThicknessNm">t_ox (EOT) in nm; finite and &gt; 0.</param>
    /// <param name="faces">Gated faces.</param>
    /// <returns>λ in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A length is non-finite or ≤ 0, or <paramref name="faces"/> is undefined.</exception>
    public static double RectangularFinNm(double widthNm, double heightNm, double oxideThicknessNm, GateFaces faces)
    {
        double w = DoubleGateExactNm(widthNm, oxideThicknessNm);
        return faces switch
        {
            GateFaces.TriGate => CombineNm(w, TopGateNm(heightNm, oxideThicknessNm)),
            GateFaces.DoubleGate => RequirePositiveThen(heightNm, w),
            _ => throw new ArgumentOutOfRangeException(nameof(faces)),
        };
    }

    /// <summary>Converts a natural length to the Frank–Taur–Wong convention, λ_FTW = π·λ (B.1), in nm.</summary>
    /// <param name="naturalLengthNm">λ in nm; finite and &gt; 0.</param>
    /// <returns>λ_FTW in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The length is non-finite or ≤ 0.</exception>
    public static double ToFrankTaurWongNm(double naturalLengthNm)
    {
        RequirePositive(naturalLengthNm);
        return Math.PI * naturalLengthNm;
    }

    private static double RequirePositiveThen(double value, double result)
    {
        RequirePositive(value);
        return result;
    }

    private static void RequirePositive(double value)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "Must be finite and > 0.");
        }
    }
}
