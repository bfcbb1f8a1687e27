namespace FinWatch.Physics.Analytic;

/// <summary>
/// Threshold roll-off, DIBL and swing from the quasi-2-D (Young/Yan) channel potential with the natural length λ
/// (docs/model.md §B.5), solved exactly for the barrier minimum [D]; Liu et al. (1993) as the
/// leading-order cross-check.
/// </summary>
/// <remarks>
/// <para>
/// Channel potential ψ(y) = ψ_L + [B sinh(y/λ) + A sinh((L−y)/λ)]/sinh(L/λ), A = V_bi − ψ_L, B = V_bi + V_DS − ψ_L,
/// ℓ = L/λ. Potentials in V; ℓ is dimensionless. The shift depends on V_bi and φ_th only through V_bi − φ_th.
/// </para>
/// <para>
/// Validity: a first-mode model, good for ℓ ≳ 4, usable to ≈ 3, not meaningful below ≈ 3 (punch-through).
/// Arguments must be finite, ℓ &gt; 0 and V_DS ≥ 0; otherwise <see cref="ArgumentOutOfRangeException"/>.
/// For ℓ above about 700 the hyperbolic functions overflow; the methods then treat the channel as long.
/// </para>
/// </remarks>
public static class ShortChannel
{
    /// <summary>Lower end of the ψ_L bracket below φ_th, in V (B.5: [φ_th − 5 V, φ_th]).</summary>
    public const double BracketWidthV = 5.0;

    private const double RootToleranceV = 1e-13;
    private const double MaxLengthRatio = 700;

    /// <summary>
    /// Exact barrier minimum ψ_min = ψ_L + √(2AB cosh ℓ − A² − B²)/sinh ℓ, valid while tanh u* = (A cosh ℓ − B)/(A sinh ℓ) &gt; 0;
    /// otherwise ψ_min = V_bi and the barrier is gone (B.5).
    /// </summary>
    /// <param name="longChannelPotentialV">ψ_L in V; finite and &lt; V_bi.</param>
    /// <param name="builtInPotentialV">V_bi in V; finite.</param>
    /// <param name="drainVoltageV">V_DS in V; finite and ≥ 0.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <returns>ψ_min and whether the barrier is present.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static BarrierMinimum MinimumPotential(double longChannelPotentialV, double builtInPotentialV, double drainVoltageV, double lengthRatio)
    {
        Validate(longChannelPotentialV, builtInPotentialV, drainVoltageV, lengthRatio);
        return MinimumCore(builtInPotentialV - longChannelPotentialV, drainVoltageV, new Hyperbolic(lengthRatio), longChannelPotentialV);
    }

    /// <summary>
    /// ∂ψ_min/∂ψ_L = 1 − (A + B)(cosh ℓ − 1)/(sinh ℓ·√(2AB cosh ℓ − A² − B²)) (B.5), dimensionless.
    /// At V_DS = 0 it equals 1 − sech(ℓ/2). NaN when the barrier is gone.
    /// </summary>
    /// <param name="longChannelPotentialV">ψ_L in V; finite and &lt; V_bi.</param>
    /// <param name="builtInPotentialV">V_bi in V; finite.</param>
    /// <param name="drainVoltageV">V_DS in V; finite and ≥ 0.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <returns>The derivative, or NaN when the barrier is gone.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static double BarrierSlope(double longChannelPotentialV, double builtInPotentialV, double drainVoltageV, double lengthRatio)
    {
        Validate(longChannelPotentialV, builtInPotentialV, drainVoltageV, lengthRatio);
        return SlopeCore(builtInPotentialV - longChannelPotentialV, drainVoltageV, new Hyperbolic(lengthRatio));
    }

