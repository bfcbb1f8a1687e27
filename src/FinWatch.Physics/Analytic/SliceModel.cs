namespace FinWatch.Physics.Analytic;

/// <summary>
/// Tapered fin as parallel horizontal slices (docs/model.md §E.1–E.4): each slice is a local double
/// gate with its own long-channel threshold, quantum-confinement shift and short-channel shift; the device
/// threshold is the constant-current "soft minimum" over the slices plus the D.2 corner device.
/// </summary>
/// <remarks>
/// Lengths in nm, doping in cm⁻³, potentials in V. Subthreshold exponential sub-devices (E.2); the E.3
/// charge-interpolated form for sub-devices in strong inversion is not implemented, so the result is valid
/// while the corner lowering ΔV_c ≲ 100 mV. Vertical coupling between slices is ignored apart from λ_H (E.1).
/// </remarks>
public static class SliceModel
{
    /// <summary>Smallest slice count allowed (E.1).</summary>
    public const int MinSliceCount = 200;

    /// <summary>Largest slice count allowed (E.1).</summary>
    public const int MaxSliceCount = 400;

    private const int WeffPanels = 4;

    /// <summary>
    /// W_eff(w, N_A) = ∫_{−w/2}^{w/2} exp(−a((w/2)² − x²)) dx, a = q N_A/(2 ε_Si v_t) (E.1), in nm; exactly w when N_A = 0.
    /// </summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0.</param>
    /// <param name="dopingPerCm3">N_A in cm⁻³; finite and ≥ 0.</param>
    /// <returns>W_eff in nm (≤ w).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double EffectiveWidthNm(double widthNm, double dopingPerCm3)
    {
        RequirePositive(widthNm);
        RequireNonNegative(dopingPerCm3);
        if (dopingPerCm3 == 0)
        {
            return widthNm;
        }

        // a in nm⁻²: q N_A/(2 ε_Si v_t) is in cm⁻²; ×1e-14 converts.
        double a = PhysicalConstants.ElementaryChargeC * dopingPerCm3
            / (2 * PhysicalConstants.SiliconPermittivityFPerCm * PhysicalConstants.ThermalVoltageV) * 1e-14;
        double half = 0.5 * widthNm;
        return 2 * Quadrature.GaussLegendre(x => Math.Exp(-a * ((half * half) - (x * x))), 0, half, WeffPanels);
    }

    /// <summary>
    /// Long-channel potential at threshold, φ_th(w) = v_t·ln(2 n_s,crit/(nᵢ W_eff)) (the volume-inversion term of E.1), in V.
    /// </summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0.</param>
    /// <param name="dopingPerCm3">N_A in cm⁻³; finite and ≥ 0.</param>
    /// <param name="criticalSheetDensityPerCm2">n_s,crit per gated face in cm⁻²; finite and &gt; 0.</param>
    /// <returns>φ_th in V (≈ 0.44 V for an undoped 8 nm fin at 1e11 cm⁻²).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double VolumeInversionPotentialV(double widthNm, double dopingPerCm3, double criticalSheetDensityPerCm2)
    {
        RequirePositive(criticalSheetDensityPerCm2);
        double weffCm = EffectiveWidthNm(widthNm, dopingPerCm3) * PhysicalConstants.CmPerNm;
        return PhysicalConstants.ThermalVoltageV
            * Math.Log(2 * criticalSheetDensityPerCm2 / (PhysicalConstants.IntrinsicDensityPerCm3 * weffCm));
    }

    /// <summary>
    /// Long-channel slice threshold V_T,long(w) = v_t·ln(2 n_s,crit/(nᵢ W_eff)) + q N_A w/(2 C_ox), C_ox = ε_ox/EOT (E.1), in V,
    /// relative to the gate's Δφ. Classical and fully depleted.
    /// </summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0.</param>
    /// <param name="eotNm">EOT in nm; finite and &gt; 0.</param>
    /// <param name="dopingPerCm3">N_A in cm⁻³; finite and ≥ 0.</param>
    /// <param name="criticalSheetDensityPerCm2">n_s,crit per gated face in cm⁻²; finite and &gt; 0.</param>
    /// <returns>V_T,long in V.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double LongChannelThresholdV(double widthNm, double eotNm, double dopingPerCm3, double criticalSheetDensityPerCm2)
    {
        RequirePositive(eotNm);
        return VolumeInversionPotentialV(widthNm, dopingPerCm3, criticalSheetDensityPerCm2)
            + DepletionTermV(widthNm, eotNm, dopingPerCm3);
    }

