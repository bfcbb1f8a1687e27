namespace FinWatch.Data.Entities;

/// <summary>One attempt to send an <see cref="OutboxMessage"/>: when, by which instance, how long it took and what came back.</summary>
public sealed class DeliveryAttempt
{
    public long Id { get; set; }

    public long MessageId { get; set; }

    public long AlertId { get; set; }

    public int Attempt { get; set; }

    public long AtMs { get; set; }

    public int DurationMs { get; set; }

    /// <summary>"sent" or "error".</summary>
    public required string Outcome { get; set; }

    /// <summary>The receiver's answer (HTTP status, SMTP reply) or the error, in words.</summary>
    public string Detail { get; set; } = "";

    public required string By { get; set; }
}
