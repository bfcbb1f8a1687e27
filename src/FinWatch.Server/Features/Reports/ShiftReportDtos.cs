using FinWatch.Server.Features.Monitor;

namespace FinWatch.Server.Features.Reports;

/// <summary>The shift report: what was measured, raised, handled, maintained and left open in one shift. Times are UTC.</summary>
public sealed record ShiftReportResponse(
    string Shift, DateOnly Date, string TimeZone, DateTimeOffset Start, DateTimeOffset End, double LengthHours, string Status,
    DateTimeOffset GeneratedAt, IReadOnlyList<string> Shifts,
    NeedsActionSummary NeedsAction,
    ShiftHandoverResponse Handover,
    IReadOnlyList<LotMeasuredRow> LotsMeasured,
    IReadOnlyList<ShiftAlertRow> AlertsRaised,
    IReadOnlyList<SignalsMeasuredRow> SignalsMeasured,
    IReadOnlyList<AlertActionRow> AlertActions,
    IReadOnlyList<MaintenancePerformedRow> MaintenancePerformed,
    IReadOnlyList<ShiftAlertRow> AlertsOpenAtEnd,
    IReadOnlyList<OutOfControlRow> ContextsOutOfControl,
    IReadOnlyList<DvtRiskRow> DvtRisks,
    IReadOnlyList<CapabilityChangeRow> CapabilityChanges,
    string PredictionCaution);

/// <summary>
/// What the incoming shift must act on, at the shift's end: alerts not closed, of them those still open (not
/// acknowledged) and those escalated, and the charts out of control.
/// </summary>
public sealed record NeedsActionSummary(int AlertsNotClosed, int AlertsNotAcknowledged, int AlertsEscalated, int ChartsOutOfControl);

/// <summary>A lot at a step with sites measured in the shift (counts of those sites only).</summary>
public sealed record LotMeasuredRow(string LotId, string Product, string Step, int WaferCount, int SiteCount, IReadOnlyList<string> Chambers,
    DateTimeOffset FirstMeasuredAt, DateTimeOffset LastMeasuredAt);

/// <summary>
/// An alert (one excursion) with its state at the shift's end (derived from its history), the rules it has fired, and
/// when its first and last signal points were measured, beside when it was raised.
/// </summary>
public sealed record ShiftAlertRow(long Id, string Context, string ContextTitle, string Rule, string RuleText, IReadOnlyList<string> Rules,
    string Severity, string StateAtShiftEnd, DateTimeOffset RaisedAt, DateTimeOffset FirstSignalMeasuredAt, DateTimeOffset LastSignalMeasuredAt,
    int SignalCount, int PointCount, string LotId, int? WaferSlot, string? Chamber, double? PredictedDvtSatMv, bool EscalatedByShiftEnd);

/// <summary>
/// Signal points measured in the shift, by the alert (excursion) that holds them, whenever that alert was raised: the
/// rules they fired, how many points and lots, their first and last measured time, and whether the alert was raised in
/// this shift. A lot measured in the shift but uploaded later counts here once it is uploaded.
/// </summary>
public sealed record SignalsMeasuredRow(long? AlertId, string Context, string ContextTitle, IReadOnlyList<string> Rules, IReadOnlyList<string> RuleTexts, int SignalPoints, int Lots,
    DateTimeOffset FirstMeasuredAt, DateTimeOffset LastMeasuredAt, DateTimeOffset? RaisedAt, bool RaisedInShift);

/// <summary>An acknowledgement, disposition (with the reaction-plan steps) or close recorded during the shift.</summary>
public sealed record AlertActionRow(long AlertId, string Context, string ContextTitle, string Rule, string Severity, string LotId, string Action, DateTimeOffset At,
    string By, string Comment, IReadOnlyList<StepTaken>? Steps);

/// <summary>
/// A maintenance of a chamber or tool that finished in the shift (its <c>occurred_at</c>, when the chamber went back to
/// production), as the maintenance log holds it (<c>kind</c> spelt as there), with the chart contexts restricted to
/// that chamber; a context of every chamber is not listed.
/// </summary>
public sealed record MaintenancePerformedRow(long Id, string Chamber, string Kind, DateTimeOffset OccurredAt, string PerformedBy, string Note,
    string RecordedBy, IReadOnlyList<ChamberContextRow> Contexts);

/// <summary>A chart context that watches one chamber: its code and title.</summary>
public sealed record ChamberContextRow(string Context, string ContextTitle);

/// <summary>A context with approved limits and at least one alert not closed at the shift's end.</summary>
public sealed record OutOfControlRow(string Context, string Title, string Product, string Step, string Parameter, string? Chamber,
    int AlertsNotClosed, string WorstSeverity, IReadOnlyList<string> Rules);

/// <summary>A wafer (or lot, for lot subgroups) measured in the shift, by its mean predicted ΔVT sat (engineering estimate).</summary>
public sealed record DvtRiskRow(string LotId, int? WaferSlot, string? Chamber, DateTimeOffset MeasuredAt, double PredictedDvtSatMv,
    string Context, string ContextTitle, double ElectricalConcernMv, IReadOnlyList<string> AlsoInContexts, IReadOnlyList<string> AlsoInContextTitles);

/// <summary>
/// Capability of a context whose parameter has a spec: its state at the shift's end (<c>out_of_control</c>: not stable,
/// so the indices do not predict; <c>in_control</c>; <c>baseline</c>: no approved limits, stability not judged), Cpk
/// over the seven days through the shift's end, and Cpk over the shift's points against the seven days before the shift.
/// </summary>
public sealed record CapabilityChangeRow(string Context, string ContextTitle, string StateAtShiftEnd, string Parameter, string Unit, double? Lsl, double? Usl,
    CapabilityWindowRow LastSevenDays, CapabilityWindowRow Shift, CapabilityWindowRow PreviousSevenDays, double? CpkChange);

/// <summary>
/// Cpk = min(USL − x̄, x̄ − LSL)/(3σ_within) of the context's points in a window: x̄ the mean of the points, σ_within as
/// the chart estimates it (s̄/c4 of the sites for xbar, MR̄/d2 for individuals). Null with a reason when not computable.
/// </summary>
public sealed record CapabilityWindowRow(DateTimeOffset From, DateTimeOffset To, int Points, double? Mean, double? SigmaWithin, double? Cpk, string? Reason);
