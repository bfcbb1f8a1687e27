namespace FinWatch.Data.Entities;

/// <summary>
/// One version of a context's control limits: computed from chosen points (with excluded points and reasons), then
/// approved, which freezes it. Points measured at or after <see cref="EffectiveFromMs"/> are judged by the newest
/// approved version in force at their time; nothing here is changed after approval, and nothing is deleted.
/// </summary>
public sealed class LimitVersion
{
    public int Id { get; set; }
    public int ContextId { get; set; }
    public int Version { get; set; }

    /// <summary>"draft" or "approved".</summary>
    public required string Status { get; set; }

    /// <summary>Centre line, in the parameter's unit.</summary>
    public double Centre { get; set; }

    /// <summary>σ of one site (xbar: σ_within) or of one plotted point (individuals), in the parameter's unit.</summary>
    public double Sigma { get; set; }

    /// <summary>Typical subgroup size the limits are drawn for (xbar); 1 for individuals.</summary>
    public double SubgroupSize { get; set; }

    public int PointsUsed { get; set; }
    public long FromMs { get; set; }
    public long ToMs { get; set; }

    /// <summary>JSON array of {"seq", "reason"} for points left out of the estimate.</summary>
    public string ExcludedJson { get; set; } = "[]";

    /// <summary>
    /// The baseline check's verdict when the draft was computed: "stable" or "not stable"; null for versions computed
    /// before the check existed.
    /// </summary>
    public string? Verdict { get; set; }

    /// <summary>The baseline check as JSON (rule signals, trend and normality tests, reasons); null with <see cref="Verdict"/>.</summary>
    public string? CheckJson { get; set; }

    /// <summary>The approver's written justification for approving limits whose baseline is not stable.</summary>
    public string? Justification { get; set; }

    public required string ComputedBy { get; set; }
    public long ComputedAtMs { get; set; }
    public string Reason { get; set; } = "";
    public string? ApprovedBy { get; set; }
    public long? ApprovedAtMs { get; set; }
    public string? ApprovalComment { get; set; }

    /// <summary>From when (measured-at, ms) the approved version judges points: its approval time.</summary>
    public long? EffectiveFromMs { get; set; }
}
