using System.Globalization;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Audit;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Reports;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Notify;

/// <summary>
/// Notification rules (each person their own; administrators anyone's; webhook rules engineers and up), the channels
/// this FinWatch offers, the outbox's messages with their delivery log, "send again", and the shift roster. Every change
/// is an audit entry.
/// </summary>
public static class NotifyEndpoints
{
    public const string RuleAudit = "notification-rule";
    public const string RosterAudit = "roster";
    public const string MessageAudit = "notification";

    public static void Map(IEndpointRouteBuilder app)
    {
        var n = app.MapGroup("/api/notifications").WithTags("Notifications");
        n.MapGet("/channels", ChannelsAsync).RequireAuthorization(Permissions.Read).WithSummary("E-mail configured or not, the configured webhooks, the escalation levels, and the caller's own e-mail address");
        n.MapGet("/rules", ListRulesAsync).RequireAuthorization(Permissions.Read).WithSummary("Notification rules, of one owner or everyone's");
        n.MapPost("/rules", CreateRuleAsync).RequireAuthorization(Permissions.Read).WithSummary("Add a notification rule (your own; an administrator's for anyone)");
        n.MapPut("/rules/{id:long}", UpdateRuleAsync).RequireAuthorization(Permissions.Read).WithSummary("Change a notification rule");
        n.MapDelete("/rules/{id:long}", DeleteRuleAsync).RequireAuthorization(Permissions.Read).WithSummary("Remove a notification rule");
        n.MapGet("/messages", MessagesAsync).RequireAuthorization(Permissions.Read)
            .WithSummary("Outbox messages with their delivery attempts, newest first; filter by status (waiting, sending, sent, failed) and alert");
        n.MapPost("/messages/{id:long}/send-again", SendAgainAsync).RequireAuthorization(Permissions.Disposition)
            .WithSummary("Send a failed message once more (supervisors and up)");

        var r = app.MapGroup("/api/roster").WithTags("Notifications");
        r.MapGet("/", RosterAsync).RequireAuthorization(Permissions.Read).WithSummary("The shift roster, and who is on shift now");
        r.MapPut("/", PutRosterAsync).RequireAuthorization(Permissions.Disposition).WithSummary("Replace the shift roster (supervisors and up)");
        r.MapGet("/on-shift", OnShiftAsync).RequireAuthorization(Permissions.Read).WithSummary("Who is on shift at a moment (default now)");
    }

    private static async Task<Ok<ChannelsResponse>> ChannelsAsync(HttpContext http, FinWatchDbContext db, IOptions<NotifyOptions> options, IOptions<MonitorOptions> monitor,
        CancellationToken cancellationToken)
    {
        var o = options.Value;
        var who = http.User.Who();
        var email = await db.Users.AsNoTracking().Where(u => u.UserName == who).Select(u => u.Email).SingleOrDefaultAsync(cancellationToken);
        var levels = new List<EscalationLevelInfo> { new(1, monitor.Value.EscalateAfterMinutes, "the supervisors on shift") };
        levels.AddRange(o.Escalation.Select((l, i) => new EscalationLevelInfo(i + 2, l.AfterMinutes, string.Join(", ", l.People))));
        return TypedResults.Ok(new ChannelsResponse(o.Smtp.Configured, o.Smtp.Configured ? o.Smtp.From : null,
            [.. o.Webhooks.Select(w => new WebhookInfo(w.Name, new Uri(w.Url).Host))], levels, email));
    }

    public static NotificationRuleResponse Describe(NotificationRule r)
    {
        var parts = new List<string> { $"{r.MinSeverity} and above" };
        AddIf(parts, r.Product, "product ");
        AddIf(parts, r.Step, "step ");
        AddIf(parts, r.Equipment, "tool or chamber ");
        AddIf(parts, r.Context, "chart ");
        var how = r.Channel == NotificationChannels.Webhook ? $"webhook {r.Webhook}" : NotificationChannels.Words(r.Channel);
        return new NotificationRuleResponse(r.Id, r.Owner, r.Channel, r.Webhook, r.MinSeverity, r.Product, r.Step, r.Equipment, r.Context,
            DateTimeOffset.FromUnixTimeMilliseconds(r.CreatedAtMs), r.CreatedBy, $"Alerts of {string.Join(", ", parts)} by {how}");

        static void AddIf(List<string> parts, string? value, string label)
        {
            if (value is not null)
            {
                parts.Add(label + value);
            }
        }
    }

