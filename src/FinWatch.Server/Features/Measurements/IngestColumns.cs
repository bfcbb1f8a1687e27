using System.Collections.Frozen;

namespace FinWatch.Server.Features.Measurements;

/// <summary>Names, order and required-ness of the ingest columns: the one place the file format is defined.</summary>
public static class IngestColumns
{
    /// <summary>Column names in the documented order; index = <see cref="IngestColumn"/> value.</summary>
    public static readonly string[] Names =
    [
        "lot_id", "wafer_slot", "site_id", "site_x_mm", "site_y_mm", "product", "step",
        "etch_tool", "etch_chamber", "liner_tool", "liner_chamber", "metrology_tool",
        "measured_at", "operator",
        "top_width_nm", "bottom_width_nm", "fin_height_nm", "corner_radius_nm", "liner_thickness_nm",
    ];

    public static int Count => Names.Length;

    /// <summary>Columns that every file must carry (the site's identity and time).</summary>
    public static readonly IngestColumn[] Required =
    [
        IngestColumn.LotId, IngestColumn.WaferSlot, IngestColumn.SiteId, IngestColumn.SiteXMm,
        IngestColumn.SiteYMm, IngestColumn.Product, IngestColumn.Step, IngestColumn.MeasuredAt,
    ];

    /// <summary>The measured values, in nm; a row needs at least one of them.</summary>
    public static readonly IngestColumn[] Values =
    [
        IngestColumn.TopWidthNm, IngestColumn.BottomWidthNm, IngestColumn.FinHeightNm,
        IngestColumn.CornerRadiusNm, IngestColumn.LinerThicknessNm,
    ];

    private static readonly FrozenDictionary<string, IngestColumn> ByName =
        Names.Select((n, i) => (n, (IngestColumn)i)).ToFrozenDictionary(p => p.n, p => p.Item2, StringComparer.Ordinal);

    public static bool TryParse(string name, out IngestColumn column) => ByName.TryGetValue(name, out column);

    public static string NameOf(IngestColumn column) => Names[(int)column];
}
