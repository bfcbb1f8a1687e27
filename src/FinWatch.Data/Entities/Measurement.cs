namespace FinWatch.Data.Entities;

/// <summary>
/// One measured site, with the values derived from it on ingest. Lengths are nm, angles degrees,
/// positions mm from the wafer centre, times UTC epoch milliseconds (SQLite cannot order DateTimeOffset).
/// </summary>
public sealed class Measurement
{
    public long Id { get; set; }
    public long BatchId { get; set; }

    public required string LotId { get; set; }
    public int WaferSlot { get; set; }
    public required string SiteId { get; set; }
    public double SiteXMm { get; set; }
    public double SiteYMm { get; set; }
    public int ProductId { get; set; }
    public required string Step { get; set; }
    public string? EtchTool { get; set; }
    public string? EtchChamber { get; set; }
    public string? LinerTool { get; set; }
    public string? LinerChamber { get; set; }
    public string? MetrologyTool { get; set; }
    public string? Operator { get; set; }
    public long MeasuredAtMs { get; set; }

    public double? TopWidthNm { get; set; }
    public double? BottomWidthNm { get; set; }
    public double? FinHeightNm { get; set; }
    public double? CornerRadiusNm { get; set; }
    public double? LinerThicknessNm { get; set; }

    public double? TaperDeg { get; set; }
    public double? MidWidthNm { get; set; }
    public double? AreaNm2 { get; set; }
    public double? GatedPerimeterNm { get; set; }
    public double? MaxCornerRadiusNm { get; set; }

    /// <summary>Predicted shifts against the product's nominal fin (engineering estimate, docs/model.md §G.2), in mV, mV/dec
    /// and mV/V; null when the profile lacks an input the model needs.</summary>
    public double? DeltaVtLinMv { get; set; }
    public double? DeltaVtSatMv { get; set; }
    public double? DeltaSwingLinMvPerDec { get; set; }
    public double? DeltaDiblMvPerV { get; set; }

    /// <summary>The parameter set and code version that made the prediction (<see cref="ModelStamp"/>).</summary>
    public int? ModelStampId { get; set; }

    /// <summary>Consistency flags (bit 1: re-entrant profile, bit 2: radius larger than the top allows).</summary>
    public int Flags { get; set; }
}
