namespace FinWatch.Server.Features.Monitor;

/// <summary>A plotted point as the live feed and the points endpoint give it (units: the parameter's; ΔVT in mV).</summary>
public sealed record PointMessage(
    string Context, long Seq, DateTimeOffset MeasuredAt, string LotId, int? WaferSlot, string? Chamber,
    double Value, int N, double? Sd, double? Z, double? Centre, double? Ucl, double? Lcl, int? LimitVersion,
    IReadOnlyList<string> Signals, double? PredictedDvtSatMv);

/// <summary>
/// An alert (one excursion of one chart) as lists, the feed and the alert page give it: the rule that opened it and every
/// rule that fired, its state and condition ("signalling" or "back in control"), its severity, when it was raised and
/// when its first and last signal points were measured, its counts (points, signal points, lots, wafers), its first and
/// last chart positions, and the last signal point's lot, wafer and chamber; its escalation level (0 none, 1 the
/// on-shift supervisors, 2 and on the configured levels) and the people of its latest escalation step.
/// </summary>
public sealed record AlertMessage(
    long Id, string Context, string ContextTitle, string Rule, string RuleText, IReadOnlyList<string> Rules, IReadOnlyList<string> RuleTexts,
    string State, string Condition, string Severity, int SeverityRank,
    DateTimeOffset RaisedAt, DateTimeOffset UpdatedAt, bool Escalated, DateTimeOffset FirstSignalMeasuredAt, DateTimeOffset LastSignalMeasuredAt,
    DateTimeOffset? BackInControlAt, int PointCount, int SignalCount, int LotCount, int WaferCount, long FirstPointSeq, long LastPointSeq,
    string LotId, int? WaferSlot, string? Chamber, double? PredictedDvtSatMv, string? AcknowledgedBy, DateTimeOffset? AcknowledgedAt,
    string? ClosedBy, DateTimeOffset? ClosedAt, int EscalationLevel, IReadOnlyList<string> EscalatedTo);

/// <summary>One entry of the live feed: its number, its kind ("point" or "alert") and the message.</summary>
public sealed record FeedMessage(long Seq, string Kind, string Context, PointMessage? Point, AlertMessage? Alert);

/// <summary>GET /api/alerts/counts: alerts not acknowledged yet (open), not closed (active), and escalated among those.</summary>
public sealed record AlertCounts(int Unacknowledged, int Active, int Escalated);
