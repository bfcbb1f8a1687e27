namespace FinWatch.Server.Features.Measurements;

/// <summary>A validated site row, ready to store: identity, context, measured values (nm) and the derived fin geometry.</summary>
public sealed class SiteRecord
{
    public int Row { get; init; }
    public required string LotId { get; init; }
    public int WaferSlot { get; init; }
    public required string SiteId { get; init; }
    public double SiteXMm { get; init; }
    public double SiteYMm { get; init; }
    public int ProductId { get; init; }
    public required string Step { get; init; }
    public string? EtchTool { get; init; }
    public string? EtchChamber { get; init; }
    public string? LinerTool { get; init; }
    public string? LinerChamber { get; init; }
    public string? MetrologyTool { get; init; }
    public string? Operator { get; init; }
    public long MeasuredAtMs { get; init; }
    public double? TopWidthNm { get; init; }
    public double? BottomWidthNm { get; init; }
    public double? FinHeightNm { get; init; }
    public double? CornerRadiusNm { get; init; }
    public double? LinerThicknessNm { get; init; }
    public DerivedFin Derived { get; init; }
    /// <summary>Set by the ingest after validation (see <see cref="RowValidator.Predict"/>).</summary>
    public PredictedShifts? Predicted { get; set; }
}
