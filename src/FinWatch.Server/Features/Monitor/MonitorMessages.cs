namespace FinWatch.Server.Features.Monitor;

/// <summary>A plotted point as the live feed and the points endpoint give it (units: the parameter's; ΔVT in mV).</summary>
public sealed record PointMessage(
    string Context, long Seq, DateTimeOffset MeasuredAt, string LotId, int? WaferSlot, string? Chamber,
    double Value, int N, double? Sd, double? Z, double? Centre, double? Ucl, double? Lcl, int? LimitVersion,
    IReadOnlyList<string> Signals, double? PredictedDvtSatMv);

/// <summary>An alert as lists, the feed and the alert page give it.</summary>
public sealed record AlertMessage(
    long Id, string Context, string ContextTitle, string Rule, string RuleText, string State, string Severity, int SeverityRank,
    DateTimeOffset RaisedAt, DateTimeOffset UpdatedAt, bool Escalated, int PointCount, long FirstPointSeq, long LastPointSeq,
    string LotId, int? WaferSlot, string? Chamber, double? PredictedDvtSatMv, string? AcknowledgedBy, DateTimeOffset? AcknowledgedAt,
    string? ClosedBy, DateTimeOffset? ClosedAt);

/// <summary>One entry of the live feed: its number, its kind ("point" or "alert") and the message.</summary>
public sealed record FeedMessage(long Seq, string Kind, string Context, PointMessage? Point, AlertMessage? Alert);
