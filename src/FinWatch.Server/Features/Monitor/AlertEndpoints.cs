using FinWatch.Server.Features.Audit;
using FinWatch.Server.Features.Access;
using System.Text.Json;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Model;
using Microsoft.AspNetCore.Http.HttpResults;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Monitor;

/// <summary>The alert queue and its one-way life: acknowledge, disposition (the reaction plan's steps), close.</summary>
public static class AlertEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/alerts").WithTags("Monitor");
        // The list is what the live feed already pushes to the floor (wall screens too, whose banner loads the open ones);
        // the detail, with comments and history, stays with people who read.
        group.MapGet("/", ListAsync).RequireAuthorization(Permissions.Floor).WithSummary("Alerts, most severe and newest first; filter by state, context, severity, escalated, lot");
        group.MapGet("/counts", CountsAsync).WithSummary("How many alerts are not acknowledged, not closed, and escalated (the navigation's badge)");
        group.MapGet("/{id:long}", GetAsync).WithSummary("One alert with its reaction plan, history and points");
        group.MapPost("/{id:long}/acknowledge", (long id, AlertActionRequest r, HttpContext http, FinWatchDbContext db, IDatabaseDialect dialect, TimeProvider clock,
            MonitorFeed feed, CancellationToken ct) =>
            ActAsync(id, r, AlertStates.Open, AlertStates.Acknowledged, http, db, dialect, clock, feed, ct)).RequireAuthorization(Permissions.Acknowledge).WithSummary("Acknowledge an open alert");
        group.MapPost("/{id:long}/disposition", (long id, AlertActionRequest r, HttpContext http, FinWatchDbContext db, IDatabaseDialect dialect, TimeProvider clock,
            MonitorFeed feed, CancellationToken ct) =>
            ActAsync(id, r, AlertStates.Acknowledged, AlertStates.Dispositioned, http, db, dialect, clock, feed, ct)).RequireAuthorization(Permissions.Disposition).WithSummary("Record the reaction-plan steps taken");
        group.MapPost("/{id:long}/close", (long id, AlertActionRequest r, HttpContext http, FinWatchDbContext db, IDatabaseDialect dialect, TimeProvider clock,
            MonitorFeed feed, CancellationToken ct) =>
            ActAsync(id, r, AlertStates.Dispositioned, AlertStates.Closed, http, db, dialect, clock, feed, ct)).RequireAuthorization(Permissions.Disposition).WithSummary("Close a dispositioned alert");
    }

    private static async Task<Ok<AlertCounts>> CountsAsync(FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var byState = await db.Alerts.AsNoTracking().Where(a => a.State != AlertStates.Closed)
            .GroupBy(a => new { a.State, Escalated = a.EscalatedAtMs != null }).Select(g => new { g.Key.State, g.Key.Escalated, Count = g.Count() })
            .ToListAsync(cancellationToken);
        return TypedResults.Ok(new AlertCounts(
            byState.Where(g => g.State == AlertStates.Open).Sum(g => g.Count), byState.Sum(g => g.Count), byState.Where(g => g.Escalated).Sum(g => g.Count)));
    }

    private static async Task<Results<Ok<List<AlertMessage>>, ValidationProblem>> ListAsync(
        string? state, string? context, string? severity, bool? escalated, string? lot, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var errors = new ValidationErrors();
        if (state is not null && state != "active" && !AlertStates.All.Contains(state))
        {
            errors["state"] = $"state is active (not closed), {string.Join(", ", AlertStates.All)}";
        }

        if (severity is not null && Array.IndexOf(Severity.Names, severity) < 1)
        {
            errors["severity"] = "severity is low, medium, high or critical (that level or above)";
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var q = db.Alerts.AsNoTracking();
        q = state switch { null => q, "active" => q.Where(a => a.State != AlertStates.Closed), _ => q.Where(a => a.State == state) };
        if (severity is not null)
        {
            var rank = Array.IndexOf(Severity.Names, severity);
            q = q.Where(a => a.SeverityRank >= rank);
        }

        if (escalated is { } e)
        {
            q = e ? q.Where(a => a.EscalatedAtMs != null) : q.Where(a => a.EscalatedAtMs == null);
        }

        if (lot is not null)
        {
            // The alerts whose excursion collected a point of this lot.
            q = q.Where(a => db.ChartPoints.Any(p => p.ContextId == a.ContextId && p.LotId == lot && p.Seq >= a.FirstSeq && p.Seq <= a.LastSeq));
        }

        var contexts = await db.ChartContexts.AsNoTracking().ToDictionaryAsync(c => c.Id, cancellationToken);
        if (context is not null)
        {
            var id = contexts.Values.FirstOrDefault(c => c.Code == context)?.Id ?? -1;
            q = q.Where(a => a.ContextId == id);
        }

        var alerts = await q.OrderByDescending(a => a.SeverityRank).ThenByDescending(a => a.RaisedAtMs).Take(1000).ToListAsync(cancellationToken);
        return TypedResults.Ok(alerts.Select(a => AlertViews.ToMessage(a, contexts[a.ContextId])).ToList());
    }

    private static async Task<Results<Ok<AlertDetailResponse>, ProblemHttpResult>> GetAsync(long id, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var alert = await db.Alerts.AsNoTracking().SingleOrDefaultAsync(a => a.Id == id, cancellationToken);
        if (alert is null)
        {
            return NotFound(id);
        }

        return TypedResults.Ok(await DetailAsync(db, alert, cancellationToken));
    }

    private static async Task<AlertDetailResponse> DetailAsync(FinWatchDbContext db, Alert alert, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleAsync(c => c.Id == alert.ContextId, cancellationToken);
        var events = await db.AlertEvents.AsNoTracking().Where(e => e.AlertId == alert.Id).OrderBy(e => e.Id).ToListAsync(cancellationToken);

        // The excursion's points: every point of the chart from its first signal to the last point it collected.
        var points = await db.ChartPoints.AsNoTracking()
            .Where(p => p.ContextId == alert.ContextId && p.Seq >= alert.FirstSeq && p.Seq <= alert.LastSeq)
            .OrderBy(p => p.Seq).ToListAsync(cancellationToken);
        var limits = await db.LimitVersions.AsNoTracking().Where(l => l.ContextId == context.Id).ToDictionaryAsync(l => l.Id, cancellationToken);
        var seqById = points.ToDictionary(p => p.Id, p => p.Seq);
        var lots = points.GroupBy(p => p.LotId).Select(g => new AlertLot(g.Key,
                [.. g.Where(p => p.WaferSlot is not null).Select(p => p.WaferSlot!.Value).Distinct().Order()],
                g.Count(p => p.Signals.Length > 0), DateTimeOffset.FromUnixTimeMilliseconds(g.Min(p => p.MeasuredAtMs))))
            .OrderBy(l => l.FirstMeasuredAt).ToList();
        return new AlertDetailResponse(
            AlertViews.ToMessage(alert, context),
            context.ReactionPlan.Split('\n', StringSplitOptions.RemoveEmptyEntries),
            [.. events.Select(e => new AlertEventResponse(e.Kind, DateTimeOffset.FromUnixTimeMilliseconds(e.AtMs), e.By, e.Comment,
                e.StepsJson is null ? null : JsonSerializer.Deserialize<List<StepTaken>>(e.StepsJson, FeedLog.Json),
                e.PointId is { } p && seqById.TryGetValue(p, out var seq) ? seq : null))],
            [.. points.Select(p => ContextRules.ToMessage(context, p, p.LimitVersionId is { } l ? limits[l] : null))],
            lots,
            EvaluateModel.PredictionCaution);
    }

    private static async Task<Results<Ok<AlertDetailResponse>, ValidationProblem, ProblemHttpResult>> ActAsync(
        long id, AlertActionRequest r, string from, string to, HttpContext http, FinWatchDbContext db, IDatabaseDialect dialect, TimeProvider clock, MonitorFeed feed,
        CancellationToken cancellationToken)
    {
        await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
        await dialect.LockMonitorAsync(db, cancellationToken); // the alert's state is read under it: one action wins
        var alert = await db.Alerts.SingleOrDefaultAsync(a => a.Id == id, cancellationToken);
        if (alert is null)
        {
            return NotFound(id);
        }

        var context = await db.ChartContexts.AsNoTracking().SingleAsync(c => c.Id == alert.ContextId, cancellationToken);
        var errors = new ValidationErrors();
        if (alert.State != from)
        {
            errors["state"] = $"alert {id} is {alert.State}; only an {from} alert can become {to} (open → acknowledged → dispositioned → closed)";
        }

        if (r.Comment is { Length: > 4000 })
        {
            errors["comment"] = "comment is at most 4000 characters";
        }

        var plan = context.ReactionPlan.Split('\n', StringSplitOptions.RemoveEmptyEntries);
        List<StepTaken>? steps = null;
        if (to == AlertStates.Dispositioned)
        {
            steps = [.. r.Steps ?? []];
            var missing = plan.Where(s => !steps.Any(t => t.Step == s)).ToList();
            var unknown = steps.Where(t => !plan.Contains(t.Step)).Select(t => t.Step).ToList();
            if (missing.Count > 0 || unknown.Count > 0)
            {
                errors["steps"] = $"report every step of the context's reaction plan as done or not done; missing: {string.Join(" | ", missing)}; not in the reaction plan: {string.Join(" | ", unknown)}";
            }

            if (plan.Length == 0 && string.IsNullOrWhiteSpace(r.Comment))
            {
                errors["comment"] = "the context has no reaction plan; say in the comment what was done";
            }
        }

        if (to == AlertStates.Closed && string.IsNullOrWhiteSpace(r.Comment))
        {
            errors["comment"] = "say why the alert can be closed";
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var who = http.User.Who();
        var before = new { alert.State, alert.AcknowledgedBy, alert.ClosedBy };
        alert.State = to;
        alert.UpdatedAtMs = now;
        if (to == AlertStates.Acknowledged)
        {
            alert.AcknowledgedBy = who;
            alert.AcknowledgedAtMs = now;
        }
        else if (to == AlertStates.Closed)
        {
            alert.ClosedBy = who;
            alert.ClosedAtMs = now;
        }

        db.AlertEvents.Add(new AlertEvent
        {
            AlertId = alert.Id, Kind = to, AtMs = now, By = who, Comment = r.Comment?.Trim() ?? "",
            StepsJson = steps is null ? null : JsonSerializer.Serialize(steps, FeedLog.Json),
        });
        AuditLog.Add(db, who, "alert", id.ToString(System.Globalization.CultureInfo.InvariantCulture), to, before,
            new { alert.State, alert.AcknowledgedBy, alert.ClosedBy, Comment = r.Comment?.Trim(), Steps = steps }, clock);
        await db.SaveChangesAsync(cancellationToken);
        var detail = await DetailAsync(db, alert, cancellationToken);
        var message = await FeedLog.AddAsync(db, "alert", context, null, detail.Alert, now, cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        feed.Publish([message]);
        return TypedResults.Ok(detail);
    }

    private static ProblemHttpResult NotFound(long id) => Problems.NotFound("No such alert.", $"There is no alert {id}.");
}