    /// <summary>
    /// Barrier lowering by the drain at fixed ψ_L, ∂ψ_min/∂V_DS = (A cosh ℓ − B)/(sinh ℓ·√(2AB cosh ℓ − A² − B²)) [D],
    /// dimensionless. At V_DS → 0 it equals 1/(2 cosh(ℓ/2)) (the B.5 "barrier DIBL"). NaN when the barrier is gone.
    /// </summary>
    /// <param name="longChannelPotentialV">ψ_L in V; finite and &lt; V_bi.</param>
    /// <param name="builtInPotentialV">V_bi in V; finite.</param>
    /// <param name="drainVoltageV">V_DS in V; finite and ≥ 0.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <returns>The derivative, or NaN when the barrier is gone.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static double BarrierDrainSlope(double longChannelPotentialV, double builtInPotentialV, double drainVoltageV, double lengthRatio)
    {
        Validate(longChannelPotentialV, builtInPotentialV, drainVoltageV, lengthRatio);
        double a = builtInPotentialV - longChannelPotentialV, b = a + drainVoltageV;
        if (lengthRatio > MaxLengthRatio)
        {
            return 0;
        }

        (double sh, double ch) = (Math.Sinh(lengthRatio), Math.Cosh(lengthRatio));
        double num = (a * ch) - b;
        if (!(num > 0) || !(a > 0))
        {
            return double.NaN;
        }

        return num / (sh * Math.Sqrt((2 * a * b * ch) - (a * a) - (b * b)));
    }

    /// <summary>
    /// Threshold shift ΔV_T,SCE = n_long·(ψ_L* − φ_th), with ψ_L* solving ψ_min(ψ_L*) = φ_th by Brent on
    /// [φ_th − 5 V, φ_th], and the swing S = n_long v_t ln 10/(∂ψ_min/∂ψ_L) at ψ_L* (B.5).
    /// </summary>
    /// <param name="barrierHeightV">V_bi − φ_th in V; finite and &gt; 0 (≈ 0.15 V for an undoped fin with n⁺ = 1e20 cm⁻³).</param>
    /// <param name="drainVoltageV">V_DS in V; finite and ≥ 0.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <param name="longChannelIdeality">n_long (1 for an undoped fully depleted fin); finite and ≥ 1.</param>
    /// <returns>The shift, slope and swing; flagged <see cref="ShortChannelThreshold.PunchThrough"/> with NaN values when no root exists.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static ShortChannelThreshold Threshold(double barrierHeightV, double drainVoltageV, double lengthRatio, double longChannelIdeality = 1.0)
    {
        RequireFinitePositive(barrierHeightV);
        Validate(0, barrierHeightV, drainVoltageV, lengthRatio);
        if (!double.IsFinite(longChannelIdeality) || longChannelIdeality < 1)
        {
            throw new ArgumentOutOfRangeException(nameof(longChannelIdeality), longChannelIdeality, "Must be finite and ≥ 1.");
        }

        double sLong = longChannelIdeality * PhysicalConstants.ThermalVoltageV * Math.Log(10);
        if (lengthRatio > MaxLengthRatio)
        {
            return new ShortChannelThreshold(0, 0, 1, sLong, false);
        }

        // Reference φ_th = 0, so V_bi = barrierHeightV and δ = ψ_L − φ_th.
        double d = barrierHeightV;
        var h = new Hyperbolic(lengthRatio);
        double G(double delta) => MinimumCore(d - delta, drainVoltageV, h, delta).PotentialV;
        if (!BrentRootFinder.TrySolve(G, -BracketWidthV, 0, RootToleranceV, out double deltaStar))
        {
            return new ShortChannelThreshold(double.NaN, double.NaN, double.NaN, double.NaN, true);
        }

        double slope = SlopeCore(d - deltaStar, drainVoltageV, h);
        return new ShortChannelThreshold(longChannelIdeality * deltaStar, deltaStar, slope, sLong / slope, false);
    }