    private static async Task<Ok<List<NotificationRuleResponse>>> ListRulesAsync(string? owner, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var q = db.NotificationRules.AsNoTracking();
        if (owner is not null)
        {
            q = q.Where(r => r.Owner == owner);
        }

        return TypedResults.Ok((await q.OrderBy(r => r.Owner).ThenBy(r => r.Id).ToListAsync(cancellationToken)).Select(Describe).ToList());
    }

    private static async Task<Results<Created<NotificationRuleResponse>, ValidationProblem, ProblemHttpResult>> CreateRuleAsync(
        NotificationRuleRequest request, HttpContext http, FinWatchDbContext db, IOptions<NotifyOptions> options, TimeProvider clock, CancellationToken cancellationToken)
    {
        var rule = new NotificationRule { Owner = "", Channel = "", MinSeverity = "", CreatedBy = http.User.Who() };
        var (invalid, forbidden) = await ApplyAsync(rule, request, http, db, options.Value, cancellationToken);
        if (forbidden is not null || invalid is not null)
        {
            return forbidden is not null ? forbidden : invalid!;
        }

        rule.CreatedAtMs = clock.GetUtcNow().ToUnixTimeMilliseconds();
        db.NotificationRules.Add(rule);
        await db.SaveChangesAsync(cancellationToken);
        AuditLog.Add(db, http.User.Who(), RuleAudit, rule.Id.ToString(CultureInfo.InvariantCulture), "created", null, Describe(rule), clock);
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Created($"/api/notifications/rules/{rule.Id}", Describe(rule));
    }

    private static async Task<Results<Ok<NotificationRuleResponse>, ValidationProblem, ProblemHttpResult>> UpdateRuleAsync(
        long id, NotificationRuleRequest request, HttpContext http, FinWatchDbContext db, IOptions<NotifyOptions> options, TimeProvider clock,
        CancellationToken cancellationToken)
    {
        var (rule, problem) = await FindOwnAsync(id, http, db, cancellationToken);
        if (rule is null)
        {
            return problem!;
        }

        var before = Describe(rule);
        var (invalid, refused) = await ApplyAsync(rule, request with { Owner = request.Owner ?? rule.Owner }, http, db, options.Value, cancellationToken);
        if (refused is not null || invalid is not null)
        {
            return refused is not null ? refused : invalid!;
        }

        AuditLog.Add(db, http.User.Who(), RuleAudit, rule.Id.ToString(CultureInfo.InvariantCulture), "changed", before, Describe(rule), clock);
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Ok(Describe(rule));
    }

    private static async Task<Results<NoContent, ProblemHttpResult>> DeleteRuleAsync(long id, HttpContext http, FinWatchDbContext db, TimeProvider clock,
        CancellationToken cancellationToken)
    {
        var (rule, problem) = await FindOwnAsync(id, http, db, cancellationToken);
        if (rule is null)
        {
            return problem!;
        }

        db.NotificationRules.Remove(rule);
        AuditLog.Add(db, http.User.Who(), RuleAudit, rule.Id.ToString(CultureInfo.InvariantCulture), "removed", Describe(rule), null, clock);
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.NoContent();
    }

    // The rule, when it exists and the caller owns it or administers; otherwise the problem to answer.
    private static async Task<(NotificationRule? Rule, ProblemHttpResult? Problem)> FindOwnAsync(long id, HttpContext http, FinWatchDbContext db,
        CancellationToken cancellationToken)
    {
        var rule = await db.NotificationRules.SingleOrDefaultAsync(r => r.Id == id, cancellationToken);
        if (rule is null)
        {
            return (null, Problems.NotFound("No such notification rule.", $"There is no notification rule {id}."));
        }

        return rule.Owner == http.User.Who() || http.User.IsInRole(Roles.Administrator) ? (rule, null)
            : (null, Problems.Forbidden("Not your rule.", $"Rule {rule.Id} belongs to {rule.Owner}; only they or an administrator can change it."));
    }

