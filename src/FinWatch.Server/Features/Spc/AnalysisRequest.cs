using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// POST /api/spc/analyses: numbers to analyse. Give <see cref="Values"/> or <see cref="Subgroups"/>; null marks a missing
/// entry.
/// </summary>
public sealed record AnalysisRequest : IValidatedRequest
{
    public void Validate(ValidationErrors errors) => AnalysisRules.Check(this, errors);

    public double?[]? Values { get; init; }
    public double?[][]? Subgroups { get; init; }

    /// <summary>"I-MR", "Xbar-R" or "Xbar-S"; defaults to I-MR for values and Xbar-R for subgroups.</summary>
    public string? Chart { get; init; }

    /// <summary>"exact" (default) or "table".</summary>
    public string? Constants { get; init; }

    public LimitsRequest? Limits { get; init; }
    public double? SigmaMultiplier { get; init; }
    public string[]? Rules { get; init; }
    public EwmaRequest? Ewma { get; init; }
    public CusumRequest? Cusum { get; init; }
    public CapabilityRequest? Capability { get; init; }
    public PercentileCapabilityRequest? PercentileCapability { get; init; }
    public bool? Normality { get; init; }
}

/// <summary>{"source":"data"}, {"source":"baseline","count":k} or {"source":"known","mean":m,"sigma":s}; optional exclusions.</summary>
public sealed record LimitsRequest
{
    public string? Source { get; init; }
    public int? Count { get; init; }
    public double? Mean { get; init; }
    public double? Sigma { get; init; }

    /// <summary>Positions left out of the estimate, each with the reason (plotted and judged all the same).</summary>
    public ExclusionRequest[]? Exclude { get; init; }
}

public sealed record ExclusionRequest
{
    public int Index { get; init; }
    public string? Reason { get; init; }
}

public sealed record EwmaRequest
{
    public double? Lambda { get; init; }
    public double? L { get; init; }
    public double? Target { get; init; }
    public double? Sigma { get; init; }
}

public sealed record CusumRequest
{
    public double? K { get; init; }
    public double? H { get; init; }
    public double? Target { get; init; }
    public double? Sigma { get; init; }

    /// <summary>"sigma" (default: k and h in sigmas) or "data" (in the data's unit).</summary>
    public string? Units { get; init; }
    public double? HeadStart { get; init; }
}

public sealed record CapabilityRequest
{
    public double? Lsl { get; init; }
    public double? Usl { get; init; }
    public double? Target { get; init; }
    public double? Confidence { get; init; }
}

public sealed record PercentileCapabilityRequest
{
    public double? Lsl { get; init; }
    public double? Usl { get; init; }
    public string? Distribution { get; init; }
}
