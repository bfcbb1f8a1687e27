using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Notify;
using FinWatch.Server.Features.Reports;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// At start, evaluates any batch a crash left unevaluated; then, every <see cref="MonitorOptions.CheckEverySeconds"/>,
/// escalates open alerts that nobody acknowledged: after <see cref="MonitorOptions.EscalateAfterMinutes"/> to the
/// supervisors on shift (roster and shift pattern), then to each configured level in turn
/// (<see cref="NotifyOptions.Escalation"/>). Each step goes out on the channels of those people's rules, through the
/// outbox in the same transaction, and is recorded in the alert's history.
/// </summary>
public sealed class MonitorWorker(IServiceScopeFactory scopes, IOptions<MonitorOptions> options, IOptions<NotifyOptions> notify, IOptions<ShiftOptions> shifts,
    TimeProvider clock, MonitorFeed feed, OutboxSignal outbox, Telemetry telemetry) : BackgroundService
{
    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        await using (var scope = scopes.CreateAsyncScope())
        {
            await scope.ServiceProvider.GetRequiredService<MonitorEvaluator>().EvaluatePendingAsync(stoppingToken);
        }

        using var timer = new PeriodicTimer(TimeSpan.FromSeconds(options.Value.CheckEverySeconds), clock);
        while (await timer.WaitForNextTickAsync(stoppingToken))
        {
            await EscalateAsync(stoppingToken);
        }
    }

    /// <summary>One escalation level: minutes after the alert was raised, and its people (null: the supervisors on shift then).</summary>
    private sealed record Level(int AfterMinutes, IReadOnlyList<string>? People);

    private List<Level> Levels() =>
        [new(options.Value.EscalateAfterMinutes, null), .. notify.Value.Escalation.Select(l => new Level(l.AfterMinutes, l.People))];

    /// <summary>Takes every escalation step that is due; returns how many alerts took at least one.</summary>
    public async Task<int> EscalateAsync(CancellationToken cancellationToken)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        var at = clock.GetUtcNow();
        var now = at.ToUnixTimeMilliseconds();
        var levels = Levels();
        var due = now - (levels[0].AfterMinutes * 60_000L);
        var dueAlerts = db.Alerts.Where(a => a.State == AlertStates.Open && a.EscalationLevel < levels.Count && a.RaisedAtMs <= due);
        if (!await dueAlerts.AnyAsync(cancellationToken))
        {
            return 0;
        }

        var messages = new List<FeedMessage>();
        var wrote = false;
        await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
        // Read again under the monitor lock: with several instances, each step is taken by one of them.
        await scope.ServiceProvider.GetRequiredService<IDatabaseDialect>().LockMonitorAsync(db, cancellationToken);
        var alerts = await dueAlerts.ToListAsync(cancellationToken);
        var escalated = 0;
        foreach (var a in alerts)
        {
            var context = await db.ChartContexts.AsNoTracking().SingleAsync(c => c.Id == a.ContextId, cancellationToken);
            var took = false;
            while (a.EscalationLevel < levels.Count && a.RaisedAtMs <= now - (levels[a.EscalationLevel].AfterMinutes * 60_000L))
            {
                var level = levels[a.EscalationLevel];
                a.EscalationLevel++;
                a.EscalatedAtMs ??= now;
                var (people, whom) = await RecipientsAsync(db, level, a.EscalationLevel, at, cancellationToken);
                var reason = $"not acknowledged within {level.AfterMinutes} min";
                var channels = await NotificationOutbox.StageEscalationAsync(db, notify.Value, a, context, people, reason, now, cancellationToken);
                wrote |= channels.Values.Any(c => c.Count > 0);
                a.EscalatedTo = string.Join(',', people);
                var how = people.Count == 0 ? "shown on the alert queue only"
                    : string.Join("; ", people.Select(p => channels[p].Count == 0 ? $"{p}: no notification rules, the alert queue only" : $"{p}: {string.Join(", ", channels[p])}"));
                db.AlertEvents.Add(new AlertEvent
                {
                    AlertId = a.Id, Kind = "escalated", AtMs = now, By = "FinWatch",
                    Comment = $"level {a.EscalationLevel}, {reason}: escalated to {whom} ({how})",
                });
                took = true;
            }

            if (took)
            {
                escalated++;
                messages.Add(await FeedLog.AddAsync(db, "alert", context, null, AlertViews.ToMessage(a, context), now, cancellationToken));
            }
        }

        await db.SaveChangesAsync(cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        telemetry.AlertsEscalated(escalated);
        feed.Publish(messages);
        if (wrote)
        {
            outbox.Nudge();
        }

        return escalated;
    }

    // The people of a level, and the words for them in the alert's history.
    private async Task<(IReadOnlyList<string> People, string Whom)> RecipientsAsync(FinWatchDbContext db, Level level, int number, DateTimeOffset at,
        CancellationToken cancellationToken)
    {
        if (level.People is { } named)
        {
            var known = await db.Users.AsNoTracking().Where(u => named.Contains(u.UserName!) && u.DisabledAtMs == null).Select(u => u.UserName!)
                .ToListAsync(cancellationToken);
            var missing = named.Except(known).ToList();
            return ([.. named.Intersect(known)], $"level {number}: {string.Join(", ", named)}" +
                (missing.Count == 0 ? "" : $" ({string.Join(", ", missing)}: not an enabled person in FinWatch, not reached)"));
        }

        var on = await Roster.AtAsync(db, shifts.Value, at, cancellationToken);
        if (on.Shift is not { } shift)
        {
            return ([], "the supervisors on shift, but no shift of the pattern is running now");
        }

        var day = shift.Date.ToString(Roster.DateFormat, System.Globalization.CultureInfo.InvariantCulture);
        return on.Supervisors.Count == 0
            ? ([], $"the supervisors on the {shift.Name} shift of {day}, but the roster names none")
            : (on.Supervisors, $"the supervisors on the {shift.Name} shift of {day}: {string.Join(", ", on.Supervisors)}");
    }
}