    /// <summary>
    /// The same root as <see cref="Threshold"/> (B.5) in closed form: squaring ψ_min(ψ_L*) = φ_th gives a quadratic in
    /// δ = ψ_L* − φ_th whose barrier-carrying root is δ* = −[2d + V_DS + 2 cosh(ℓ/2)·√(d(d + V_DS))]/(2 sinh²(ℓ/2)),
    /// d = V_bi − φ_th; the slope is ∂ψ_min/∂ψ_L = 1 − (A + B)(cosh ℓ − 1)/(sinh²ℓ·(−δ*)). Falls back to the Brent
    /// solution of <see cref="Threshold"/> whenever the closed form is not the unique root in [φ_th − 5 V, φ_th]
    /// (second admissible root, long channel, root outside the bracket), so it always returns what Threshold returns.
    /// </summary>
    /// <param name="barrierHeightV">V_bi − φ_th in V; finite and &gt; 0.</param>
    /// <param name="drainVoltageV">V_DS in V; finite and ≥ 0.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <param name="longChannelIdeality">n_long; finite and ≥ 1.</param>
    /// <returns>The shift, slope and swing, as <see cref="Threshold"/>.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static ShortChannelThreshold ThresholdClosedForm(double barrierHeightV, double drainVoltageV, double lengthRatio, double longChannelIdeality = 1.0)
    {
        bool usable = double.IsFinite(lengthRatio) && lengthRatio > 0.05 && lengthRatio <= MaxLengthRatio;
        return ThresholdClosedForm(
            barrierHeightV, drainVoltageV, lengthRatio, longChannelIdeality,
            usable ? Math.Sinh(0.5 * lengthRatio) : double.NaN, usable ? Math.Cosh(0.5 * lengthRatio) : double.NaN);
    }

    /// <summary><see cref="ThresholdClosedForm(double, double, double, double)"/> with sinh(ℓ/2) and cosh(ℓ/2) given (NaN: use Brent).</summary>
    internal static ShortChannelThreshold ThresholdClosedForm(
        double barrierHeightV, double drainVoltageV, double lengthRatio, double longChannelIdeality, double sh2, double ch2)
    {
        double d = barrierHeightV, v = drainVoltageV, ell = lengthRatio;
        if (double.IsFinite(d) && d > 0 && double.IsFinite(v) && v >= 0 && double.IsFinite(ell) && ell > 0.05
            && ell <= MaxLengthRatio && double.IsFinite(longChannelIdeality) && longChannelIdeality >= 1 && double.IsFinite(sh2))
        {
            double m = 2 * sh2 * sh2, root = 2 * ch2 * Math.Sqrt(d * (d + v));
            double deltaStar = -((2 * d) + v + root) / m;

            // The other root of the quadratic, −(2d + V_DS − 2 cosh(ℓ/2)√(d(d + V_DS)))/m, is admissible only when ≤ 0.
            bool unique = (2 * d) + v < root;
            if (unique && deltaStar > -BracketWidthV && deltaStar < 0)
            {
                double a = d - deltaStar, b = a + v, sinh = 2 * sh2 * ch2;
                double slope = 1 - ((a + b) * m / (sinh * sinh * -deltaStar));
                double sLong = longChannelIdeality * PhysicalConstants.ThermalVoltageV * Math.Log(10);
                return new ShortChannelThreshold(longChannelIdeality * deltaStar, deltaStar, slope, sLong / slope, false);
            }
        }

        return Threshold(barrierHeightV, drainVoltageV, lengthRatio, longChannelIdeality);
    }

    /// <summary>
    /// DIBL = −[ΔV_T,SCE(V_DS,hi) − ΔV_T,SCE(V_DS,lo)]/(V_DS,hi − V_DS,lo) (B.5), in V/V; NaN when either point punches through.
    /// </summary>
    /// <param name="barrierHeightV">V_bi − φ_th in V; finite and &gt; 0.</param>
    /// <param name="drainVoltageLowV">V_DS,lo in V; finite and ≥ 0.</param>
    /// <param name="drainVoltageHighV">V_DS,hi in V; finite and &gt; V_DS,lo.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <param name="longChannelIdeality">n_long; finite and ≥ 1.</param>
    /// <returns>DIBL in V/V (multiply by 1000 for mV/V).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static double Dibl(double barrierHeightV, double drainVoltageLowV, double drainVoltageHighV, double lengthRatio, double longChannelIdeality = 1.0)
    {
        if (!(drainVoltageHighV > drainVoltageLowV))
        {
            throw new ArgumentOutOfRangeException(nameof(drainVoltageHighV), drainVoltageHighV, "Must exceed the low drain voltage.");
        }

        double lo = Threshold(barrierHeightV, drainVoltageLowV, lengthRatio, longChannelIdeality).ShiftV;
        double hi = Threshold(barrierHeightV, drainVoltageHighV, lengthRatio, longChannelIdeality).ShiftV;
        return -(hi - lo) / (drainVoltageHighV - drainVoltageLowV);
    }

