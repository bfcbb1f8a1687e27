namespace FinWatch.Physics.Analytic;

/// <summary>
/// A versioned per-product calibration parameter set (docs/model.md §G.3), including the product's
/// nominal fin against which every prediction is reported (G.2 step 6). Lengths in nm, doping in cm⁻³,
/// potentials in V. Defaults are the physics defaults of docs/model.md §G.3, uncalibrated.
/// </summary>
/// <remarks>Immutable; the <see cref="ThresholdModel"/> built from it caches the nominal evaluation.</remarks>
public sealed record CalibrationParameters
{
    /// <summary>Parameter-set name (for the prediction stamp).</summary>
    public required string Name { get; init; }

    /// <summary>Parameter-set version string (for the prediction stamp).</summary>
    public required string Version { get; init; }

    /// <summary>The product's nominal fin (profile, EOT, physical thickness, gated faces).</summary>
    public required FinMeasurement Nominal { get; init; }

    /// <summary>L_eff, effective electrical gate length in nm (sets L/λ); default 20.</summary>
    public double GateLengthNm { get; init; } = 20;

    /// <summary>V_DS of the linear threshold, in V; default 0.05.</summary>
    public double DrainVoltageLinV { get; init; } = 0.05;

    /// <summary>V_DS of the saturation threshold, in V; default 0.75.</summary>
    public double DrainVoltageSatV { get; init; } = 0.75;

    /// <summary>N_A, channel doping in cm⁻³; default 1e17 (≤ 1e18 is the H.1 range).</summary>
    public double DopingPerCm3 { get; init; } = 1e17;

    /// <summary>V_bi of source/drain in V (intrinsic-level reference); default v_t·ln(1e20/nᵢ) ≈ 0.595 V (B.5).</summary>
    public double BuiltInPotentialV { get; init; } = BuiltInPotentialFromDopingV(1e20);

    /// <summary>
    /// φ_th, the long-channel potential at threshold (B.5), in V. When null (default) it is the undoped
    /// volume-inversion value at the nominal mid width, v_t·ln(n_th/nᵢ) with n_th = 2 n_s,crit/w_mid (≈ 0.44 V).
    /// </summary>
    public double? ThresholdPotentialV { get; init; }

    /// <summary>V_bi − φ_th fitted directly (G.3), in V; when set it replaces <see cref="BuiltInPotentialV"/> − φ_th.</summary>
    public double? BarrierHeightOverrideV { get; init; }

    /// <summary>
    /// The SCE prefactor V_bi − φ_th used for every slice (B.5, G.3), in V: <see cref="BarrierHeightOverrideV"/>
    /// if set, else <see cref="BuiltInPotentialV"/> − φ_th.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">The nominal's widths are invalid.</exception>
    public double BarrierHeightV => BarrierHeightOverrideV ?? (BuiltInPotentialV - (ThresholdPotentialV
        ?? SliceModel.VolumeInversionPotentialV(
            FinCrossSection.MidHeightWidthNm(Nominal.Profile.TopWidthNm, Nominal.Profile.BottomWidthNm), 0, CriticalSheetDensityPerCm2)));

    /// <summary>n_s,crit per gated face, in cm⁻²; default 1e11 (F.6).</summary>
    public double CriticalSheetDensityPerCm2 { get; init; } = 1e11;

    /// <summary>κ_QC multiplier on ΔV_T,QC; default 1 (C.4).</summary>
    public double QcMultiplier { get; init; } = 1;

    /// <summary>Sidewall confinement surface; default (110) (C.2).</summary>
    public ConfinementSurface Surface { get; init; } = ConfinementSurface.Si110;

    /// <summary>Corner trend coefficients κ(ρ), ΔV_c0, w_c (D.2); default <see cref="CornerCoefficients.Default"/>.</summary>
    public CornerCoefficients CornerCoefficients { get; init; } = CornerCoefficients.Default;

    /// <summary>Constant V_T offset in V (work function etc.); it cancels in every reported difference. Default 0.</summary>
    public double ThresholdOffsetV { get; init; }

    /// <summary>Number of slices N_s, 200–400 (E.1); default 200 (200 and 400 agree within 0.001 mV at the G.4 nominal).</summary>
    public int SliceCount { get; init; } = 200;

    /// <summary>Non-degenerate built-in potential v_t·ln(N_SD/nᵢ) in V (B.5); 0.595 V at 1e20 cm⁻³.</summary>
    /// <param name="sourceDrainDopingPerCm3">N_SD in cm⁻³; finite and &gt; nᵢ.</param>
    /// <returns>V_bi in V.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The doping is not finite or not above nᵢ.</exception>
    public static double BuiltInPotentialFromDopingV(double sourceDrainDopingPerCm3)
    {
        if (!double.IsFinite(sourceDrainDopingPerCm3) || sourceDrainDopingPerCm3 <= PhysicalConstants.IntrinsicDensityPerCm3)
        {
            throw new ArgumentOutOfRangeException(nameof(sourceDrainDopingPerCm3), sourceDrainDopingPerCm3, "Must be finite and > nᵢ.");
        }

        return PhysicalConstants.ThermalVoltageV * Math.Log(sourceDrainDopingPerCm3 / PhysicalConstants.IntrinsicDensityPerCm3);
    }

    /// <summary>Builds the slice-model input for a fin under this parameter set, with optional L_eff and N_A overrides.</summary>
    /// <param name="fin">The fin.</param>
    /// <param name="gateLengthNm">L_eff in nm, or null for <see cref="GateLengthNm"/>.</param>
    /// <param name="dopingPerCm3">N_A in cm⁻³, or null for <see cref="DopingPerCm3"/>.</param>
    /// <returns>The input record (validated when evaluated).</returns>
    public SliceModelInput ToSliceInput(in FinMeasurement fin, double? gateLengthNm = null, double? dopingPerCm3 = null) =>
        new(fin.Profile, fin.EotNm, fin.Faces, gateLengthNm ?? GateLengthNm, DrainVoltageLinV, DrainVoltageSatV,
            dopingPerCm3 ?? DopingPerCm3, BarrierHeightV, CriticalSheetDensityPerCm2,
            QcMultiplier, Surface, CornerCoefficients, SliceCount);
}
