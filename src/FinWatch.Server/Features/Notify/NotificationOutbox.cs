using System.Text.Json;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Monitor;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Notify;

/// <summary>
/// Writes notifications into the outbox inside the caller's transaction (the one that changes the alert), so an alert
/// change and its notifications commit together or not at all. The <see cref="OutboxSender"/> sends them afterwards.
/// Browser rules are not written here: browsers get the change from the live feed.
/// </summary>
public static class NotificationOutbox
{
    /// <summary>A raised alert: one message per matching e-mail or webhook rule. Returns how many were written.</summary>
    public static async Task<int> StageRaisedAsync(FinWatchDbContext db, NotifyOptions options, Alert alert, ChartContext context, long now,
        CancellationToken cancellationToken)
    {
        var (facts, product) = await FactsAsync(db, alert, context, cancellationToken);
        var rules = await db.NotificationRules.AsNoTracking().Where(r => r.Channel != NotificationChannels.Browser && r.MinSeverityRank <= alert.SeverityRank)
            .OrderBy(r => r.Id).ToListAsync(cancellationToken);
        var matching = rules.Where(r => RuleMatch.Matches(r, facts)).ToList();
        if (matching.Count == 0)
        {
            return 0;
        }

        var emails = await EmailsAsync(db, matching.Select(r => r.Owner), cancellationToken);
        var described = AlertNotices.Describe(alert, context, product, options.PublicUrl);
        foreach (var rule in matching)
        {
            var key = $"alert-{alert.Id}-raised-rule-{rule.Id}";
            Add(db, key, alert.Id, AlertNotices.Raised, rule, emails,
                new AlertNotice(key, AlertNotices.Raised, $"rule {rule.Id} of {rule.Owner}", described, null), now);
        }

        return matching.Count;
    }

    /// <summary>
    /// An escalation step to <paramref name="people"/>: one message per distinct e-mail or webhook channel among each
    /// person's rules (their filters do not apply: an escalation is meant for them). Returns, per person, the channels
    /// it went out on, in words (browser included when they have a browser rule).
    /// </summary>
    public static async Task<Dictionary<string, List<string>>> StageEscalationAsync(FinWatchDbContext db, NotifyOptions options, Alert alert, ChartContext context,
        IReadOnlyList<string> people, string reason, long now, CancellationToken cancellationToken)
    {
        var (_, product) = await FactsAsync(db, alert, context, cancellationToken);
        var rules = await db.NotificationRules.AsNoTracking().Where(r => people.Contains(r.Owner)).OrderBy(r => r.Id).ToListAsync(cancellationToken);
        var emails = await EmailsAsync(db, people, cancellationToken);
        var described = AlertNotices.Describe(alert, context, product, options.PublicUrl);
        var escalation = new AlertNoticeEscalation(alert.EscalationLevel, people, reason);
        var channels = new Dictionary<string, List<string>>(StringComparer.Ordinal);
        foreach (var person in people)
        {
            var used = new List<string>();
            foreach (var rule in rules.Where(r => r.Owner == person).DistinctBy(r => (r.Channel, r.Webhook)))
            {
                used.Add(rule.Channel == NotificationChannels.Webhook ? $"webhook {rule.Webhook}" : NotificationChannels.Words(rule.Channel));
                if (rule.Channel == NotificationChannels.Browser)
                {
                    continue;
                }

                var key = $"alert-{alert.Id}-escalated-{alert.EscalationLevel}-{person}-{rule.Channel}-{rule.Webhook}".TrimEnd('-');
                Add(db, key, alert.Id, AlertNotices.Escalated, rule, emails,
                    new AlertNotice(key, AlertNotices.Escalated, $"escalation level {alert.EscalationLevel} to {person}", described, escalation), now);
            }

            channels[person] = used;
        }

        return channels;
    }

    private static void Add(FinWatchDbContext db, string key, long alertId, string what, NotificationRule rule, IReadOnlyDictionary<string, string> emails,
        AlertNotice notice, long now)
    {
        // A rule whose owner has lost the e-mail address still gets a row, failed with the reason, so nothing is dropped silently.
        var target = rule.Channel == NotificationChannels.Email ? emails.GetValueOrDefault(rule.Owner) ?? "" : rule.Webhook ?? "";
        db.Outbox.Add(new OutboxMessage
        {
            Key = key, AlertId = alertId, Event = what, Channel = rule.Channel, Target = target, Recipient = rule.Owner,
            Payload = JsonSerializer.Serialize(notice, FeedLog.Json), CreatedAtMs = now, NextAttemptAtMs = now,
            Status = target.Length == 0 ? OutboxStates.Failed : OutboxStates.Waiting,
            LastError = target.Length == 0 ? $"{rule.Owner} has no e-mail address in FinWatch" : null,
        });
    }

    private static async Task<Dictionary<string, string>> EmailsAsync(FinWatchDbContext db, IEnumerable<string> people, CancellationToken cancellationToken)
    {
        var names = people.Distinct().ToList();
        return await db.Users.AsNoTracking().Where(u => names.Contains(u.UserName!) && u.Email != null && u.DisabledAtMs == null)
            .ToDictionaryAsync(u => u.UserName!, u => u.Email!, cancellationToken);
    }

    /// <summary>The facts rules are matched on, and the product's code.</summary>
    public static async Task<(AlertFacts Facts, string Product)> FactsAsync(FinWatchDbContext db, Alert alert, ChartContext context, CancellationToken cancellationToken)
    {
        var product = await db.Products.AsNoTracking().Where(p => p.Id == context.ProductId).Select(p => p.Code).SingleAsync(cancellationToken);
        var equipment = new List<string>();
        foreach (var name in new[] { context.Chamber, alert.Chamber })
        {
            if (name is not null)
            {
                equipment.Add(name);
            }
        }

        if (alert.Chamber is { } chamber)
        {
            // The tool the last signal's chamber belongs to, as the lot's own rows name it.
            var tools = await db.Measurements.AsNoTracking().Where(m => m.LotId == alert.LotId && (m.EtchChamber == chamber || m.LinerChamber == chamber))
                .Select(m => m.EtchChamber == chamber ? m.EtchTool : m.LinerTool).Take(1).ToListAsync(cancellationToken);
            equipment.AddRange(tools.OfType<string>());
        }

        return (new AlertFacts(alert.SeverityRank, product, context.Step, context.Code, equipment), product);
    }
}
