namespace FinWatch.Physics.Analytic;

/// <summary>
/// Everything the slice model (E.1–E.4) needs for one fin: geometry, dielectric, channel and calibration inputs.
/// Lengths in nm, doping in cm⁻³, sheet density in cm⁻², potentials in V.
/// </summary>
/// <param name="Profile">Straight-sidewall trapezoid with rounded top corners (A.1–A.4); validated by <see cref="FinCrossSection"/>.</param>
/// <param name="EotNm">t_ox as EOT in nm; finite and &gt; 0.</param>
/// <param name="Faces">Gated faces (tri-gate or hard-mask double gate, A.7).</param>
/// <param name="GateLengthNm">L_eff in nm; finite and &gt; 0.</param>
/// <param name="DrainVoltageLowV">V_DS,lin in V; finite and ≥ 0.</param>
/// <param name="DrainVoltageHighV">V_DS,sat in V; finite and &gt; V_DS,lin.</param>
/// <param name="DopingPerCm3">N_A, uniform channel doping in cm⁻³; finite and ≥ 0.</param>
/// <param name="BarrierHeightV">
/// V_bi − φ_th, the SCE prefactor of B.5 (G.3), in V; finite and &gt; 0. One value for the whole fin (the
/// calibrated constant; ≈ 0.155 V for n⁺ = 1e20 cm⁻³ and φ_th ≈ 0.44 V).
/// </param>
/// <param name="CriticalSheetDensityPerCm2">n_s,crit per gated face, in cm⁻² (default 1e11); finite and &gt; 0.</param>
/// <param name="QcMultiplier">κ_QC (default 1); finite and ≥ 0.</param>
/// <param name="Surface">Sidewall confinement surface (default (110)).</param>
/// <param name="CornerCoefficients">D.2 trend coefficients.</param>
/// <param name="SliceCount">N_s, number of horizontal slices; 200–400 (E.1).</param>
public sealed record SliceModelInput(
    FinProfile Profile,
    double EotNm,
    GateFaces Faces,
    double GateLengthNm,
    double DrainVoltageLowV,
    double DrainVoltageHighV,
    double DopingPerCm3,
    double BarrierHeightV,
    double CriticalSheetDensityPerCm2,
    double QcMultiplier,
    ConfinementSurface Surface,
    CornerCoefficients CornerCoefficients,
    int SliceCount);
