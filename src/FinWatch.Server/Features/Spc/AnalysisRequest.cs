using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// POST /api/spc/analyses: numbers to analyse. The field names are the published analysis contract (camelCase), not the
/// snake_case of the measurement API. Give <see cref="Values"/> or <see cref="Subgroups"/>; null marks a missing entry.
/// </summary>
public sealed record AnalysisRequest
{
    [JsonPropertyName("values")] public double?[]? Values { get; init; }
    [JsonPropertyName("subgroups")] public double?[][]? Subgroups { get; init; }

    /// <summary>"I-MR", "Xbar-R" or "Xbar-S"; defaults to I-MR for values and Xbar-R for subgroups.</summary>
    [JsonPropertyName("chart")] public string? Chart { get; init; }

    /// <summary>"exact" (default) or "table".</summary>
    [JsonPropertyName("constants")] public string? Constants { get; init; }

    [JsonPropertyName("limits")] public LimitsRequest? Limits { get; init; }
    [JsonPropertyName("sigmaMultiplier")] public double? SigmaMultiplier { get; init; }
    [JsonPropertyName("rules")] public string[]? Rules { get; init; }
    [JsonPropertyName("ewma")] public EwmaRequest? Ewma { get; init; }
    [JsonPropertyName("cusum")] public CusumRequest? Cusum { get; init; }
    [JsonPropertyName("capability")] public CapabilityRequest? Capability { get; init; }
    [JsonPropertyName("percentileCapability")] public PercentileCapabilityRequest? PercentileCapability { get; init; }
    [JsonPropertyName("normality")] public bool? Normality { get; init; }
}

/// <summary>{"source":"data"}, {"source":"baseline","count":k} or {"source":"known","mean":m,"sigma":s}; optional exclusions.</summary>
public sealed record LimitsRequest
{
    [JsonPropertyName("source")] public string? Source { get; init; }
    [JsonPropertyName("count")] public int? Count { get; init; }
    [JsonPropertyName("mean")] public double? Mean { get; init; }
    [JsonPropertyName("sigma")] public double? Sigma { get; init; }

    /// <summary>Positions left out of the estimate, each with the reason (plotted and judged all the same).</summary>
    [JsonPropertyName("exclude")] public ExclusionRequest[]? Exclude { get; init; }
}

public sealed record ExclusionRequest
{
    [JsonPropertyName("index")] public int Index { get; init; }
    [JsonPropertyName("reason")] public string? Reason { get; init; }
}

public sealed record EwmaRequest
{
    [JsonPropertyName("lambda")] public double? Lambda { get; init; }
    [JsonPropertyName("L")] public double? L { get; init; }
    [JsonPropertyName("target")] public double? Target { get; init; }
    [JsonPropertyName("sigma")] public double? Sigma { get; init; }
}

public sealed record CusumRequest
{
    [JsonPropertyName("k")] public double? K { get; init; }
    [JsonPropertyName("h")] public double? H { get; init; }
    [JsonPropertyName("target")] public double? Target { get; init; }
    [JsonPropertyName("sigma")] public double? Sigma { get; init; }

    /// <summary>"sigma" (default: k and h in sigmas) or "data" (in the data's unit).</summary>
    [JsonPropertyName("units")] public string? Units { get; init; }
    [JsonPropertyName("headStart")] public double? HeadStart { get; init; }
}

public sealed record CapabilityRequest
{
    [JsonPropertyName("lsl")] public double? Lsl { get; init; }
    [JsonPropertyName("usl")] public double? Usl { get; init; }
    [JsonPropertyName("target")] public double? Target { get; init; }
    [JsonPropertyName("confidence")] public double? Confidence { get; init; }
}

public sealed record PercentileCapabilityRequest
{
    [JsonPropertyName("lsl")] public double? Lsl { get; init; }
    [JsonPropertyName("usl")] public double? Usl { get; init; }
    [JsonPropertyName("distribution")] public string? Distribution { get; init; }
}