    // Validates the request against the configuration and the stored products, charts and people; fills the rule.
    private static async Task<(ValidationProblem? Invalid, ProblemHttpResult? Forbidden)> ApplyAsync(NotificationRule rule, NotificationRuleRequest r, HttpContext http, FinWatchDbContext db, NotifyOptions options,
        CancellationToken cancellationToken)
    {
        var who = http.User.Who();
        var owner = string.IsNullOrWhiteSpace(r.Owner) ? who : r.Owner.Trim();
        if (owner != who && !http.User.IsInRole(Roles.Administrator))
        {
            return (null, Problems.Forbidden("Only your own rules.", $"You are signed in as {who}; only an administrator sets rules for {owner}."));
        }

        var errors = new ValidationErrors();
        var channel = r.Channel?.Trim();
        var severity = string.IsNullOrWhiteSpace(r.MinSeverity) ? "high" : r.MinSeverity.Trim();
        if (channel is null || Array.IndexOf(NotificationChannels.All, channel) < 0)
        {
            errors["channel"] = $"channel '{r.Channel}' is not one of {string.Join(", ", NotificationChannels.All)}";
        }

        if (Array.IndexOf(Severity.Names, severity) < 1)
        {
            errors["min_severity"] = $"min_severity '{severity}' is not one of low, medium, high, critical";
        }

        var person = await db.Users.AsNoTracking().SingleOrDefaultAsync(u => u.UserName == owner, cancellationToken);
        if (person is null && owner != who)
        {
            errors["owner"] = $"'{owner}' is not a person in FinWatch";
        }

        string? webhook = null;
        if (channel == NotificationChannels.Webhook)
        {
            // Only addresses an administrator configured: a rule names one, it never carries an address.
            webhook = options.Webhooks.FirstOrDefault(w => string.Equals(w.Name, r.Webhook?.Trim(), StringComparison.OrdinalIgnoreCase))?.Name;
            if (webhook is null)
            {
                errors["webhook"] = options.Webhooks.Count == 0
                    ? "no webhook is configured on this FinWatch; an administrator adds them to the configuration"
                    : $"webhook '{r.Webhook}' is not configured; configured: {string.Join(", ", options.Webhooks.Select(w => w.Name))}";
            }

            if (!http.User.IsInRole(Roles.Engineer))
            {
                errors["channel"] = "webhook rules are set by engineers and administrators";
            }
        }
        else if (!string.IsNullOrWhiteSpace(r.Webhook))
        {
            errors["webhook"] = "only a webhook rule names a webhook";
        }

        if (channel == NotificationChannels.Email)
        {
            if (!options.Smtp.Configured)
            {
                errors["channel"] = "e-mail is not configured on this FinWatch; an administrator sets up the mail server";
            }
            else if (string.IsNullOrWhiteSpace(person?.Email))
            {
                errors["channel"] = $"{owner} has no e-mail address in FinWatch; an administrator adds it on the people page";
            }
        }

        var product = Clean(r.Product);
        if (product is not null && !await db.Products.AnyAsync(p => p.Code == product, cancellationToken))
        {
            errors["product"] = Problems.NotAProduct(product);
        }

        var context = Clean(r.Context);
        if (context is not null && !await db.ChartContexts.AnyAsync(c => c.Code == context, cancellationToken))
        {
            errors["context"] = $"'{context}' is not a chart";
        }

        var step = Clean(r.Step);
        var equipment = Clean(r.Equipment);
        foreach (var (field, value) in new[] { ("step", step), ("equipment", equipment) })
        {
            if (value is { Length: > 64 })
            {
                errors[field] = $"{field} is at most 64 characters";
            }
        }

        if (errors.Count > 0)
        {
            return (Problems.Invalid(errors), null);
        }

        (rule.Owner, rule.Channel, rule.Webhook, rule.MinSeverity, rule.MinSeverityRank) = (owner, channel!, webhook, severity, Array.IndexOf(Severity.Names, severity));
        (rule.Product, rule.Step, rule.Equipment, rule.Context) = (product, step, equipment, context);
        return (null, null);
    }

    private static string? Clean(string? s) => string.IsNullOrWhiteSpace(s) ? null : s.Trim();