    /// <summary>
    /// Constant-current effective threshold (E.2): the V solving Σ_k g_k·exp((V − V_T,k)/(n_k v_t)) = 1 with weights g_k
    /// summing to 1, by Brent on ln of the left side over [min V_T,k − 1 nV, max V_T,k + 1 nV], in V.
    /// </summary>
    /// <param name="thresholdsV">V_T,k in V; finite.</param>
    /// <param name="idealities">n_k (&gt; 0), same length.</param>
    /// <param name="weights">g_k (≥ 0, Σ = 1 within 1e-9), same length; uniform slices have g = 1/N_s.</param>
    /// <returns>V_T,eff in V.</returns>
    /// <exception cref="ArgumentException">Lengths differ or are zero, or the weights do not sum to 1.</exception>
    public static double EffectiveThresholdV(ReadOnlySpan<double> thresholdsV, ReadOnlySpan<double> idealities, ReadOnlySpan<double> weights)
    {
        ValidateSets(thresholdsV, idealities, weights);
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        foreach (double v in thresholdsV)
        {
            lo = Math.Min(lo, v);
            hi = Math.Max(hi, v);
        }

        if (hi == lo)
        {
            return lo;
        }

        // The bracket is widened by 1 nV so that rounding in the log-sum cannot hide the sign change when the
        // thresholds are nearly equal (uniform fins).
        double[] vt = thresholdsV.ToArray(), n = idealities.ToArray(), g = weights.ToArray();
        double F(double v) => LogCurrentSum(vt, n, g, v);
        if (!BrentRootFinder.TrySolve(F, lo - 1e-9, hi + 1e-9, 1e-12, out double root))
        {
            throw new InvalidOperationException("Effective threshold not bracketed.");
        }

        return root;
    }

    /// <summary>
    /// Current-weighted effective swing S_eff = ln 10/Σ_k p_k/(n_k v_t), p_k = I_k/Σ I at V_G = V_T,eff (E.3), in V/decade.
    /// </summary>
    /// <param name="thresholdsV">V_T,k in V.</param>
    /// <param name="idealities">n_k (&gt; 0).</param>
    /// <param name="weights">g_k (Σ = 1).</param>
    /// <param name="gateVoltageV">V_G at which the current shares are taken (normally V_T,eff), in V.</param>
    /// <returns>S_eff in V/decade.</returns>
    /// <exception cref="ArgumentException">Lengths differ or are zero, or the weights do not sum to 1.</exception>
    public static double EffectiveSwingVPerDecade(ReadOnlySpan<double> thresholdsV, ReadOnlySpan<double> idealities, ReadOnlySpan<double> weights, double gateVoltageV)
    {
        ValidateSets(thresholdsV, idealities, weights);
        double vt = PhysicalConstants.ThermalVoltageV, total = 0, inverse = 0;
        for (int k = 0; k < thresholdsV.Length; k++)
        {
            double current = weights[k] * Math.Exp((gateVoltageV - thresholdsV[k]) / (idealities[k] * vt));
            total += current;
            inverse += current / (idealities[k] * vt);
        }

        return Math.Log(10) * total / inverse;
    }

    /// <summary>
    /// Closed form of E.2 for V_T(z) linear from V_a to V_a + ΔV with a common n:
    /// V_T,eff = V_a − n v_t·ln[(n v_t/ΔV)(1 − e^{−ΔV/(n v_t)})], in V. Check: V_a = 0, ΔV = 0.1 V, n = 1 gives 35.52 mV.
    /// </summary>
    /// <param name="startV">V_a in V; finite.</param>
    /// <param name="spanV">ΔV in V; finite (0 returns V_a).</param>
    /// <param name="ideality">n; finite and &gt; 0.</param>
    /// <returns>V_T,eff in V.</returns>
    public static double LinearProfileThresholdV(double startV, double spanV, double ideality)
    {
        RequirePositive(ideality);
        double nvt = ideality * PhysicalConstants.ThermalVoltageV;
        if (spanV == 0)
        {
            return startV;
        }

        double x = spanV / nvt;
        return startV - (nvt * Math.Log(-double.ExpM1(-x) / x));
    }

