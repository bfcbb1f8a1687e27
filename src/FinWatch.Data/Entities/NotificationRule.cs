namespace FinWatch.Data.Entities;

/// <summary>
/// A person's subscription: which alerts (at or above a severity, and optionally of one product, step, tool or chamber,
/// or chart) go out on which channel ("browser", "email" or "webhook", the webhook named in the administrator's
/// configuration). The owner's e-mail address is read when a message is sent. Rules are deleted when their owner
/// removes them; the audit trail keeps what they were.
/// </summary>
public sealed class NotificationRule
{
    public long Id { get; set; }

    /// <summary>The person the rule belongs to (user name); an escalation to them goes out on the channels of their rules.</summary>
    public required string Owner { get; set; }

    /// <summary>"browser", "email" or "webhook".</summary>
    public required string Channel { get; set; }

    /// <summary>For the webhook channel: the name of a webhook in the configuration.</summary>
    public string? Webhook { get; set; }

    /// <summary>The lowest severity the rule takes: "low", "medium", "high" or "critical".</summary>
    public required string MinSeverity { get; set; }

    public int MinSeverityRank { get; set; }

    /// <summary>Product code; null for every product.</summary>
    public string? Product { get; set; }

    /// <summary>Process step; null for every step.</summary>
    public string? Step { get; set; }

    /// <summary>A tool or a chamber; null for all of them.</summary>
    public string? Equipment { get; set; }

    /// <summary>Chart context code; null for every chart.</summary>
    public string? Context { get; set; }

    public long CreatedAtMs { get; set; }

    public required string CreatedBy { get; set; }
}
