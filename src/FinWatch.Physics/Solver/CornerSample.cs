namespace FinWatch.Physics.Solver;

/// <summary>
/// Corner population at one depth below the surface (docs/model.md §F.6, D.2): the electron density on the
/// right top-corner bisector and at mid-sidewall, both at depth <see cref="DepthNm"/>, from bilinear interpolation of ψ.
/// </summary>
/// <param name="DepthNm">Depth d below the surface, in nm.</param>
/// <param name="CornerDensityCm3">n at the corner point, in cm⁻³.</param>
/// <param name="SidewallDensityCm3">n at the mid-sidewall point (y = H/2), in cm⁻³.</param>
public readonly record struct CornerSample(double DepthNm, double CornerDensityCm3, double SidewallDensityCm3)
{
    /// <summary>n_corner/n_side (dimensionless).</summary>
    public double Ratio => CornerDensityCm3 / SidewallDensityCm3;

    /// <summary>Local corner lowering v_t·ln(n_c/n_s), in V (D.2).</summary>
    public double LoweringV => SolverConstants.ThermalVoltageV * Math.Log(Ratio);
}
