namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// The columns of the ingest format (CSV header names and JSON property names are the same).
/// The numeric value is the column's index in <see cref="RawRow.Cells"/>.
/// </summary>
public enum IngestColumn
{
    LotId,
    WaferSlot,
    SiteId,
    SiteXMm,
    SiteYMm,
    Product,
    Step,
    EtchTool,
    EtchChamber,
    LinerTool,
    LinerChamber,
    MetrologyTool,
    MeasuredAt,
    Operator,
    TopWidthNm,
    BottomWidthNm,
    FinHeightNm,
    CornerRadiusNm,
    LinerThicknessNm,
}
