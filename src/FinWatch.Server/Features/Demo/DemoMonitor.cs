using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Monitor;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Demo;

/// <summary>
/// The demo's chart contexts: the main parameters of both invented products, per etch or liner chamber where the
/// planted behaviour lives, with invented reaction plans. Their limits are computed from the baseline part of the data
/// and approved, as an engineer would, effective from the end of the baseline, so the planted drifts in the rest of the
/// data raise real alerts when it is ingested. Each point is one lot (the mean of its wafer means) on an individuals
/// chart, so the moving range measures the lot-to-lot variation: wafers of one lot share their etch and liner run and
/// vary far less among themselves, and limits from wafer-to-wafer moving ranges would be too tight for lots.
/// </summary>
public static class DemoMonitor
{
    public const string DemoEngineer = "demo engineer (invented)";

    private static readonly string[] EtchChambers = ["FX07-L", "FX07-R", "FX08-L", "FX08-R"];
    private static readonly string[] LinerChambers = ["LD03-1", "LD03-2"];

    private static readonly string[] EtchPlan =
    [
        "Put the lot on hold at the next step",
        "Re-measure two wafers of the lot on the other profile tool",
        "Check the etch chamber's RF hours and last maintenance in the chamber log",
        "If confirmed, inhibit the chamber and call the etch engineer on duty",
    ];

    private static readonly string[] LinerPlan =
    [
        "Put the lot on hold at the next step",
        "Re-measure the liner on two wafers",
        "Check the deposition chamber's precursor and recipe log",
        "If confirmed, inhibit the chamber and call the thin-film engineer on duty",
    ];

    private static readonly string[] ElectricalPlan =
    [
        "Flag the lot for early electrical test of the threshold structures",
        "Review which profile input drives the predicted shift (model what-if page)",
        "Tell the device engineer on duty; the prediction is an engineering estimate, not a test result",
    ];

    /// <summary>The demo contexts of one product.</summary>
    public static IEnumerable<ChartContext> ContextsFor(Product p, long nowMs)
    {
        ChartContext C(string code, string title, string step, string parameter, string? chamber, string[] plan, double concern = 10) => new()
        {
            Code = $"{p.Code}-{code}", Title = $"{p.Code} {title}", ProductId = p.Id, Step = step, Parameter = parameter, Chamber = chamber,
            ChartType = "individuals", Subgroup = "lot", Rules = "WE1,WE2,WE3,WE4", ReactionPlan = string.Join('\n', plan),
            ElectricalConcernMv = concern, CreatedAtMs = nowMs, UpdatedAtMs = nowMs,
        };

        foreach (var chamber in EtchChambers)
        {
            yield return C($"taper-{chamber}", $"sidewall taper, etch {chamber}", SeedDemo.DemoFab.ProfileStep, "taper_deg", chamber, EtchPlan);
            yield return C($"radius-{chamber}", $"top-corner radius, etch {chamber}", SeedDemo.DemoFab.ProfileStep, "corner_radius_nm", chamber, EtchPlan);
        }

        foreach (var chamber in LinerChambers)
        {
            yield return C($"liner-{chamber}", $"liner thickness, {chamber}", SeedDemo.DemoFab.ProfileStep, "liner_thickness_nm", chamber, LinerPlan);
        }

        yield return C("mid-width", "mid-height width, all chambers", SeedDemo.DemoFab.ProfileStep, "mid_width_nm", null, EtchPlan);
        yield return C("dvt-sat", "predicted ΔVT (saturation), all chambers", SeedDemo.DemoFab.ProfileStep, "delta_vt_sat_mv", null, ElectricalPlan);
    }

    /// <summary>Creates the contexts, turns the stored (baseline) data into their points, and approves limits from them.</summary>
    public static async Task SetUpAsync(FinWatchDbContext db, MonitorEvaluator evaluator, DateTime effectiveFromUtc, long nowMs, CancellationToken cancellationToken)
    {
        foreach (var p in await db.Products.AsNoTracking().OrderBy(p => p.Id).ToListAsync(cancellationToken))
        {
            db.ChartContexts.AddRange(ContextsFor(p, nowMs));
        }

        await db.SaveChangesAsync(cancellationToken);
        await evaluator.EvaluatePendingAsync(cancellationToken);
        var effective = new DateTimeOffset(effectiveFromUtc, TimeSpan.Zero).ToUnixTimeMilliseconds();
        foreach (var context in await db.ChartContexts.AsNoTracking().ToListAsync(cancellationToken))
        {
            var points = await db.ChartPoints.AsNoTracking().Where(x => x.ContextId == context.Id).OrderBy(x => x.Seq).ToListAsync(cancellationToken);
            var (centre, sigma) = BaselineLimits.Estimate(context, points);
            if (sigma is not > 0)
            {
                continue; // too little baseline in a small demo window: the context stays in its baseline phase
            }

            var limit = BaselineLimits.Draft(context, 1, centre, sigma.Value, points, [], DemoEngineer, effective,
                "demo: baseline of the invented fab's first weeks");
            limit.Status = "approved";
            limit.ApprovedBy = DemoEngineer;
            limit.ApprovedAtMs = effective;
            limit.ApprovalComment = "demo: reviewed and approved at the end of the baseline (invented history)";
            limit.EffectiveFromMs = Math.Max(effective, limit.ToMs);
            db.LimitVersions.Add(limit);
        }

        await db.SaveChangesAsync(cancellationToken);
    }

