using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Server.Features.Audit;
using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Parameters;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.RunLength;
using FinWatch.Statistics.Stability;
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
        foreach (var context in await db.ChartContexts.ToListAsync(cancellationToken))
        {
            var points = await db.ChartPoints.AsNoTracking().Where(x => x.ContextId == context.Id).OrderBy(x => x.Seq).ToListAsync(cancellationToken);
            var budget = points.Count < 2 ? null : ChooseRules(points.Count / Math.Max(1.0, (points[^1].MeasuredAtMs - points[0].MeasuredAtMs) / 86_400_000.0));
            if (budget is not null)
            {
                context.Rules = string.Join(',', budget.Rules.Select(RunRules.Id));
            }

            var limit = StablestBaseline(context, points, effective);
            if (limit is null)
            {
                continue; // too little baseline in a small demo window: the context stays in its baseline phase
            }

            Approve(limit, effective, "demo: reviewed and approved at the end of the baseline (invented history). " + budget?.Describe(),
                "demo: no window of the invented baseline passes the check; approved so that the chamber is watched, to be revised after the next maintenance (invented)");
            db.LimitVersions.Add(limit);
        }

        await db.SaveChangesAsync(cancellationToken);
    }

    /// <summary>
    /// The invented floor's alarm budget: each chart may raise a false alarm at most about once in this many days while
    /// its process is in control (a choice of the invented floor, not a published figure).
    /// </summary>
    public const double FalseAlarmBudgetDays = 14;

    // The Western Electric combinations an engineer would consider, all with the 3σ rule.
    private static readonly RunRule[][] Candidates =
    [
        [RunRule.WE1, RunRule.WE2, RunRule.WE3, RunRule.WE4],
        [RunRule.WE1, RunRule.WE2, RunRule.WE3], [RunRule.WE1, RunRule.WE2, RunRule.WE4], [RunRule.WE1, RunRule.WE3, RunRule.WE4],
        [RunRule.WE1, RunRule.WE2], [RunRule.WE1, RunRule.WE3], [RunRule.WE1, RunRule.WE4],
        [RunRule.WE1],
    ];

    /// <summary>A rule set chosen with the alarm budget, and what it costs and catches at the chart's point rate.</summary>
    public sealed record RuleChoice(RunRule[] Rules, double PointsPerDay, double FalseAlarmDays, double OneSigmaPoints)
    {
        public string Describe() => string.Create(System.Globalization.CultureInfo.InvariantCulture,
            $"Rules {string.Join(", ", Rules.Select(RunRules.Id))} chosen with the alarm budget: at {PointsPerDay:0.0} lots a day, a false alarm about every "
            + $"{FalseAlarmDays:0} days in control (the floor allows one in {FalseAlarmBudgetDays:0}), and a 1σ shift caught in about {OneSigmaPoints:0} lots.");
    }

    /// <summary>
    /// The rule set an engineer would pick with the alarm budget (GET /api/contexts/{code}/run-length): among the
    /// candidates whose expected time between false alarms, at the chart's point rate, is at least
    /// <see cref="FalseAlarmBudgetDays"/>, the one that catches a 1σ shift soonest; the 3σ rule alone when none fits.
    /// </summary>
    public static RuleChoice ChooseRules(double pointsPerDay)
    {
        RuleChoice? best = null;
        foreach (var rules in Candidates)
        {
            var inControl = RuleSetRunLength.Estimate(rules, 0).Points;
            var choice = new RuleChoice(rules, pointsPerDay, inControl / pointsPerDay, RuleSetRunLength.Estimate(rules, 1).Points);
            if ((choice.FalseAlarmDays >= FalseAlarmBudgetDays || rules.Length == 1) && (best is null || choice.OneSigmaPoints < best.OneSigmaPoints))
            {
                best = choice;
            }
        }

        return best!;
    }

    private const string DemoSupervisor = "shift supervisor S-2 (invented)";

    /// <summary>The second engineer who approves the demo's limits (invented).</summary>
    private const string DemoApprover = "process engineer P-4 (invented)";

    /// <summary>
    /// The draft an engineer would approve, chosen with the baseline check itself: the longest window of the baseline
    /// points that ends at the cut and passes the check (all of them, then 5 subgroups fewer at a time down to the
    /// usual minimum); when none passes, the window with the fewest reasons, which then needs a justification.
    /// </summary>
    private static LimitVersion? StablestBaseline(ChartContext context, List<ChartPoint> points, long effective)
    {
        LimitVersion? best = null;
        var bestReasons = int.MaxValue;
        for (var n = points.Count; n >= Math.Min(points.Count, BaselineCheck.RecommendedSubgroups) && n > 0; n -= 5)
        {
            var used = points.GetRange(points.Count - n, n);
            var (centre, sigma) = BaselineLimits.Estimate(context, used);
            if (sigma is not > 0)
            {
                continue;
            }

            var draft = BaselineLimits.Draft(context, 1, centre, sigma.Value, used, [], DemoEngineer, effective,
                $"demo: the last {n} lots of the invented baseline, chosen with the baseline check");
            var reasons = BaselineLimits.Check(context, draft, used).Reasons.Count;
            if (reasons < bestReasons)
            {
                (best, bestReasons) = (draft, reasons);
            }

            if (reasons == 0)
            {
                break;
            }
        }

        return best;
    }

    /// <summary>Minutes after a point was measured that the invented history says its lot was uploaded and judged.</summary>
    private const long UploadDelayMs = 10 * 60_000;

    /// <summary>
    /// The invented floor at the end of one day of the demo's history. The history is ingested a day at a time, as the
    /// lots arrived, so the monitor's own times (raised, rule added, back in control) would all be the moment the demo
    /// started: they are set to when each point's lot was uploaded (its measured time plus ten minutes). Then the
    /// invented shift handles its excursions as a floor would: an alert is acknowledged 35 minutes after it was
    /// raised; once it is back in control, its reaction plan is reported an hour later and it is closed. An excursion
    /// that is still signalling at the end of the history stays as it is, for the floor to see. Only the demo does
    /// this; the product never rewrites an alert.
    /// </summary>
    public static async Task HandleExcursionsAsync(FinWatchDbContext db, long dayEndMs, CancellationToken cancellationToken)
    {
        await RebaselineAfterMaintenanceAsync(db, dayEndMs, cancellationToken);
        var alerts = await db.Alerts.Where(a => a.State != AlertStates.Closed).ToListAsync(cancellationToken);
        var contexts = await db.ChartContexts.AsNoTracking().ToDictionaryAsync(c => c.Id, cancellationToken);
        foreach (var a in alerts)
        {
            await DateMachineStepsAsync(db, a, dayEndMs, cancellationToken);
            var acknowledged = a.RaisedAtMs + (35 * 60_000);
            if (a.AcknowledgedAtMs is null && acknowledged < dayEndMs)
            {
                a.State = AlertStates.Acknowledged;
                a.AcknowledgedBy = DemoSupervisor;
                a.AcknowledgedAtMs = acknowledged;
                db.AlertEvents.Add(new AlertEvent { AlertId = a.Id, Kind = AlertStates.Acknowledged, AtMs = acknowledged, By = DemoSupervisor, Comment = "seen on the floor board; lot held (invented)" });
            }

            if (a.BackInControlAtMs is not { } back || a.AcknowledgedAtMs is null || back + (80 * 60_000) >= dayEndMs)
            {
                continue;
            }

            var done = Math.Max(back + 3_600_000, a.AcknowledgedAtMs.Value + 600_000);
            var plan = contexts[a.ContextId].ReactionPlan.Split('\n', StringSplitOptions.RemoveEmptyEntries);
            var steps = plan.Select((step, i) => new StepTaken(step, i < 2, i < 2 ? "done (invented)" : "not needed: back in control")).ToList();
            db.AlertEvents.AddRange(
                new AlertEvent
                {
                    AlertId = a.Id, Kind = AlertStates.Dispositioned, AtMs = done, By = DemoSupervisor, Comment = "lots re-measured; the chart came back in control (invented)",
                    StepsJson = System.Text.Json.JsonSerializer.Serialize(steps, FeedLog.Json),
                },
                new AlertEvent { AlertId = a.Id, Kind = AlertStates.Closed, AtMs = done + 600_000, By = DemoEngineer, Comment = "back in control; lots released (invented)" });
            a.State = AlertStates.Closed;
            a.ClosedBy = DemoEngineer;
            a.ClosedAtMs = done + 600_000;
            a.UpdatedAtMs = done + 600_000;
        }

        await db.SaveChangesAsync(cancellationToken);
    }

    /// <summary>
    /// The invented engineer's answer to the chart's new-baseline suggestion: once <see cref="ChamberMaintenance.Window"/>
    /// points of a chamber's chart follow its last maintenance and Welch's test says the mean moved there (the same
    /// test the chart page shows), new limits are computed from those points with the baseline check, approved by the
    /// second engineer at the end of that day and audited, as the limits page would do it.
    /// </summary>
    private static async Task RebaselineAfterMaintenanceAsync(FinWatchDbContext db, long dayEndMs, CancellationToken cancellationToken)
    {
        var events = await db.MaintenanceEvents.AsNoTracking().Where(e => e.OccurredAtMs <= dayEndMs).ToListAsync(cancellationToken);
        foreach (var context in await db.ChartContexts.AsNoTracking().Where(c => c.Chamber != null).ToListAsync(cancellationToken))
        {
            var last = events.Where(e => e.Chamber == context.Chamber).MaxBy(e => e.OccurredAtMs);
            var limits = await db.LimitVersions.AsNoTracking().Where(l => l.ContextId == context.Id).ToListAsync(cancellationToken);
            if (last is null || limits.Count == 0 || limits.Any(l => l.Status == "approved" && l.FromMs > last.OccurredAtMs))
            {
                continue; // no maintenance, no limits yet, or limits from after this maintenance already
            }

            var points = db.ChartPoints.AsNoTracking().Where(p => p.ContextId == context.Id);
            var after = await points.Where(p => p.MeasuredAtMs > last.OccurredAtMs).OrderBy(p => p.Seq).Take(ChamberMaintenance.Window).ToListAsync(cancellationToken);
            if (after.Count < ChamberMaintenance.Window)
            {
                continue;
            }

            var before = await points.Where(p => p.MeasuredAtMs <= last.OccurredAtMs).OrderByDescending(p => p.Seq).Take(ChamberMaintenance.Window)
                .Select(p => p.Value).ToArrayAsync(cancellationToken);
            var unit = FinParameters.TryGet(context.Parameter, out var parameter) ? parameter.Unit : "";
            var suggestion = ChamberMaintenance.Suggest(ChamberMaintenance.Marker(last, after[0].Seq), before, [.. after.Select(p => p.Value)], unit);
            if (!suggestion.SuggestNewBaseline)
            {
                continue;
            }

            var (centre, sigma) = BaselineLimits.Estimate(context, after);
            if (sigma is not > 0)
            {
                continue;
            }

            var limit = BaselineLimits.Draft(context, limits.Max(l => l.Version) + 1, centre, sigma.Value, after, [], DemoEngineer, dayEndMs,
                $"demo: new baseline after the {ChamberMaintenance.Words(MaintenanceKindText.ToText(last.Kind))} of {last.Chamber}: {suggestion.Message}");
            BaselineLimits.Check(context, limit, after);
            Approve(limit, dayEndMs, "demo: new limits from the lots after the maintenance, as the chart suggested (invented history)",
                "demo: the lots after the maintenance are the chamber's new state; approved so that it is watched from now, to be reviewed with more lots (invented)");
            db.LimitVersions.Add(limit);
            await db.SaveChangesAsync(cancellationToken);
            // Audited as the limits page does it, dated when the invented engineer approved it.
            AuditLog.Add(db, DemoApprover, "limits", $"{context.Code} v{limit.Version}", "approved", null, BaselineLimits.Describe(context, limit), TimeProvider.System)
                .AtMs = dayEndMs;
        }

        await db.SaveChangesAsync(cancellationToken);
    }

    private static void Approve(LimitVersion limit, long atMs, string comment, string justification)
    {
        limit.Status = "approved";
        limit.ApprovedBy = DemoApprover;
        limit.ApprovedAtMs = atMs;
        limit.ApprovalComment = comment;
        if (limit.Verdict != BaselineLimits.Stable)
        {
            limit.Justification = justification;
        }

        limit.EffectiveFromMs = Math.Max(atMs, limit.ToMs);
    }

    // The monitor's own steps of the day happened when their points' lots were uploaded, not when the demo started
    // (at or after the day's end: on the last day the clock may not have moved on since the history ended).
    private static async Task DateMachineStepsAsync(FinWatchDbContext db, Alert a, long dayEndMs, CancellationToken cancellationToken)
    {
        var events = await db.AlertEvents.Where(e => e.AlertId == a.Id && e.By == "FinWatch" && e.AtMs >= dayEndMs).ToListAsync(cancellationToken);
        var ids = events.Select(e => e.PointId).OfType<long>().Append(a.LastPointId).ToList();
        var measured = await db.ChartPoints.AsNoTracking().Where(p => ids.Contains(p.Id)).ToDictionaryAsync(p => p.Id, p => p.MeasuredAtMs, cancellationToken);
        foreach (var e in events)
        {
            e.AtMs = e.PointId is { } id && measured.TryGetValue(id, out var t) ? t + UploadDelayMs : a.LastSignalAtMs + UploadDelayMs;
        }

        if (a.RaisedAtMs >= dayEndMs)
        {
            a.RaisedAtMs = a.FirstSignalAtMs + UploadDelayMs;
        }

        if (a.BackInControlAtMs >= dayEndMs)
        {
            a.BackInControlAtMs = events.Where(e => e.Kind == "back-in-control").Select(e => (long?)e.AtMs).LastOrDefault() ?? a.BackInControlAtMs;
        }

        if (a.UpdatedAtMs >= dayEndMs)
        {
            a.UpdatedAtMs = measured.TryGetValue(a.LastPointId, out var last) ? last + UploadDelayMs : a.UpdatedAtMs;
        }
    }
}
