namespace FinWatch.Physics;

/// <summary>
/// Derived cross-section quantities of one <see cref="FinProfile"/>, as returned by
/// <see cref="FinCrossSection.Derive(in FinProfile, GateFaces)"/> (docs/model.md §A.1–A.4, A.7).
/// </summary>
/// <param name="TaperDeg">
/// θ: sidewall angle from vertical, in degrees, per sidewall; positive when the fin is wider at its foot,
/// negative for a re-entrant fin; always in (−90°, 90°).
/// </param>
/// <param name="MidWidthNm">w_mid = (W_t + W_b)/2: the straight-sidewall width at mid-height (A.3), in nm.</param>
/// <param name="AreaNm2">Area of the rounded-top trapezoid (A.4) with the radius actually used, in nm².</param>
/// <param name="GatedPerimeterNm">
/// Gated perimeter with the radius actually used, in nm: top + corner arcs + sidewalls for
/// <see cref="GateFaces.TriGate"/>, the two straight sidewall segments only for <see cref="GateFaces.DoubleGate"/>.
/// </param>
/// <param name="MaxCornerRadiusNm">
/// The largest radius this profile can hold, in nm: the A.4 limit r_max = (W_t/2)·tan(π/4 + θ/2), further
/// limited by the sidewall length (t ≤ H/cos θ), which only binds for fins wider than about twice their height.
/// </param>
/// <param name="CornerRadiusUsedNm">min(r, <paramref name="MaxCornerRadiusNm"/>), in nm: the radius used for area, perimeter and the inside test.</param>
/// <param name="Flags">Conditions found (<see cref="GeometryFlags"/>); <see cref="GeometryFlags.None"/> for a normal fin.</param>
public readonly record struct FinGeometry(
    double TaperDeg,
    double MidWidthNm,
    double AreaNm2,
    double GatedPerimeterNm,
    double MaxCornerRadiusNm,
    double CornerRadiusUsedNm,
    GeometryFlags Flags);
