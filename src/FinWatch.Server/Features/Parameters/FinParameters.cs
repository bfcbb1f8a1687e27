using FinWatch.Data.Entities;

namespace FinWatch.Server.Features.Parameters;

/// <summary>The catalogue of parameters that specifications, series and charts refer to by name.</summary>
public static class FinParameters
{
    public static readonly IReadOnlyList<FinParameter> All =
    [
        new("top_width_nm", "nm", "measured", "Fin top width", "Width at the top of the straight sidewall: the straight-sidewall extrapolation, not a CD taken below the rounded top", nameof(Measurement.TopWidthNm)),
        new("bottom_width_nm", "nm", "measured", "Fin bottom width", "Width at the foot of the gated fin, level with the isolation oxide top", nameof(Measurement.BottomWidthNm)),
        new("fin_height_nm", "nm", "measured", "Fin height", "Gated height above the isolation oxide", nameof(Measurement.FinHeightNm)),
        new("corner_radius_nm", "nm", "measured", "Top-corner radius", "Radius of the arc joining top and sidewall", nameof(Measurement.CornerRadiusNm)),
        new("liner_thickness_nm", "nm", "measured", "Liner thickness", "Thickness of the conformal dielectric liner", nameof(Measurement.LinerThicknessNm)),
        new("taper_deg", "°", "derived", "Sidewall taper", "Sidewall angle from vertical, per side, positive when wider at the foot: atan((Wb − Wt)/(2H))", nameof(Measurement.TaperDeg)),
        new("mid_width_nm", "nm", "derived", "Mid-height width", "(Wt + Wb)/2, the width at half height (A.3)", nameof(Measurement.MidWidthNm)),
        new("area_nm2", "nm²", "derived", "Cross-section area", "Area of the rounded trapezoid (A.4)", nameof(Measurement.AreaNm2)),
        new("gated_perimeter_nm", "nm", "derived", "Gated perimeter", "Length of the gated faces: top and sidewalls for tri-gate, sidewalls only under a hard mask (A.4, A.7)", nameof(Measurement.GatedPerimeterNm)),
        new("max_corner_radius_nm", "nm", "derived", "Largest corner radius", "The largest radius the top width allows, (Wt/2)·tan(45° + θ/2) (A.4)", nameof(Measurement.MaxCornerRadiusNm)),
        new("delta_vt_lin_mv", "mV", "predicted", "Predicted ΔVT (linear)", Estimate + "threshold shift at low drain voltage against the product's nominal fin", nameof(Measurement.DeltaVtLinMv)),
        new("delta_vt_sat_mv", "mV", "predicted", "Predicted ΔVT (saturation)", Estimate + "threshold shift at high drain voltage against the product's nominal fin", nameof(Measurement.DeltaVtSatMv)),
        new("delta_swing_lin_mv_per_dec", "mV/dec", "predicted", "Predicted Δ subthreshold swing", Estimate + "change of the linear-regime swing against the nominal", nameof(Measurement.DeltaSwingLinMvPerDec)),
        new("delta_dibl_mv_per_v", "mV/V", "predicted", "Predicted ΔDIBL", Estimate + "change of drain-induced barrier lowering against the nominal", nameof(Measurement.DeltaDiblMvPerV)),
    ];

    private const string Estimate = "Engineering estimate (not a substitute for electrical test): ";

    private static readonly Dictionary<string, FinParameter> ByName = All.ToDictionary(p => p.Name, StringComparer.Ordinal);

    private static readonly Dictionary<string, int> Positions = All.Select((p, i) => (p.Name, i)).ToDictionary(x => x.Name, x => x.i, StringComparer.Ordinal);

    /// <summary>The parameter's place in the catalogue (for listing in a stable order); unknown names sort last.</summary>
    public static int Position(string name) => Positions.TryGetValue(name, out var i) ? i : int.MaxValue;

    public static bool TryGet(string name, out FinParameter parameter) => ByName.TryGetValue(name, out parameter!);

    public static string NameList => string.Join(", ", All.Select(p => p.Name));
}