    /// <summary>
    /// Liu et al. (1993) leading order, ΔV_T ≈ −[2(V_bi − φ_th) + V_DS]·[e^{−ℓ/2} + 2e^{−ℓ}] (B.5; formula [M]), in V.
    /// Cross-check only: it is linear in V_DS and overestimates the roll-off at large V_DS.
    /// </summary>
    /// <param name="barrierHeightV">V_bi − φ_th in V; finite.</param>
    /// <param name="drainVoltageV">V_DS in V; finite and ≥ 0.</param>
    /// <param name="lengthRatio">ℓ = L/λ; finite and &gt; 0.</param>
    /// <returns>ΔV_T in V (≤ 0 for a positive barrier).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of its stated range.</exception>
    public static double LiuThresholdShiftV(double barrierHeightV, double drainVoltageV, double lengthRatio)
    {
        Validate(0, barrierHeightV, drainVoltageV, lengthRatio);
        return -((2 * barrierHeightV) + drainVoltageV) * (Math.Exp(-lengthRatio / 2) + (2 * Math.Exp(-lengthRatio)));
    }

    /// <summary>Long-channel swing S_long = n_long·v_t·ln 10, in V/decade (B.5; ≈ 59.5 mV/dec at 300 K for n = 1).</summary>
    /// <param name="longChannelIdeality">n_long; finite and ≥ 1.</param>
    /// <returns>S_long in V/decade.</returns>
    public static double LongChannelSwingVPerDecade(double longChannelIdeality = 1.0) =>
        longChannelIdeality * PhysicalConstants.ThermalVoltageV * Math.Log(10);

    private static BarrierMinimum MinimumCore(double a, double vds, in Hyperbolic h, double psiL)
    {
        double b = a + vds;
        if (h.Long)
        {
            return new BarrierMinimum(psiL, true);
        }

        if (!(a > 0) || !((a * h.Cosh) - b > 0))
        {
            return new BarrierMinimum(psiL + a, false);
        }

        return new BarrierMinimum(psiL + (Math.Sqrt((2 * a * b * h.Cosh) - (a * a) - (b * b)) / h.Sinh), true);
    }

    private static double SlopeCore(double a, double vds, in Hyperbolic h)
    {
        double b = a + vds;
        if (h.Long)
        {
            return 1;
        }

        if (!(a > 0) || !((a * h.Cosh) - b > 0))
        {
            return double.NaN;
        }

        return 1 - ((a + b) * h.CoshMinusOne / (h.Sinh * Math.Sqrt((2 * a * b * h.Cosh) - (a * a) - (b * b))));
    }

    private static void Validate(double psiL, double vbi, double vds, double ell)
    {
        if (!double.IsFinite(psiL) || !double.IsFinite(vbi))
        {
            throw new ArgumentOutOfRangeException(nameof(psiL), "Potentials must be finite.");
        }

        if (!double.IsFinite(vds) || vds < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(vds), vds, "V_DS must be finite and ≥ 0.");
        }

        RequireFinitePositive(ell);
    }

    private static void RequireFinitePositive(double value)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "Must be finite and > 0.");
        }
    }

    /// <summary>sinh ℓ, cosh ℓ and cosh ℓ − 1 = 2 sinh²(ℓ/2) (without cancellation), computed once per ℓ.</summary>
    private readonly struct Hyperbolic
    {
        public Hyperbolic(double ell)
        {
            Long = ell > MaxLengthRatio;
            Sinh = Math.Sinh(ell);
            Cosh = Math.Cosh(ell);
            double s2 = Math.Sinh(ell / 2);
            CoshMinusOne = 2 * s2 * s2;
        }

        public bool Long { get; }

        public double Sinh { get; }

        public double Cosh { get; }

        public double CoshMinusOne { get; }
    }
}
