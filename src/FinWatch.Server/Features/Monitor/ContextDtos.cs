using FinWatch.Server.Features.Maintenance;

namespace FinWatch.Server.Features.Monitor;

public sealed record ContextRequest(
    string? Code, string? Title, string? Product, string? Step, string? Parameter, string? Chamber, string? ChartType, string? Subgroup,
    string? Rules, IReadOnlyList<string>? ReactionPlan, double? ElectricalConcernMv);

public sealed record LimitResponse(
    int Version, string Status, double Centre, double Sigma, double SubgroupSize, double Ucl, double Lcl, string Unit, int PointsUsed,
    DateTimeOffset From, DateTimeOffset To, IReadOnlyList<ExcludedPoint> Excluded, string ComputedBy, DateTimeOffset ComputedAt, string Reason,
    string? ApprovedBy, DateTimeOffset? ApprovedAt, string? ApprovalComment, DateTimeOffset? EffectiveFrom, IReadOnlyList<string> Warnings,
    string Verdict, BaselineCheckResponse? Check, string? Justification);

/// <summary>
/// The baseline check of a draft: its verdict ("stable", "not stable", or "not checked" for versions computed before
/// the check existed) with the reasons; the chart's rules run over the baseline against the draft limits; the
/// Mann–Kendall trend test; the Anderson–Darling normality test (for information, not a reason).
/// </summary>
public sealed record BaselineCheckResponse(
    string Verdict, IReadOnlyList<string> Reasons, int Subgroups, int RecommendedSubgroups, IReadOnlyList<BaselineRuleCount> RuleSignals,
    int FlaggedPoints, BaselineTrend Trend, BaselineNormality Normality);

public sealed record BaselineRuleCount(string Rule, string RuleText, int Signals, int Points);

/// <summary>Mann–Kendall: S, its normal score, the two-sided p-value (null below 10 points), Kendall's τ against time, and the direction at α.</summary>
public sealed record BaselineTrend(string Method, long S, double? Z, double? PValue, double? Tau, string Direction, double Alpha);

/// <summary>Anderson–Darling on the plotted values: A², A*² and the p-value, or the note why there is none.</summary>
public sealed record BaselineNormality(string Method, double? ASquared, double? AStar, double? PValue, string? Note);

public sealed record ExcludedPoint(long Seq, string Reason);

public sealed record ContextResponse(
    string Code, string Title, string Product, string Step, string Parameter, string Unit, string? Chamber, string ChartType, string Subgroup,
    IReadOnlyList<string> Rules, IReadOnlyList<string> ReactionPlan, double ElectricalConcernMv,
    string Phase, string State, string WorstSeverity, int OpenAlerts, int UnacknowledgedAlerts, int EscalatedAlerts, long Points,
    LimitResponse? Limits, PointMessage? LastPoint, MaintenanceSince? Maintenance, DateTimeOffset? OutOfControlSince, IReadOnlyList<RecentPoint> Recent);

/// <summary>
/// One of a chart's latest points for the floor's sparkline: its value with the centre and limits it was judged by
/// (none in the baseline phase) and whether a rule fired on it.
/// </summary>
public sealed record RecentPoint(long Seq, double Value, double? Centre, double? Ucl, double? Lcl, bool Signal);

public sealed record LimitComputeRequest(long? FromSeq, long? ToSeq, IReadOnlyList<ExcludedPoint>? Exclude, string? Reason);

public sealed record ApproveRequest(string? Comment, DateTimeOffset? EffectiveFrom, string? Justification);

public sealed record AlertActionRequest(string? Comment, IReadOnlyList<StepTaken>? Steps);

public sealed record StepTaken(string Step, bool Done, string? Note);

public sealed record AlertEventResponse(string Kind, DateTimeOffset At, string By, string Comment, IReadOnlyList<StepTaken>? Steps, long? PointSeq);

public sealed record AlertDetailResponse(AlertMessage Alert, IReadOnlyList<string> ReactionPlan, IReadOnlyList<AlertEventResponse> History,
    IReadOnlyList<PointMessage> Points, IReadOnlyList<AlertLot> Lots, string Caution);

/// <summary>A lot an excursion involves: its wafers among the excursion's points, how many of its points signalled, its first measured time.</summary>
public sealed record AlertLot(string LotId, IReadOnlyList<int> Wafers, int SignalPoints, DateTimeOffset FirstMeasuredAt);
