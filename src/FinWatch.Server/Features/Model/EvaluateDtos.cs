using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Model;

/// <summary>POST /api/model/evaluate: one device, the model's whole working (fin-model.md sections A to E).</summary>
public sealed record EvaluateRequest
{
    [JsonPropertyName("topWidthNm")] public double? TopWidthNm { get; init; }
    [JsonPropertyName("bottomWidthNm")] public double? BottomWidthNm { get; init; }
    [JsonPropertyName("heightNm")] public double? HeightNm { get; init; }
    [JsonPropertyName("cornerRadiusNm")] public double? CornerRadiusNm { get; init; }
    [JsonPropertyName("eotNm")] public double? EotNm { get; init; }
    [JsonPropertyName("gateLengthNm")] public double? GateLengthNm { get; init; }
    [JsonPropertyName("dopingCm3")] public double? DopingCm3 { get; init; }

    /// <summary>"tri", or "double" for the sidewalls only under a hard mask.</summary>
    [JsonPropertyName("gates")] public string? Gates { get; init; }

    /// <summary>Sidewall surface: "110" (the usual ⟨110⟩ fin on a (100) wafer) or "100".</summary>
    [JsonPropertyName("orientation")] public string? Orientation { get; init; }

    [JsonPropertyName("vdsLinV")] public double? VdsLinV { get; init; }
    [JsonPropertyName("vdsSatV")] public double? VdsSatV { get; init; }
}

public sealed record GeometryResponse(
    [property: JsonPropertyName("taperDeg")] double TaperDeg,
    [property: JsonPropertyName("midWidthNm")] double MidWidthNm,
    [property: JsonPropertyName("areaNm2")] double AreaNm2,
    [property: JsonPropertyName("gatedPerimeterNm")] double GatedPerimeterNm,
    [property: JsonPropertyName("maxCornerRadiusNm")] double MaxCornerRadiusNm);

public sealed record SliceResponse(
    [property: JsonPropertyName("heightNm")] double HeightNm,
    [property: JsonPropertyName("widthNm")] double? WidthNm,
    [property: JsonPropertyName("vtLinV")] double VtLinV,
    [property: JsonPropertyName("currentShare")] double CurrentShare,
    [property: JsonPropertyName("corner")] bool Corner);

public sealed record EvaluateResponse(
    [property: JsonPropertyName("geometry")] GeometryResponse Geometry,
    [property: JsonPropertyName("scaleLengthNm")] double ScaleLengthNm,
    [property: JsonPropertyName("qcShiftMv")] double QcShiftMv,
    [property: JsonPropertyName("sceShiftLinMv")] double? SceShiftLinMv,
    [property: JsonPropertyName("sceShiftSatMv")] double? SceShiftSatMv,
    [property: JsonPropertyName("vtLinV")] double? VtLinV,
    [property: JsonPropertyName("vtSatV")] double? VtSatV,
    [property: JsonPropertyName("swingLinMvPerDec")] double? SwingLinMvPerDec,
    [property: JsonPropertyName("diblMvPerV")] double? DiblMvPerV,
    [property: JsonPropertyName("slices")] IReadOnlyList<SliceResponse> Slices,
    [property: JsonPropertyName("assumptions")] IReadOnlyDictionary<string, double> Assumptions,
    [property: JsonPropertyName("warnings")] IReadOnlyList<string> Warnings,
    [property: JsonPropertyName("note")] string Note);
