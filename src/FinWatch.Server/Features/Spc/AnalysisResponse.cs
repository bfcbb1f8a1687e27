using System.Text.Json.Serialization;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// The analysis contract's answer. Indices are 0-based positions in the request, missing entries included; null means
/// undefined or not evaluable and never comes back as 0, infinity or an empty list. Parts not asked for are null.
/// </summary>
public sealed record AnalysisResponse(
    [property: JsonPropertyName("chart")] ChartResponse Chart,
    [property: JsonPropertyName("rules")] RulesResponse? Rules,
    [property: JsonPropertyName("ewma")] EwmaResponse? Ewma,
    [property: JsonPropertyName("cusum")] CusumResponse? Cusum,
    [property: JsonPropertyName("capability")] CapabilityResponse? Capability,
    [property: JsonPropertyName("normality")] NormalityResponse? Normality,
    [property: JsonPropertyName("percentileCapability")] PercentileCapabilityResponse? PercentileCapability);

/// <summary>A limit or centre line is a number when constant, or an array with one entry per point when it varies.</summary>
public sealed record ChartLineResponse(
    [property: JsonPropertyName("values")] double?[] Values,
    [property: JsonPropertyName("center")] object? Center,
    [property: JsonPropertyName("ucl")] object? Ucl,
    [property: JsonPropertyName("lcl")] object? Lcl);

public sealed record ChartResponse(
    [property: JsonPropertyName("type")] string Type,
    [property: JsonPropertyName("limitsSource")] string LimitsSource,
    [property: JsonPropertyName("constants")] string Constants,
    [property: JsonPropertyName("center")] double? Center,
    [property: JsonPropertyName("sigma")] double? Sigma,
    [property: JsonPropertyName("primary")] ChartLineResponse Primary,
    [property: JsonPropertyName("secondary")] ChartLineResponse? Secondary,
    [property: JsonPropertyName("beyondLimitsPrimary")] int[] BeyondLimitsPrimary,
    [property: JsonPropertyName("beyondLimitsSecondary")] int[] BeyondLimitsSecondary,
    [property: JsonPropertyName("excluded")] IReadOnlyList<ExclusionRequest> Excluded,
    [property: JsonPropertyName("warnings")] IReadOnlyList<string> Warnings);

public sealed record SignalResponse(
    [property: JsonPropertyName("rule")] string Rule,
    [property: JsonPropertyName("index")] int Index,
    [property: JsonPropertyName("pattern")] int[] Pattern);

/// <summary>flags: rule id → flagged indices (null when the rule could not be evaluated); first: rule id → first index or null.</summary>
public sealed record RulesResponse(
    [property: JsonPropertyName("flags")] IReadOnlyDictionary<string, IReadOnlyList<int>?> Flags,
    [property: JsonPropertyName("first")] IReadOnlyDictionary<string, int?> First,
    [property: JsonPropertyName("signals")] IReadOnlyList<SignalResponse> Signals);

public sealed record EwmaResponse(
    [property: JsonPropertyName("z")] double?[] Z,
    [property: JsonPropertyName("ucl")] double?[] Ucl,
    [property: JsonPropertyName("lcl")] double?[] Lcl,
    [property: JsonPropertyName("signals")] int[] Signals,
    [property: JsonPropertyName("target")] double Target,
    [property: JsonPropertyName("sigma")] double Sigma);

public sealed record CusumResponse(
    [property: JsonPropertyName("cPlus")] double?[] CPlus,
    [property: JsonPropertyName("cMinus")] double?[] CMinus,
    [property: JsonPropertyName("signalsUpper")] int[] SignalsUpper,
    [property: JsonPropertyName("signalsLower")] int[] SignalsLower,
    [property: JsonPropertyName("target")] double Target,
    [property: JsonPropertyName("sigma")] double Sigma);

public sealed record CapabilityResponse(
    [property: JsonPropertyName("Cp")] double? Cp,
    [property: JsonPropertyName("Cpk")] double? Cpk,
    [property: JsonPropertyName("Cpu")] double? Cpu,
    [property: JsonPropertyName("Cpl")] double? Cpl,
    [property: JsonPropertyName("Pp")] double? Pp,
    [property: JsonPropertyName("Ppk")] double? Ppk,
    [property: JsonPropertyName("Cpm")] double? Cpm,
    [property: JsonPropertyName("sigmaWithin")] double? SigmaWithin,
    [property: JsonPropertyName("sigmaOverall")] double? SigmaOverall,
    [property: JsonPropertyName("mean")] double? Mean,
    [property: JsonPropertyName("n")] int N,
    [property: JsonPropertyName("ci")] IReadOnlyDictionary<string, double[]?> Ci,
    [property: JsonPropertyName("confidence")] double Confidence,
    [property: JsonPropertyName("notes")] IReadOnlyList<string> Notes);

public sealed record NormalityResponse(
    [property: JsonPropertyName("a2")] double? A2,
    [property: JsonPropertyName("a2Star")] double? A2Star,
    [property: JsonPropertyName("pValue")] double? PValue,
    [property: JsonPropertyName("n")] int N,
    [property: JsonPropertyName("notes")] IReadOnlyList<string> Notes);

public sealed record PercentileCapabilityResponse(
    [property: JsonPropertyName("cpPercentile")] double? CpPercentile,
    [property: JsonPropertyName("cpkPercentile")] double? CpkPercentile,
    [property: JsonPropertyName("method")] string Method,
    [property: JsonPropertyName("notes")] IReadOnlyList<string> Notes);
