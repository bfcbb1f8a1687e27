using FinWatch.Physics;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// The geometry derived on ingest (docs/model.md §A); each value is null when an input it needs was not measured.
/// </summary>
public readonly record struct DerivedFin(
    double? TaperDeg, double? MidWidthNm, double? AreaNm2, double? GatedPerimeterNm, double? MaxCornerRadiusNm, GeometryFlags Flags)
{
    /// <summary>Derives what the measured values allow: taper and maximum radius need both widths and the height;
    /// mid width needs both widths; area and perimeter also need the corner radius.</summary>
    public static DerivedFin From(double? topWidthNm, double? bottomWidthNm, double? finHeightNm, double? cornerRadiusNm, GateFaces faces)
    {
        if (topWidthNm is not { } wt || bottomWidthNm is not { } wb)
        {
            return default;
        }

        var mid = FinCrossSection.MidHeightWidthNm(wt, wb);
        if (finHeightNm is not { } h)
        {
            return new DerivedFin(null, mid, null, null, null, wt > wb ? GeometryFlags.ReEntrant : GeometryFlags.None);
        }

        var theta = FinCrossSection.TaperAngleRad(wt, wb, h);
        var rMax = FinCrossSection.MaxCornerRadiusNm(wt, theta);
        var flags = wt > wb ? GeometryFlags.ReEntrant : GeometryFlags.None;
        if (cornerRadiusNm is not { } r)
        {
            return new DerivedFin(theta * (180.0 / Math.PI), mid, null, null, rMax, flags);
        }

        var g = FinCrossSection.Derive(new FinProfile(wt, wb, h, r), faces);
        return new DerivedFin(g.TaperDeg, g.MidWidthNm, g.AreaNm2, g.GatedPerimeterNm, g.MaxCornerRadiusNm, g.Flags);
    }
}