    private static async Task<Results<Ok<List<NotificationMessageResponse>>, ValidationProblem>> MessagesAsync(
        string? status, long? alert, int? limit, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        if (status is not null && Array.IndexOf(OutboxStates.All, status) < 0)
        {
            return Problems.Invalid("status", $"status '{status}' is not one of {string.Join(", ", OutboxStates.All)}");
        }

        if (limit is < 1 or > 1000)
        {
            return Problems.Invalid("limit", $"limit {limit} is 1 to 1000");
        }

        var q = db.Outbox.AsNoTracking();
        q = status is null ? q : q.Where(m => m.Status == status);
        q = alert is { } a ? q.Where(m => m.AlertId == a) : q;
        var messages = await q.OrderByDescending(m => m.Id).Take(limit ?? 200).ToListAsync(cancellationToken);
        return TypedResults.Ok(await DescribeAsync(db, messages, cancellationToken));
    }

    private static async Task<List<NotificationMessageResponse>> DescribeAsync(FinWatchDbContext db, List<OutboxMessage> messages, CancellationToken cancellationToken)
    {
        var ids = messages.Select(m => m.Id).ToList();
        var attempts = (await db.DeliveryAttempts.AsNoTracking().Where(d => ids.Contains(d.MessageId)).OrderBy(d => d.Id).ToListAsync(cancellationToken))
            .ToLookup(d => d.MessageId);
        var alertIds = messages.Select(m => m.AlertId).Distinct().ToList();
        var titles = await db.Alerts.AsNoTracking().Where(a => alertIds.Contains(a.Id))
            .Join(db.ChartContexts, a => a.ContextId, c => c.Id, (a, c) => new { a.Id, c.Title }).ToDictionaryAsync(x => x.Id, x => x.Title, cancellationToken);
        static DateTimeOffset? T(long? ms) => ms is { } v ? DateTimeOffset.FromUnixTimeMilliseconds(v) : null;
        return [.. messages.Select(m => new NotificationMessageResponse(m.Id, m.Key, m.AlertId, titles.GetValueOrDefault(m.AlertId, ""), m.Event, m.Channel, m.Target,
            m.Recipient, m.Status, m.Attempts, DateTimeOffset.FromUnixTimeMilliseconds(m.CreatedAtMs),
            m.Status == OutboxStates.Waiting ? T(m.NextAttemptAtMs) : null, T(m.SentAtMs), m.LastError,
            [.. attempts[m.Id].Select(d => new DeliveryAttemptResponse(d.Attempt, DateTimeOffset.FromUnixTimeMilliseconds(d.AtMs), d.DurationMs, d.Outcome, d.Detail, d.By))]))];
    }

    private static async Task<Results<Ok<NotificationMessageResponse>, ValidationProblem, ProblemHttpResult>> SendAgainAsync(
        long id, HttpContext http, FinWatchDbContext db, TimeProvider clock, OutboxSignal signal, CancellationToken cancellationToken)
    {
        var m = await db.Outbox.SingleOrDefaultAsync(x => x.Id == id, cancellationToken);
        if (m is null)
        {
            return Problems.NotFound("No such notification.", $"There is no notification {id}.");
        }

        if (m.Status != OutboxStates.Failed)
        {
            return Problems.Invalid("status", $"notification {id} is {m.Status}; only a failed one is sent again");
        }

        if (m.Target.Length == 0)
        {
            return Problems.Invalid("target", $"notification {id} has no address to go to: {m.LastError}");
        }

        var before = new { m.Status, m.Attempts, m.LastError };
        m.Status = OutboxStates.Waiting;
        m.NextAttemptAtMs = clock.GetUtcNow().ToUnixTimeMilliseconds();
        AuditLog.Add(db, http.User.Who(), MessageAudit, m.Key, "send_again", before, new { m.Status, m.Attempts }, clock);
        await db.SaveChangesAsync(cancellationToken);
        signal.Nudge();
        return TypedResults.Ok((await DescribeAsync(db, [m], cancellationToken))[0]);
    }

    private static async Task<Ok<RosterResponse>> RosterAsync(FinWatchDbContext db, IOptions<ShiftOptions> shifts, TimeProvider clock, CancellationToken cancellationToken)
    {
        var entries = await db.Roster.AsNoTracking().OrderBy(e => e.Shift).ThenBy(e => e.Person).ThenBy(e => e.FromDate).ToListAsync(cancellationToken);
        return TypedResults.Ok(new RosterResponse(shifts.Value.TimeZone, [.. shifts.Value.EffectivePattern.Select(s => s.Name)],
            [.. entries.Select(e => new RosterEntryDto(e.Shift, e.Person, e.FromDate, e.ToDate))],
            await OnShiftAtAsync(db, shifts.Value, clock.GetUtcNow(), cancellationToken)));
    }

