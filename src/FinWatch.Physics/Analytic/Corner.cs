namespace FinWatch.Physics.Analytic;

/// <summary>
/// Corner effect as two parallel sub-devices (docs/model.md §D.2): the main fin and a corner device of
/// small effective width with a locally lowered threshold. Form [D], coefficients [T] (<see cref="CornerCoefficients"/>).
/// </summary>
/// <remarks>
/// Lengths in nm, doping in cm⁻³, potentials in V. The D.2 exponential form is valid while ΔV_c ≲ 3–4 n v_t
/// (≈ 100 mV); beyond that the corner saturates into strong inversion and the charge-interpolated form of E.3
/// or the 2-D solver is needed. Under a hard mask (A.7) there are no top corners and every term is 0.
/// </remarks>
public static class Corner
{
    /// <summary>Corner current fraction f_c = 2 w_c/P_gate for both top corners (D.2); 0 for a double gate (A.7).</summary>
    /// <param name="cornerWidthNm">w_c per corner in nm; finite and ≥ 0.</param>
    /// <param name="gatedPerimeterNm">P_gate in nm (A.4); finite and &gt; 2 w_c.</param>
    /// <param name="faces">Gated faces.</param>
    /// <returns>f_c, dimensionless in [0, 1).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double CurrentFraction(double cornerWidthNm, double gatedPerimeterNm, GateFaces faces)
    {
        if (!double.IsFinite(cornerWidthNm) || cornerWidthNm < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(cornerWidthNm), cornerWidthNm, "Must be finite and ≥ 0.");
        }

        if (!double.IsFinite(gatedPerimeterNm) || gatedPerimeterNm <= 2 * cornerWidthNm)
        {
            throw new ArgumentOutOfRangeException(nameof(gatedPerimeterNm), gatedPerimeterNm, "Must be finite and > 2 w_c.");
        }

        return faces switch
        {
            GateFaces.TriGate => 2 * cornerWidthNm / gatedPerimeterNm,
            GateFaces.DoubleGate => 0,
            _ => throw new ArgumentOutOfRangeException(nameof(faces)),
        };
    }

    /// <summary>κ(ρ) = κ₀ − κ₁ρ with ρ = r/(W_t/2) clamped to [0, 1] (D.2), dimensionless.</summary>
    /// <param name="radiusNm">r in nm; finite and ≥ 0.</param>
    /// <param name="topWidthNm">W_t in nm; finite and &gt; 0.</param>
    /// <param name="coefficients">Trend coefficients.</param>
    /// <returns>κ.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A length is out of range.</exception>
    public static double Kappa(double radiusNm, double topWidthNm, CornerCoefficients coefficients)
    {
        ArgumentNullException.ThrowIfNull(coefficients);
        if (!double.IsFinite(radiusNm) || radiusNm < 0 || !double.IsFinite(topWidthNm) || topWidthNm <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(radiusNm), "Radius must be finite ≥ 0 and width finite > 0.");
        }

        double rho = Math.Clamp(radiusNm / (0.5 * topWidthNm), 0, 1);
        return coefficients.KappaAtSharp - (coefficients.KappaSlope * rho);
    }

    /// <summary>
    /// Local corner threshold lowering ΔV_c = ΔV_c0 + κ(ρ)·q N_A W_t/(2 C_ox), C_ox = ε_ox/t_ox (EOT) (D.2), in V (positive = lower V_T).
    /// </summary>
    /// <param name="radiusNm">r in nm; finite and ≥ 0.</param>
    /// <param name="topWidthNm">W_t in nm; finite and &gt; 0.</param>
    /// <param name="eotNm">t_ox as EOT in nm; finite and &gt; 0.</param>
    /// <param name="dopingPerCm3">N_A in cm⁻³; finite and ≥ 0.</param>
    /// <param name="coefficients">Trend coefficients.</param>
    /// <returns>ΔV_c in V.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double LocalLoweringV(double radiusNm, double topWidthNm, double eotNm, double dopingPerCm3, CornerCoefficients coefficients)
    {
        double kappa = Kappa(radiusNm, topWidthNm, coefficients);
        if (!double.IsFinite(eotNm) || eotNm <= 0 || !double.IsFinite(dopingPerCm3) || dopingPerCm3 < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(eotNm), "EOT must be finite > 0 and doping finite ≥ 0.");
        }

        double cox = PhysicalConstants.OxidePermittivityFPerCm / (eotNm * PhysicalConstants.CmPerNm);
        double depletion = PhysicalConstants.ElementaryChargeC * dopingPerCm3 * topWidthNm * PhysicalConstants.CmPerNm / (2 * cox);
        return coefficients.ResidualShiftV + (kappa * depletion);
    }

    /// <summary>
    /// Device threshold change from the corner sub-device with equal swing, ΔV_T,corner = −n v_t·ln[1 + f_c(exp(ΔV_c/(n v_t)) − 1)] (D.2), in V.
    /// </summary>
    /// <param name="currentFraction">f_c in [0, 1].</param>
    /// <param name="localLoweringV">ΔV_c in V; finite.</param>
    /// <param name="ideality">n (slope factor); finite and &gt; 0.</param>
    /// <returns>ΔV_T,corner in V (≤ 0 for ΔV_c ≥ 0).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double ThresholdShiftV(double currentFraction, double localLoweringV, double ideality)
    {
        if (!(currentFraction >= 0 && currentFraction <= 1) || !double.IsFinite(localLoweringV) || !double.IsFinite(ideality) || ideality <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(currentFraction), "f_c must be in [0, 1], ΔV_c finite and n finite > 0.");
        }

        double nvt = ideality * PhysicalConstants.ThermalVoltageV;
        return -nvt * Math.Log(1 + (currentFraction * double.ExpM1(localLoweringV / nvt)));
    }
}
