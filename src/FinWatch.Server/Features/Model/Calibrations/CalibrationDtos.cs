using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Model.Calibrations;

/// <summary>A fitted calibration parameter (G.3) with its posterior standard deviation and the prior it was pulled towards.</summary>
public sealed record FittedParameterResponse(
    [property: JsonPropertyName("name")] string Name,
    [property: JsonPropertyName("unit")] string Unit,
    [property: JsonPropertyName("value")] double Value,
    [property: JsonPropertyName("sd")] double Sd,
    [property: JsonPropertyName("prior")] double Prior,
    [property: JsonPropertyName("priorSd")] double PriorSd);

/// <summary>One wafer of the fit: its electrical test, its mean measured fin, and the fitted thresholds.</summary>
public sealed record CalibrationWaferResponse(
    [property: JsonPropertyName("lotId")] string LotId,
    [property: JsonPropertyName("waferSlot")] int WaferSlot,
    [property: JsonPropertyName("testedAt")] DateTimeOffset TestedAt,
    [property: JsonPropertyName("vtLinV")] double VtLinV,
    [property: JsonPropertyName("vtSatV")] double VtSatV,
    [property: JsonPropertyName("meanTopWidthNm")] double MeanTopWidthNm,
    [property: JsonPropertyName("meanBottomWidthNm")] double MeanBottomWidthNm,
    [property: JsonPropertyName("meanFinHeightNm")] double MeanFinHeightNm,
    [property: JsonPropertyName("meanCornerRadiusNm")] double MeanCornerRadiusNm,
    [property: JsonPropertyName("sites")] int Sites,
    [property: JsonPropertyName("fittedVtLinV")] double FittedVtLinV,
    [property: JsonPropertyName("fittedVtSatV")] double FittedVtSatV,
    [property: JsonPropertyName("residualLinMv")] double ResidualLinMv,
    [property: JsonPropertyName("residualSatMv")] double ResidualSatMv);

/// <summary>
/// A calibration: the product, the stored version (null for a preview), the fitted parameters, the fit quality
/// (root-mean-square threshold residual with the physics defaults and with the fit), who, when and why.
/// </summary>
public sealed record CalibrationResponse(
    [property: JsonPropertyName("product")] string Product,
    [property: JsonPropertyName("version")] int? Version,
    [property: JsonPropertyName("stored")] bool Stored,
    [property: JsonPropertyName("parameters")] IReadOnlyList<FittedParameterResponse> Parameters,
    [property: JsonPropertyName("observations")] int Observations,
    [property: JsonPropertyName("iterations")] int Iterations,
    [property: JsonPropertyName("rmsResidualBeforeMv")] double RmsResidualBeforeMv,
    [property: JsonPropertyName("rmsResidualAfterMv")] double RmsResidualAfterMv,
    [property: JsonPropertyName("measurementSdMv")] double MeasurementSdMv,
    [property: JsonPropertyName("createdAt")] DateTimeOffset CreatedAt,
    [property: JsonPropertyName("createdBy")] string CreatedBy,
    [property: JsonPropertyName("reason")] string Reason,
    [property: JsonPropertyName("sourceName")] string? SourceName,
    [property: JsonPropertyName("parameterSet")] string ParameterSet,
    [property: JsonPropertyName("parameterSetVersion")] string ParameterSetVersion,
    [property: JsonPropertyName("codeVersion")] string CodeVersion,
    [property: JsonPropertyName("wafers")] IReadOnlyList<CalibrationWaferResponse>? Wafers,
    [property: JsonPropertyName("caution")] string Caution);

/// <summary>The calibrations of a product, newest first; the first is the one predictions use.</summary>
public sealed record CalibrationHistoryResponse(
    [property: JsonPropertyName("product")] string Product,
    [property: JsonPropertyName("calibrations")] IReadOnlyList<CalibrationResponse> Calibrations,
    [property: JsonPropertyName("caution")] string Caution);
