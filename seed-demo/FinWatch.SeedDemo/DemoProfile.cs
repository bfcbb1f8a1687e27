namespace FinWatch.SeedDemo;

/// <summary>
/// A fin cross-section of the invented demo fab: a trapezoid with rounded top corners and a conformal liner.
/// All lengths are in nm; widths are the straight-sidewall top and bottom widths.
/// </summary>
/// <param name="TopWidthNm">Top width W_t of the trapezoid.</param>
/// <param name="BottomWidthNm">Bottom (foot) width W_b.</param>
/// <param name="FinHeightNm">Active fin height H above the isolation top.</param>
/// <param name="CornerRadiusNm">Top-corner radius r.</param>
/// <param name="LinerThicknessNm">Conformal liner thickness t.</param>
public sealed record DemoProfile(
    double TopWidthNm,
    double BottomWidthNm,
    double FinHeightNm,
    double CornerRadiusNm,
    double LinerThicknessNm)
{
    /// <summary>Sidewall angle from vertical in degrees, atan((W_b − W_t) / (2H)); positive when the foot is wider.</summary>
    public double TaperDeg => Math.Atan((BottomWidthNm - TopWidthNm) / (2.0 * FinHeightNm)) * 180.0 / Math.PI;

    /// <summary>Width at mid height, (W_t + W_b) / 2, in nm.</summary>
    public double MidWidthNm => (TopWidthNm + BottomWidthNm) / 2.0;
}