    /// <summary>
    /// Full slice model for one fin (E.1–E.4): N_s slices at z_i = (i + ½)H/N_s with w_i = w(z_i); per slice λ_i
    /// (1/λ_i² = 1/λ_W(w_i)² + 1/λ_H(2H)², or λ_W for a double gate), V_T,long, κ_QC·ΔV_T,QC (DOS form) and
    /// ΔV_T,SCE with n_i from B.5 at both drain voltages; the corner device of D.2 as one more parallel term with
    /// weight f_c, the top slice's n and V_T,top − ΔV_c (E.4); then V_T,eff (E.2), S_eff and DIBL_eff (E.3).
    /// </summary>
    /// <param name="input">The fin and calibration inputs.</param>
    /// <returns>Absolute thresholds, swings and DIBL; flagged with NaN values when the barrier is gone.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An input is out of its stated range.</exception>
    public static SliceModelResult Evaluate(SliceModelInput input) => Evaluate(input, null);

    /// <summary>As <see cref="Evaluate(SliceModelInput)"/>, and fills <paramref name="details"/> with every slice's width,
    /// threshold and current share in the linear regime (and the corner device last), when it is given.</summary>
    public static SliceModelResult Evaluate(SliceModelInput input, ICollection<SliceDetail>? details)
    {
        ArgumentNullException.ThrowIfNull(input);
        ValidateInput(input);
        FinProfile p = input.Profile;
        int ns = input.SliceCount;

        FinGeometry geometry = FinCrossSection.Derive(p, input.Faces);
        double fc = input.Faces == GateFaces.TriGate
            ? Corner.CurrentFraction(input.CornerCoefficients.CornerWidthNm, geometry.GatedPerimeterNm, input.Faces)
            : 0;
        int count = fc > 0 ? ns + 1 : ns;

        Span<double> baseVt = count <= 512 ? stackalloc double[count] : new double[count];
        double[] vtLo = new double[count], vtHi = new double[count], nLo = new double[count], nHi = new double[count], g = new double[count];

        double lambdaH = input.Faces == GateFaces.TriGate ? ScaleLength.TopGateNm(p.HeightNm, input.EotNm) : double.PositiveInfinity;
        double minRatio = double.PositiveInfinity;
        bool punch = false;
        double dz = p.HeightNm / ns;
        double previousLambdaW = double.NaN;
        for (int i = 0; i < ns; i++)
        {
            double w = FinCrossSection.LocalWidthNm(p, (i + 0.5) * dz);
            if (!(w > 0))
            {
                throw new ArgumentOutOfRangeException(nameof(input), "The straight-sidewall width must stay positive.");
            }

            double lambdaW = ScaleLength.DoubleGateExactNm(w, input.EotNm, previousLambdaW);
            previousLambdaW = lambdaW;
            double lambda = double.IsPositiveInfinity(lambdaH) ? lambdaW : ScaleLength.CombineNm(lambdaW, lambdaH);
            double ratio = input.GateLengthNm / lambda;
            minRatio = Math.Min(minRatio, ratio);

            double phi = VolumeInversionPotentialV(w, input.DopingPerCm3, input.CriticalSheetDensityPerCm2);
            double vLong = phi + DepletionTermV(w, input.EotNm, input.DopingPerCm3);
            double qc = QuantumConfinement.DensityOfStatesShiftV(w, input.Surface, input.QcMultiplier);
            double barrier = input.BarrierHeightV;
            ShortChannelThreshold lo = ShortChannel.Threshold(barrier, input.DrainVoltageLowV, ratio);
            ShortChannelThreshold hi = ShortChannel.Threshold(barrier, input.DrainVoltageHighV, ratio);
            punch |= lo.PunchThrough || hi.PunchThrough;
            baseVt[i] = vLong + qc;
            vtLo[i] = baseVt[i] + lo.ShiftV;
            vtHi[i] = baseVt[i] + hi.ShiftV;
            nLo[i] = 1 / lo.BarrierSlope;
            nHi[i] = 1 / hi.BarrierSlope;
            g[i] = (1 - fc) / ns;
        }

        if (punch)
        {
            return new SliceModelResult(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, minRatio, fc, true);
        }

        if (fc > 0)
        {
            // E.4: corner device with the top slice's n and V_T,top − ΔV_c.
            double dvc = Corner.LocalLoweringV(
                geometry.CornerRadiusUsedNm, p.TopWidthNm, input.EotNm, input.DopingPerCm3, input.CornerCoefficients);
            vtLo[ns] = vtLo[ns - 1] - dvc;
            vtHi[ns] = vtHi[ns - 1] - dvc;
            nLo[ns] = nLo[ns - 1];
            nHi[ns] = nHi[ns - 1];
            g[ns] = fc;
        }

        double vEffLo = EffectiveThresholdV(vtLo, nLo, g);
        double vEffHi = EffectiveThresholdV(vtHi, nHi, g);
        if (details is not null)
        {
            // E.2: slice i carries g_i·exp((V_T,eff − V_T,i)/(n_i v_t)) of the current; these shares sum to 1.
            for (int i = 0; i < count; i++)
            {
                bool corner = i == ns;
                double z = corner ? p.HeightNm : (i + 0.5) * dz;
                double w = corner ? 0 : FinCrossSection.LocalWidthNm(p, z);
                double share = g[i] * Math.Exp((vEffLo - vtLo[i]) / (nLo[i] * PhysicalConstants.ThermalVoltageV));
                details.Add(new SliceDetail(z, w, vtLo[i], share, corner));
            }
        }

        double sLo = EffectiveSwingVPerDecade(vtLo, nLo, g, vEffLo);
        double sHi = EffectiveSwingVPerDecade(vtHi, nHi, g, vEffHi);
        double dibl = -(vEffHi - vEffLo) / (input.DrainVoltageHighV - input.DrainVoltageLowV);
        return new SliceModelResult(vEffLo, vEffHi, sLo, sHi, dibl, minRatio, fc, false);
    }

