namespace FinWatch.Server.Features.Lots;

public sealed record LotSummaryResponse(
    string LotId, string Step, string Product, DateTime FirstMeasuredAt, DateTime LastMeasuredAt,
    int WaferCount, int SiteCount, IReadOnlyList<string> Chambers);

public sealed record LotPageResponse(int Page, int PageSize, int Total, IReadOnlyList<LotSummaryResponse> Items);

/// <summary>
/// One measured site with its derived values; lengths nm, angles degrees, positions mm, area nm²; the predicted threshold
/// shifts (mV, an engineering estimate from the profile) under the parameter set in force when it was stored.
/// </summary>
public sealed record SiteResponse(
    string SiteId, double SiteXMm, double SiteYMm, DateTime MeasuredAt,
    string? EtchTool, string? EtchChamber, string? LinerTool, string? LinerChamber, string? MetrologyTool, string? Operator,
    double? TopWidthNm, double? BottomWidthNm, double? FinHeightNm, double? CornerRadiusNm, double? LinerThicknessNm,
    double? TaperDeg, double? MidWidthNm, double? AreaNm2, double? GatedPerimeterNm, double? MaxCornerRadiusNm,
    IReadOnlyList<string> Flags, long BatchId, double? DeltaVtLinMv, double? DeltaVtSatMv);

public sealed record WaferResponse(int WaferSlot, IReadOnlyList<SiteResponse> Sites);

public sealed record LotStepResponse(string Step, IReadOnlyList<WaferResponse> Wafers);

public sealed record LotResponse(string LotId, string Product, IReadOnlyList<LotStepResponse> Steps);
