namespace FinWatch.Data.Entities;

/// <summary>
/// What one control chart watches: a product, a process step, a parameter (measured, derived or predicted) and
/// optionally one chamber, with its chart type, subgrouping, enabled run rules and reaction plan. Its limits are the
/// approved <see cref="LimitVersion"/>s; while it has none it is in its baseline phase and no rule is evaluated.
/// </summary>
public sealed class ChartContext
{
    public int Id { get; set; }

    /// <summary>Short unique code, e.g. <c>TRN7-profile-taper-FX07L</c>.</summary>
    public required string Code { get; set; }

    public required string Title { get; set; }
    public int ProductId { get; set; }
    public required string Step { get; set; }

    /// <summary>A parameter name of the catalogue (GET /api/parameters).</summary>
    public required string Parameter { get; set; }

    /// <summary>Only sites whose etch or liner chamber is this one; null for all.</summary>
    public string? Chamber { get; set; }

    /// <summary>"xbar" (subgroup means against σ_within/√n) or "individuals" (subgroup means as individuals, moving-range σ).</summary>
    public required string ChartType { get; set; }

    /// <summary>"wafer" (the sites of a wafer form a subgroup) or "lot" (the wafer means of a lot).</summary>
    public required string Subgroup { get; set; }

    /// <summary>Enabled run rules, comma separated ids (WE1..WE4, N1..N8).</summary>
    public required string Rules { get; set; }

    /// <summary>The out-of-control action plan: one checklist step per line.</summary>
    public string ReactionPlan { get; set; } = "";

    /// <summary>|predicted ΔVT,sat| in mV from which a signal matters electrically (severity, see the README).</summary>
    public double ElectricalConcernMv { get; set; } = 10;

    /// <summary>The last ingest batch whose rows this context has turned into points (evaluation resumes after it).</summary>
    public long EvaluatedThroughBatchId { get; set; }

    public long CreatedAtMs { get; set; }
    public long UpdatedAtMs { get; set; }
}
