using FinWatch.Server.Features.Maintenance;

namespace FinWatch.Server.Features.Monitor;

public sealed record ContextRequest(
    string? Code, string? Title, string? Product, string? Step, string? Parameter, string? Chamber, string? ChartType, string? Subgroup,
    string? Rules, IReadOnlyList<string>? ReactionPlan, double? ElectricalConcernMv);

public sealed record LimitResponse(
    int Version, string Status, double Centre, double Sigma, double SubgroupSize, double Ucl, double Lcl, string Unit, int PointsUsed,
    DateTimeOffset From, DateTimeOffset To, IReadOnlyList<ExcludedPoint> Excluded, string ComputedBy, DateTimeOffset ComputedAt, string Reason,
    string? ApprovedBy, DateTimeOffset? ApprovedAt, string? ApprovalComment, DateTimeOffset? EffectiveFrom, IReadOnlyList<string> Warnings);

public sealed record ExcludedPoint(long Seq, string Reason);

public sealed record ContextResponse(
    string Code, string Title, string Product, string Step, string Parameter, string Unit, string? Chamber, string ChartType, string Subgroup,
    IReadOnlyList<string> Rules, IReadOnlyList<string> ReactionPlan, double ElectricalConcernMv,
    string Phase, string State, string WorstSeverity, int OpenAlerts, int UnacknowledgedAlerts, int EscalatedAlerts, long Points,
    LimitResponse? Limits, PointMessage? LastPoint, MaintenanceSince? Maintenance);

public sealed record LimitComputeRequest(long? FromSeq, long? ToSeq, IReadOnlyList<ExcludedPoint>? Exclude, string? Reason);

public sealed record ApproveRequest(string? Comment, DateTimeOffset? EffectiveFrom);

public sealed record AlertActionRequest(string? Comment, IReadOnlyList<StepTaken>? Steps);

public sealed record StepTaken(string Step, bool Done, string? Note);

public sealed record AlertEventResponse(string Kind, DateTimeOffset At, string By, string Comment, IReadOnlyList<StepTaken>? Steps, long? PointSeq);

public sealed record AlertDetailResponse(AlertMessage Alert, IReadOnlyList<string> ReactionPlan, IReadOnlyList<AlertEventResponse> History,
    IReadOnlyList<PointMessage> Points, string Caution);
