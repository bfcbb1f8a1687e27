namespace FinWatch.Server.Features.Notify;

/// <summary>The channels a rule can choose, and the states of an outbox message.</summary>
public static class NotificationChannels
{
    /// <summary>A desktop notification in the person's opted-in browsers (and the banner on a wall screen); not sent from the outbox.</summary>
    public const string Browser = "browser";
    public const string Email = "email";
    public const string Webhook = "webhook";

    public static readonly string[] All = [Browser, Email, Webhook];

    public static string Words(string channel) => channel switch
    {
        Browser => "browser",
        Email => "e-mail",
        Webhook => "webhook",
        _ => channel,
    };
}

public static class OutboxStates
{
    public const string Waiting = "waiting";
    public const string Sending = "sending";
    public const string Sent = "sent";
    public const string Failed = "failed";

    public static readonly string[] All = [Waiting, Sending, Sent, Failed];
}

/// <summary>What an alert notification is about: the facts a rule is matched against.</summary>
/// <param name="SeverityRank">0 low … 3 critical.</param>
/// <param name="Product">The chart's product code.</param>
/// <param name="Step">The chart's process step.</param>
/// <param name="Context">The chart context code.</param>
/// <param name="Equipment">The chart's own tool or chamber (if it is a per-chamber chart), the last signal's chamber and its tool.</param>
public sealed record AlertFacts(int SeverityRank, string Product, string Step, string Context, IReadOnlyCollection<string> Equipment);

/// <summary>The rule filter: every field that is set must match (severity at or above the rule's).</summary>
public static class RuleMatch
{
    public static bool Matches(Data.Entities.NotificationRule rule, AlertFacts alert) =>
        alert.SeverityRank >= rule.MinSeverityRank
        && (rule.Product is null || string.Equals(rule.Product, alert.Product, StringComparison.Ordinal))
        && (rule.Step is null || string.Equals(rule.Step, alert.Step, StringComparison.Ordinal))
        && (rule.Context is null || string.Equals(rule.Context, alert.Context, StringComparison.Ordinal))
        && (rule.Equipment is null || alert.Equipment.Contains(rule.Equipment, StringComparer.Ordinal));
}
