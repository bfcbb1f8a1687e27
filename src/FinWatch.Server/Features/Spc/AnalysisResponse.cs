using FinWatch.Statistics.Shewhart;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// The analysis contract's answer. Indices are 0-based positions in the request, missing entries included; null means
/// undefined or not evaluable and never comes back as 0, infinity or an empty list. Parts not asked for are null.
/// </summary>
public sealed record AnalysisResponse(
    ChartResponse Chart,
    RulesResponse? Rules,
    EwmaResponse? Ewma,
    CusumResponse? Cusum,
    CapabilityResponse? Capability,
    NormalityResponse? Normality,
    PercentileCapabilityResponse? PercentileCapability);

/// <summary>A limit or centre line is a number when constant, or an array with one entry per point when it varies.</summary>
public sealed record ChartLineResponse(
    double?[] Values,
    object? Center,
    object? Ucl,
    object? Lcl);

public sealed record ChartResponse(
    string Type,
    LimitSource LimitsSource,
    string Constants,
    double? Center,
    double? Sigma,
    ChartLineResponse Primary,
    ChartLineResponse? Secondary,
    int[] BeyondLimitsPrimary,
    int[] BeyondLimitsSecondary,
    IReadOnlyList<ExclusionRequest> Excluded,
    IReadOnlyList<string> Warnings);

public sealed record SignalResponse(
    string Rule,
    int Index,
    int[] Pattern);

/// <summary>
/// flags: rule id → flagged indices (null when the rule could not be evaluated); first: rule id → first index or null. The
/// keys go through the API's naming policy like any name (WE1 → we1); a signal's rule is the id as the engine gives it.
/// </summary>
public sealed record RulesResponse(
    IReadOnlyDictionary<string, IReadOnlyList<int>?> Flags,
    IReadOnlyDictionary<string, int?> First,
    IReadOnlyList<SignalResponse> Signals);

public sealed record EwmaResponse(
    double?[] Z,
    double?[] Ucl,
    double?[] Lcl,
    int[] Signals,
    double Target,
    double Sigma);

public sealed record CusumResponse(
    double?[] CPlus,
    double?[] CMinus,
    int[] SignalsUpper,
    int[] SignalsLower,
    double Target,
    double Sigma);

public sealed record CapabilityResponse(
    double? Cp,
    double? Cpk,
    double? Cpu,
    double? Cpl,
    double? Pp,
    double? Ppk,
    double? Cpm,
    double? SigmaWithin,
    double? SigmaOverall,
    double? Mean,
    int N,
    IReadOnlyDictionary<string, double[]?> Ci,
    double Confidence,
    IReadOnlyList<string> Notes);

public sealed record NormalityResponse(
    double? A2,
    double? A2Star,
    double? PValue,
    int N,
    IReadOnlyList<string> Notes);

public sealed record PercentileCapabilityResponse(
    double? CpPercentile,
    double? CpkPercentile,
    string Method,
    IReadOnlyList<string> Notes);