    private const string DemoSupervisor = "shift supervisor S-2 (invented)";

    /// <summary>
    /// The demo's invented past: the whole history is ingested at once, so every alert would otherwise be open and
    /// dated today. Alerts whose last point is older than <paramref name="quiet"/> before the end of the data are given
    /// the times of their points and an invented, complete lifecycle (acknowledged, every reaction-plan step reported,
    /// closed with "no assignable cause" or the planted cause), as a shift would have left them; the recent ones stay open
    /// for the floor to see. Only the demo does this; the product never rewrites an alert.
    /// </summary>
    public static async Task<int> CloseStaleAlertsAsync(FinWatchDbContext db, long endMs, TimeSpan quiet, CancellationToken cancellationToken)
    {
        var cutoff = endMs - (long)quiet.TotalMilliseconds;
        IQueryable<ChartPoint> points = db.ChartPoints; // not AsNoTracking: inside the alert query it would untrack the alerts too
        var stale = await db.Alerts.Where(a => a.State == AlertStates.Open && points.Any(p => p.Id == a.LastPointId && p.MeasuredAtMs < cutoff))
            .ToListAsync(cancellationToken);
        var contexts = await db.ChartContexts.AsNoTracking().ToDictionaryAsync(c => c.Id, cancellationToken);
        foreach (var a in stale)
        {
            var first = await points.Where(p => p.Id == a.FirstPointId).Select(p => p.MeasuredAtMs).SingleAsync(cancellationToken);
            var last = await points.Where(p => p.Id == a.LastPointId).Select(p => p.MeasuredAtMs).SingleAsync(cancellationToken);
            var raised = first + 60_000;
            var events = await db.AlertEvents.Where(e => e.AlertId == a.Id).OrderBy(e => e.Id).ToListAsync(cancellationToken);
            var times = await points.Where(p => events.Select(e => e.PointId).Contains(p.Id)).ToDictionaryAsync(p => p.Id, p => p.MeasuredAtMs, cancellationToken);
            foreach (var e in events)
            {
                e.AtMs = e.PointId is { } id && times.TryGetValue(id, out var t) ? t + 60_000 : raised;
            }

            var acknowledged = raised + (35 * 60_000);
            var done = Math.Max(last + (2 * 3_600_000), acknowledged + 3_600_000);
            var plan = contexts[a.ContextId].ReactionPlan.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            var steps = plan.Select((step, i) => new StepTaken(step, i < 2, i < 2 ? "done; nothing abnormal found (invented)" : "not needed: cause not confirmed")).ToList();
            db.AlertEvents.AddRange(
                new AlertEvent { AlertId = a.Id, Kind = AlertStates.Acknowledged, AtMs = acknowledged, By = DemoSupervisor, Comment = "seen on the floor board; lot held (invented)" },
                new AlertEvent
                {
                    AlertId = a.Id, Kind = AlertStates.Dispositioned, AtMs = done, By = DemoSupervisor, Comment = "re-measure agrees with the first reading; no assignable cause (invented)",
                    StepsJson = System.Text.Json.JsonSerializer.Serialize(steps, FeedLog.Json),
                },
                new AlertEvent { AlertId = a.Id, Kind = AlertStates.Closed, AtMs = done + 600_000, By = DemoEngineer, Comment = "false alarm within the expected rate of the rules; lot released (invented)" });
            a.RaisedAtMs = raised;
            a.State = AlertStates.Closed;
            a.AcknowledgedBy = DemoSupervisor;
            a.AcknowledgedAtMs = acknowledged;
            a.ClosedBy = DemoEngineer;
            a.ClosedAtMs = done + 600_000;
            a.UpdatedAtMs = done + 600_000;
        }

        await db.SaveChangesAsync(cancellationToken);
        return stale.Count;
    }
}