    /// <summary>
    /// Parallel sub-devices in the E.3 charge-interpolated (EKV-type) form, for sub-devices that reach strong inversion
    /// inside the window: Q_k ∝ g_k·n_k v_t·ln(1 + exp((V_G − V_T,k)/(n_k v_t) + x_c,k)), x_c,k = ln(e^{q_c,k} − 1),
    /// q_c,k = N_crit/(C_g n_k v_t/q), so each sub-device carries exactly the critical charge at its own V_T,k. The
    /// threshold is where Σ Q_k equals the critical charge; S = dV_G/dlog₁₀I with I ∝ Σ Q_k (linear regime).
    /// </summary>
    /// <param name="thresholdsV">V_T,k in V; finite.</param>
    /// <param name="idealities">n_k (&gt; 0).</param>
    /// <param name="weights">g_k (≥ 0, Σ = 1), the width shares.</param>
    /// <param name="eotNm">EOT in nm for C_g = ε_ox/EOT; finite and &gt; 0.</param>
    /// <param name="criticalSheetDensityPerCm2">N_crit in cm⁻²; finite and &gt; 0 (q_c ≈ 0.18 for 1e11 and EOT 1 nm).</param>
    /// <returns>Threshold, swing at I_crit/100 and maximum swing over four decades below I_crit.</returns>
    /// <exception cref="ArgumentException">The sets are inconsistent.</exception>
    /// <exception cref="ArgumentOutOfRangeException">EOT or N_crit is out of range.</exception>
    public static ChargeInterpolatedResult ChargeInterpolated(
        ReadOnlySpan<double> thresholdsV, ReadOnlySpan<double> idealities, ReadOnlySpan<double> weights, double eotNm, double criticalSheetDensityPerCm2)
    {
        ValidateSets(thresholdsV, idealities, weights);
        RequirePositive(eotNm);
        RequirePositive(criticalSheetDensityPerCm2);
        double cg = PhysicalConstants.OxidePermittivityFPerCm / (eotNm * PhysicalConstants.CmPerNm);
        double qCritV = criticalSheetDensityPerCm2 * PhysicalConstants.ElementaryChargeC / cg;
        double t = PhysicalConstants.ThermalVoltageV;

        int m = thresholdsV.Length;
        double[] vt = thresholdsV.ToArray(), nvt = new double[m], xc = new double[m], g = weights.ToArray();
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        for (int k = 0; k < m; k++)
        {
            nvt[k] = idealities[k] * t;
            xc[k] = Math.Log(double.ExpM1(qCritV / nvt[k]));
            lo = Math.Min(lo, vt[k]);
            hi = Math.Max(hi, vt[k]);
        }

        double Charge(double v)
        {
            double q = 0;
            for (int k = 0; k < m; k++)
            {
                double u = ((v - vt[k]) / nvt[k]) + xc[k];
                q += g[k] * nvt[k] * (u > 30 ? u + Math.Log(1 + Math.Exp(-u)) : Math.Log(1 + Math.Exp(u)));
            }

            return q;
        }

        double Swing(double v)
        {
            double q = 0, dq = 0;
            for (int k = 0; k < m; k++)
            {
                double u = ((v - vt[k]) / nvt[k]) + xc[k];
                q += g[k] * nvt[k] * (u > 30 ? u + Math.Log(1 + Math.Exp(-u)) : Math.Log(1 + Math.Exp(u)));
                dq += g[k] / (1 + Math.Exp(-u));
            }

            return Math.Log(10) * q / dq;
        }

        // Σ Q_k is monotonic in V_G; at min V_T,k the charge is ≤ Q_crit and at max V_T,k it is ≥ Q_crit.
        double LogRatio(double v) => Math.Log(Charge(v) / qCritV);
        if (!BrentRootFinder.TrySolve(LogRatio, lo - 1e-9, hi + 1e-9, 1e-12, out double vT))
        {
            throw new InvalidOperationException("Charge-interpolated threshold not bracketed.");
        }

        double span = 4 * Math.Log(10) * (hi - lo + (10 * t * Max(idealities)));
        double VAt(double decadesBelow)
        {
            double target = Math.Log(qCritV) - (decadesBelow * Math.Log(10));
            double F(double v) => Math.Log(Charge(v)) - target;
            return BrentRootFinder.TrySolve(F, vT - span, vT, 1e-12, out double v)
                ? v
                : throw new InvalidOperationException("Charge level not bracketed.");
        }

        double v2 = VAt(2), v4 = VAt(4), max = 0;
        const int Steps = 400;
        for (int i = 0; i <= Steps; i++)
        {
            max = Math.Max(max, Swing(v4 + ((vT - v4) * i / Steps)));
        }

        return new ChargeInterpolatedResult(vT, Swing(v2), max);
    }

