using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// At start, evaluates any batch a crash left unevaluated; then, every <see cref="MonitorOptions.CheckEverySeconds"/>,
/// escalates open alerts that nobody acknowledged within <see cref="MonitorOptions.EscalateAfterMinutes"/>.
/// </summary>
public sealed class MonitorWorker(IServiceScopeFactory scopes, IOptions<MonitorOptions> options, TimeProvider clock, MonitorFeed feed, Telemetry telemetry) : BackgroundService
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

    public async Task<int> EscalateAsync(CancellationToken cancellationToken)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var due = now - (options.Value.EscalateAfterMinutes * 60_000L);
        var dueAlerts = db.Alerts.Where(a => a.State == AlertStates.Open && a.EscalatedAtMs == null && a.RaisedAtMs <= due);
        if (!await dueAlerts.AnyAsync(cancellationToken))
        {
            return 0;
        }

        var messages = new List<FeedMessage>();
        await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
        // Read again under the monitor lock: with several instances, each escalates only what no other has.
        await scope.ServiceProvider.GetRequiredService<IDatabaseDialect>().LockMonitorAsync(db, cancellationToken);
        var alerts = await dueAlerts.ToListAsync(cancellationToken);
        foreach (var a in alerts)
        {
            a.EscalatedAtMs = now;
            db.AlertEvents.Add(new AlertEvent
            {
                AlertId = a.Id, Kind = "escalated", AtMs = now, By = "FinWatch",
                Comment = $"not acknowledged within {options.Value.EscalateAfterMinutes} min; shown to the supervisors",
            });
            var context = await db.ChartContexts.AsNoTracking().SingleAsync(c => c.Id == a.ContextId, cancellationToken);
            messages.Add(await FeedLog.AddAsync(db, "alert", context, null, AlertViews.ToMessage(a, context), now, cancellationToken));
        }

        await db.SaveChangesAsync(cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        telemetry.AlertsEscalated(alerts.Count);
        feed.Publish(messages);
        return alerts.Count;
    }
}
