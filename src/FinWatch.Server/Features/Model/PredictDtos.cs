using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Model;

/// <summary>POST /api/model/predict: a measured profile of a product; its shifts against that product's nominal fin.</summary>
public sealed record PredictRequest
{
    [JsonPropertyName("product")] public string? Product { get; init; }
    [JsonPropertyName("topWidthNm")] public double? TopWidthNm { get; init; }
    [JsonPropertyName("bottomWidthNm")] public double? BottomWidthNm { get; init; }
    [JsonPropertyName("heightNm")] public double? HeightNm { get; init; }
    [JsonPropertyName("cornerRadiusNm")] public double? CornerRadiusNm { get; init; }

    /// <summary>Gate dielectric as EOT; the product's model EOT when not given.</summary>
    [JsonPropertyName("eotNm")] public double? EotNm { get; init; }

    /// <summary>Optional random metrology errors (1 σ, nm) of the measured inputs, propagated to σ of ΔVT (G.4).</summary>
    [JsonPropertyName("metrologySd")] public MetrologySdRequest? MetrologySd { get; init; }
}

/// <summary>1 σ random errors of the measured profile, nm; an omitted one counts as 0.</summary>
public sealed record MetrologySdRequest
{
    [JsonPropertyName("topWidthNm")] public double? TopWidthNm { get; init; }
    [JsonPropertyName("bottomWidthNm")] public double? BottomWidthNm { get; init; }
    [JsonPropertyName("heightNm")] public double? HeightNm { get; init; }
    [JsonPropertyName("cornerRadiusNm")] public double? CornerRadiusNm { get; init; }
}

/// <summary>σ of the predicted ΔVT from the metrology errors, mV (linearised at the nominal).</summary>
public sealed record ShiftUncertaintyResponse(
    [property: JsonPropertyName("deltaVtLinSdMv")] double DeltaVtLinSdMv,
    [property: JsonPropertyName("deltaVtSatSdMv")] double DeltaVtSatSdMv);

/// <summary>How much each input moved a shift, from the sensitivity table (they sum to the linear estimate).</summary>
public sealed record ContributionsResponse(
    [property: JsonPropertyName("midWidth")] double MidWidth,
    [property: JsonPropertyName("taper")] double Taper,
    [property: JsonPropertyName("height")] double Height,
    [property: JsonPropertyName("cornerRadius")] double CornerRadius,
    [property: JsonPropertyName("dielectric")] double Dielectric,
    [property: JsonPropertyName("linearTotal")] double LinearTotal);

public sealed record PredictResponse(
    [property: JsonPropertyName("product")] string Product,
    [property: JsonPropertyName("deltaVtLinMv")] double? DeltaVtLinMv,
    [property: JsonPropertyName("deltaVtSatMv")] double? DeltaVtSatMv,
    [property: JsonPropertyName("deltaSwingLinMvPerDec")] double? DeltaSwingLinMvPerDec,
    [property: JsonPropertyName("deltaDiblMvPerV")] double? DeltaDiblMvPerV,
    [property: JsonPropertyName("contributionsLinMv")] ContributionsResponse ContributionsLinMv,
    [property: JsonPropertyName("contributionsSatMv")] ContributionsResponse ContributionsSatMv,
    [property: JsonPropertyName("warnings")] IReadOnlyList<string> Warnings,
    [property: JsonPropertyName("uncertainty")] ShiftUncertaintyResponse? Uncertainty,
    [property: JsonPropertyName("parameterSet")] string ParameterSet,
    [property: JsonPropertyName("parameterSetVersion")] string ParameterSetVersion,
    [property: JsonPropertyName("codeVersion")] string CodeVersion,
    [property: JsonPropertyName("note")] string Note);

public sealed record SensitivityRowResponse(
    [property: JsonPropertyName("input")] string Input,
    [property: JsonPropertyName("unit")] string Unit,
    [property: JsonPropertyName("dVtLinMv")] double DVtLinMv,
    [property: JsonPropertyName("dVtSatMv")] double DVtSatMv,
    [property: JsonPropertyName("dSwingLinMvPerDec")] double DSwingLinMvPerDec,
    [property: JsonPropertyName("dDiblMvPerV")] double DDiblMvPerV);

public sealed record SensitivitiesResponse(
    [property: JsonPropertyName("product")] string Product,
    [property: JsonPropertyName("rows")] IReadOnlyList<SensitivityRowResponse> Rows,
    [property: JsonPropertyName("parameterSet")] string ParameterSet,
    [property: JsonPropertyName("parameterSetVersion")] string ParameterSetVersion,
    [property: JsonPropertyName("codeVersion")] string CodeVersion,
    [property: JsonPropertyName("note")] string Note);