    private static double Max(ReadOnlySpan<double> values)
    {
        double max = double.NegativeInfinity;
        foreach (double v in values)
        {
            max = Math.Max(max, v);
        }

        return max;
    }

    internal static double DepletionTermV(double widthNm, double eotNm, double dopingPerCm3)
    {
        double cox = PhysicalConstants.OxidePermittivityFPerCm / (eotNm * PhysicalConstants.CmPerNm);
        return PhysicalConstants.ElementaryChargeC * dopingPerCm3 * widthNm * PhysicalConstants.CmPerNm / (2 * cox);
    }

    /// <summary>ln Σ g_k exp((v − V_k)/(n_k v_t)), evaluated with the largest exponent factored out.</summary>
    private static double LogCurrentSum(double[] vt, double[] n, double[] g, double v)
    {
        double t = PhysicalConstants.ThermalVoltageV, max = double.NegativeInfinity;
        for (int k = 0; k < vt.Length; k++)
        {
            if (g[k] > 0)
            {
                max = Math.Max(max, (v - vt[k]) / (n[k] * t));
            }
        }

        double sum = 0;
        for (int k = 0; k < vt.Length; k++)
        {
            sum += g[k] * Math.Exp(((v - vt[k]) / (n[k] * t)) - max);
        }

        return max + Math.Log(sum);
    }

    private static void ValidateSets(ReadOnlySpan<double> vt, ReadOnlySpan<double> n, ReadOnlySpan<double> g)
    {
        if (vt.Length == 0 || vt.Length != n.Length || vt.Length != g.Length)
        {
            throw new ArgumentException("Threshold, ideality and weight sets must be non-empty and of equal length.", nameof(vt));
        }

        double sum = 0;
        for (int k = 0; k < g.Length; k++)
        {
            if (!(g[k] >= 0) || !(n[k] > 0) || !double.IsFinite(vt[k]))
            {
                throw new ArgumentException("Weights must be ≥ 0, idealities > 0 and thresholds finite.", nameof(g));
            }

            sum += g[k];
        }

        if (Math.Abs(sum - 1) > 1e-9)
        {
            throw new ArgumentException("Weights must sum to 1.", nameof(g));
        }
    }

    internal static void ValidateInput(SliceModelInput input)
    {
        RequirePositive(input.EotNm);
        RequirePositive(input.GateLengthNm);
        RequireNonNegative(input.DrainVoltageLowV);
        RequireNonNegative(input.DopingPerCm3);
        RequirePositive(input.CriticalSheetDensityPerCm2);
        ArgumentNullException.ThrowIfNull(input.CornerCoefficients);
        if (!(input.DrainVoltageHighV > input.DrainVoltageLowV) || !double.IsFinite(input.DrainVoltageHighV))
        {
            throw new ArgumentOutOfRangeException(nameof(input), "V_DS,sat must be finite and exceed V_DS,lin.");
        }

        RequirePositive(input.BarrierHeightV);

        if (input.SliceCount is < MinSliceCount or > MaxSliceCount)
        {
            throw new ArgumentOutOfRangeException(nameof(input), input.SliceCount, "Slice count must be in [200, 400].");
        }
    }

    private static void RequirePositive(double value)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "Must be finite and > 0.");
        }
    }

    private static void RequireNonNegative(double value)
    {
        if (!double.IsFinite(value) || value < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "Must be finite and ≥ 0.");
        }
    }
}
