using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Model;

/// <summary>
/// POST /api/model/cross-section: a measured or what-if fin cross-section for the 2-D Poisson–Boltzmann solver
/// (fin-model.md F). Lengths in nm. The dielectric is <c>layers</c> (innermost first) or, when absent, one SiO₂ layer of
/// <c>eotNm</c>.
/// </summary>
public sealed record CrossSectionRequest
{
    [JsonPropertyName("topWidthNm")] public double? TopWidthNm { get; init; }
    [JsonPropertyName("bottomWidthNm")] public double? BottomWidthNm { get; init; }
    [JsonPropertyName("heightNm")] public double? HeightNm { get; init; }
    [JsonPropertyName("cornerRadiusNm")] public double? CornerRadiusNm { get; init; }
    [JsonPropertyName("eotNm")] public double? EotNm { get; init; }
    [JsonPropertyName("layers")] public DielectricLayerRequest[]? Layers { get; init; }
    [JsonPropertyName("dopingCm3")] public double? DopingCm3 { get; init; }

    /// <summary>"tri" (top and sidewalls) or "double" (sidewalls only, hard mask on top).</summary>
    [JsonPropertyName("gates")] public string? Gates { get; init; }

    /// <summary>Mesh spacing, 0.1 to 1 nm (default 0.2 nm, fin-model.md F.7).</summary>
    [JsonPropertyName("gridNm")] public double? GridNm { get; init; }
}

public sealed record DielectricLayerRequest
{
    [JsonPropertyName("thicknessNm")] public double? ThicknessNm { get; init; }
    [JsonPropertyName("k")] public double? K { get; init; }
}

public sealed record CrossSectionProgress(
    [property: JsonPropertyName("stage")] string Stage,
    [property: JsonPropertyName("biasIndex")] int BiasIndex,
    [property: JsonPropertyName("biasCount")] int BiasCount,
    [property: JsonPropertyName("gateV")] double GateV,
    [property: JsonPropertyName("newtonIteration")] int NewtonIteration);

public sealed record GateSweep(
    [property: JsonPropertyName("vgV")] double[] VgV,
    [property: JsonPropertyName("electronsPerCm")] double[] ElectronsPerCm);

/// <summary>Maps at threshold on the solver grid: <c>xNm</c> across, <c>yNm</c> up; the 2-D arrays are [y][x].</summary>
public sealed record SolverMaps(
    [property: JsonPropertyName("xNm")] double[] XNm,
    [property: JsonPropertyName("yNm")] double[] YNm,
    [property: JsonPropertyName("potentialV")] double[][] PotentialV,
    [property: JsonPropertyName("electronDensityCm3")] double[][] ElectronDensityCm3);

public sealed record CrossSectionResult(
    [property: JsonPropertyName("vtV")] double? VtV,
    [property: JsonPropertyName("swingMvPerDec")] double? SwingMvPerDec,
    [property: JsonPropertyName("sweep")] GateSweep Sweep,
    [property: JsonPropertyName("maps")] SolverMaps? Maps,
    [property: JsonPropertyName("newtonIterations")] int NewtonIterations,
    [property: JsonPropertyName("limitations")] IReadOnlyList<string> Limitations);

/// <summary>A cross-section solve job: queued, running, done, failed or cancelled.</summary>
public sealed record CrossSectionJobResponse(
    [property: JsonPropertyName("id")] string Id,
    [property: JsonPropertyName("status")] string Status,
    [property: JsonPropertyName("shapeKey")] string ShapeKey,
    [property: JsonPropertyName("fromCache")] bool FromCache,
    [property: JsonPropertyName("progress")] CrossSectionProgress? Progress,
    [property: JsonPropertyName("result")] CrossSectionResult? Result,
    [property: JsonPropertyName("error")] string? Error,
    [property: JsonPropertyName("note")] string Note);
