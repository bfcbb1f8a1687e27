namespace FinWatch.Data.Entities;

/// <summary>
/// A notification waiting to be sent, or sent: written in the same transaction as the alert change it reports, then
/// sent at least once by whichever instance claims it. <see cref="Key"/> is the idempotency key receivers use to drop a
/// repeat. Rows are never deleted; their attempts are in <see cref="DeliveryAttempt"/>.
/// </summary>
public sealed class OutboxMessage
{
    public long Id { get; set; }

    /// <summary>Unique idempotency key, for example "alert-12-raised-rule-3".</summary>
    public required string Key { get; set; }

    public long AlertId { get; set; }

    /// <summary>What happened: "raised" or "escalated".</summary>
    public required string Event { get; set; }

    /// <summary>"email" or "webhook".</summary>
    public required string Channel { get; set; }

    /// <summary>An e-mail address, or a webhook's name in the configuration.</summary>
    public required string Target { get; set; }

    /// <summary>The person it is for (the rule's owner), or null.</summary>
    public string? Recipient { get; set; }

    /// <summary>The message as JSON (the webhook body; the e-mail is written from it).</summary>
    public required string Payload { get; set; }

    /// <summary>"waiting", "sending", "sent" or "failed".</summary>
    public required string Status { get; set; }

    public int Attempts { get; set; }

    public long CreatedAtMs { get; set; }

    /// <summary>Not sent before this time (UTC ms): the backoff after a failed attempt.</summary>
    public long NextAttemptAtMs { get; set; }

    /// <summary>While "sending": the instance that claimed it, and until when the claim holds (a crashed sender's claim lapses).</summary>
    public string? ClaimedBy { get; set; }

    public long? ClaimedUntilMs { get; set; }

    public long? SentAtMs { get; set; }

    public string? LastError { get; set; }
}
