namespace FinWatch.Server.Features.Notify;

/// <summary>
/// A notification rule to create or change. Channel "browser", "email" or "webhook" (then <c>webhook</c> names a
/// configured webhook); <c>min_severity</c> low, medium, high or critical (default high); product, step, equipment (a
/// tool or chamber) and context narrow it, each left out for all. <c>owner</c> is the signed-in person unless an
/// administrator sets someone else's rule.
/// </summary>
public sealed record NotificationRuleRequest(string? Channel, string? Webhook, string? MinSeverity, string? Product, string? Step, string? Equipment,
    string? Context, string? Owner);

/// <summary>A stored rule, with what it does in words.</summary>
public sealed record NotificationRuleResponse(long Id, string Owner, string Channel, string? Webhook, string MinSeverity, string? Product, string? Step,
    string? Equipment, string? Context, DateTimeOffset CreatedAt, string CreatedBy, string Description);

/// <summary>
/// What the notification channels can do here: e-mail configured (and its sender), the configured webhooks (name and host
/// only), the escalation levels, and the caller's own e-mail address (none: e-mail rules are not open to them yet).
/// </summary>
public sealed record ChannelsResponse(bool EmailConfigured, string? EmailFrom, IReadOnlyList<WebhookInfo> Webhooks, IReadOnlyList<EscalationLevelInfo> Escalation,
    string? YourEmail);

public sealed record WebhookInfo(string Name, string Host);

/// <summary>An escalation level: after how many minutes without acknowledgement, and to whom.</summary>
public sealed record EscalationLevelInfo(int Level, int AfterMinutes, string To);

/// <summary>One roster line: person works shift (a pattern name) from a date, until a date or further notice (dates YYYY-MM-DD, inclusive).</summary>
public sealed record RosterEntryDto(string? Shift, string? Person, string? From, string? To);

/// <summary>The whole roster, replaced at once.</summary>
public sealed record RosterRequest(IReadOnlyList<RosterEntryDto>? Entries);

public sealed record RosterResponse(string TimeZone, IReadOnlyList<string> Shifts, IReadOnlyList<RosterEntryDto> Entries, OnShiftResponse Now);

/// <summary>The shift running at a moment (none in a gap of the pattern), and who of the roster is on it.</summary>
public sealed record OnShiftResponse(DateTimeOffset At, string? Shift, string? Date, DateTimeOffset? Start, DateTimeOffset? End,
    IReadOnlyList<OnShiftPerson> People, IReadOnlyList<string> Supervisors);

/// <summary>An outbox message with its attempts.</summary>
public sealed record NotificationMessageResponse(long Id, string Key, long AlertId, string AlertTitle, string Event, string Channel, string Target,
    string? Recipient, string Status, int Attempts, DateTimeOffset CreatedAt, DateTimeOffset? NextAttemptAt, DateTimeOffset? SentAt, string? LastError,
    IReadOnlyList<DeliveryAttemptResponse> Deliveries);

public sealed record DeliveryAttemptResponse(int Attempt, DateTimeOffset At, int DurationMs, string Outcome, string Detail, string By);
