namespace FinWatch.Data.Entities;

/// <summary>A product: its nominal fin profile (nm) and its specification limits per parameter.</summary>
public sealed class Product
{
    public int Id { get; set; }

    /// <summary>Short unique code used in ingest files (column <c>product</c>).</summary>
    public required string Code { get; set; }

    public required string Name { get; set; }

    public string Description { get; set; } = "";

    /// <summary>Which faces the gate covers: tri-gate (top and sidewalls) or double-gate (hard mask on top).</summary>
    public GateFaces GateFaces { get; set; } = GateFaces.TriGate;

    public double NominalTopWidthNm { get; set; }
    public double NominalBottomWidthNm { get; set; }
    public double NominalFinHeightNm { get; set; }
    public double NominalCornerRadiusNm { get; set; }
    public double NominalLinerThicknessNm { get; set; }

    public long CreatedAtMs { get; set; }
    public long UpdatedAtMs { get; set; }

    public List<SpecLimit> Specs { get; set; } = [];
}