    private static async Task<OnShiftResponse> OnShiftAtAsync(FinWatchDbContext db, ShiftOptions shifts, DateTimeOffset at, CancellationToken cancellationToken)
    {
        var on = await Roster.AtAsync(db, shifts, at, cancellationToken);
        return new OnShiftResponse(at, on.Shift?.Name, on.Shift?.Date.ToString(Roster.DateFormat, CultureInfo.InvariantCulture), on.Shift?.Start, on.Shift?.End,
            on.People, on.Supervisors);
    }

    private static async Task<Results<Ok<OnShiftResponse>, ValidationProblem>> OnShiftAsync(DateTimeOffset? at, FinWatchDbContext db, IOptions<ShiftOptions> shifts,
        TimeProvider clock, CancellationToken cancellationToken) =>
        TypedResults.Ok(await OnShiftAtAsync(db, shifts.Value, at ?? clock.GetUtcNow(), cancellationToken));

    private static async Task<Results<Ok<RosterResponse>, ValidationProblem>> PutRosterAsync(RosterRequest request, HttpContext http, FinWatchDbContext db,
        IOptions<ShiftOptions> shifts, TimeProvider clock, CancellationToken cancellationToken)
    {
        var errors = new ValidationErrors();
        var entries = request.Entries ?? [];
        if (entries.Count > 2000)
        {
            errors["entries"] = $"{entries.Count} roster lines; at most 2000";
        }

        var names = shifts.Value.EffectivePattern.Select(s => s.Name).ToList();
        var people = await db.Users.AsNoTracking().Select(u => u.UserName!).ToListAsync(cancellationToken);
        var rows = new List<RosterEntry>();
        foreach (var (e, i) in entries.Take(2000).Select((e, i) => (e, i)))
        {
            var where = $"entries[{i}]";
            var shift = names.FirstOrDefault(n => string.Equals(n, e.Shift?.Trim(), StringComparison.OrdinalIgnoreCase));
            if (shift is null)
            {
                errors[$"{where}.shift"] = $"line {i + 1}: '{e.Shift}' is not a shift of the pattern ({string.Join(", ", names)})";
            }

            var person = e.Person?.Trim();
            if (person is null || !people.Contains(person, StringComparer.Ordinal))
            {
                errors[$"{where}.person"] = $"line {i + 1}: '{e.Person}' is not a person in FinWatch";
            }

            var from = Day(e.From);
            var to = e.To is null || e.To.Length == 0 ? (DateOnly?)null : Day(e.To);
            if (from is null)
            {
                errors[$"{where}.from"] = $"line {i + 1}: from '{e.From}' is not a date YYYY-MM-DD";
            }

            if (e.To is { Length: > 0 } && to is null)
            {
                errors[$"{where}.to"] = $"line {i + 1}: to '{e.To}' is not a date YYYY-MM-DD";
            }
            else if (from is { } f && to is { } t && t < f)
            {
                errors[$"{where}.to"] = $"line {i + 1}: to {e.To} is before from {e.From}";
            }

            if (shift is not null && person is not null && from is { } start)
            {
                rows.Add(new RosterEntry
                {
                    Shift = shift, Person = person, FromDate = start.ToString(Roster.DateFormat, CultureInfo.InvariantCulture),
                    ToDate = to?.ToString(Roster.DateFormat, CultureInfo.InvariantCulture),
                });
            }
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
        var before = await db.Roster.OrderBy(e => e.Id).ToListAsync(cancellationToken);
        db.Roster.RemoveRange(before);
        db.Roster.AddRange(rows);
        AuditLog.Add(db, http.User.Who(), RosterAudit, "roster", "replaced",
            before.Select(e => new RosterEntryDto(e.Shift, e.Person, e.FromDate, e.ToDate)), rows.Select(e => new RosterEntryDto(e.Shift, e.Person, e.FromDate, e.ToDate)), clock);
        await db.SaveChangesAsync(cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        return TypedResults.Ok((await RosterAsync(db, shifts, clock, cancellationToken)).Value!);
    }

    private static DateOnly? Day(string? s) =>
        DateOnly.TryParseExact(s?.Trim(), Roster.DateFormat, CultureInfo.InvariantCulture, DateTimeStyles.None, out var d) ? d : null;
}
