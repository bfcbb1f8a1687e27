namespace FinWatch.Physics.Analytic;

/// <summary>
/// Corner-device trend coefficients of D.2: κ(ρ) = <paramref name="KappaAtSharp"/> − <paramref name="KappaSlope"/>·ρ,
/// ΔV_c0 and w_c. The defaults are TREND values [T] fitted to 2-D computations of the model's own (8 × 40 nm fin, 1 nm SiO₂),
/// not published values; recalibrate them with the production 2-D solver.
/// </summary>
/// <param name="KappaAtSharp">κ at ρ = 0 (sharp corner), dimensionless; default 0.55.</param>
/// <param name="KappaSlope">dκ/dρ magnitude, dimensionless; default 0.19.</param>
/// <param name="ResidualShiftV">ΔV_c0, undoped residual local lowering, in V; default 0.0025.</param>
/// <param name="CornerWidthNm">w_c, effective width per corner, in nm; default 0.5.</param>
public sealed record CornerCoefficients(
    double KappaAtSharp = 0.55, double KappaSlope = 0.19, double ResidualShiftV = 0.0025, double CornerWidthNm = 0.5)
{
    /// <summary>The D.2 trend defaults (κ = 0.55 − 0.19ρ, ΔV_c0 = 2.5 mV, w_c = 0.5 nm).</summary>
    public static CornerCoefficients Default { get; } = new();
}
