namespace FinWatch.Server.Features.Model.Calibrations;

/// <summary>A fitted calibration parameter (G.3) with its posterior standard deviation and the prior it was pulled towards.</summary>
public sealed record FittedParameterResponse(
    string Name,
    string Unit,
    double Value,
    double Sd,
    double Prior,
    double PriorSd);

/// <summary>One wafer of the fit: its electrical test, its mean measured fin, and the fitted thresholds.</summary>
public sealed record CalibrationWaferResponse(
    string LotId,
    int WaferSlot,
    DateTimeOffset TestedAt,
    double VtLinV,
    double VtSatV,
    double MeanTopWidthNm,
    double MeanBottomWidthNm,
    double MeanFinHeightNm,
    double MeanCornerRadiusNm,
    int Sites,
    double FittedVtLinV,
    double FittedVtSatV,
    double ResidualLinMv,
    double ResidualSatMv);

/// <summary>
/// A calibration: the product, the stored version (null for a preview), the fitted parameters, the fit quality
/// (root-mean-square threshold residual with the physics defaults and with the fit), who, when and why.
/// </summary>
public sealed record CalibrationResponse(
    string Product,
    int? Version,
    bool Stored,
    IReadOnlyList<FittedParameterResponse> Parameters,
    int Observations,
    int Iterations,
    double RmsResidualBeforeMv,
    double RmsResidualAfterMv,
    double MeasurementSdMv,
    DateTimeOffset CreatedAt,
    string CreatedBy,
    string Reason,
    string? SourceName,
    string ParameterSet,
    string ParameterSetVersion,
    string CodeVersion,
    IReadOnlyList<CalibrationWaferResponse>? Wafers,
    string Caution);

/// <summary>The calibrations of a product, newest first; the first is the one predictions use.</summary>
public sealed record CalibrationHistoryResponse(
    string Product,
    IReadOnlyList<CalibrationResponse> Calibrations,
    string Caution);
