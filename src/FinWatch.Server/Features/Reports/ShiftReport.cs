using System.Text.Json;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Features.Model;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Parameters;
using FinWatch.Statistics.Capability;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Reports;

/// <summary>
/// Builds the report of one shift from the stored history: measurements and points by their measured-at time, alerts
/// and their actions by the time they were recorded, and every state "at the shift's end" from the append-only alert
/// history, so a report of a past shift reads the same whenever it is asked for.
/// </summary>
public sealed class ShiftReport(FinWatchDbContext db, TimeProvider clock, IOptions<ShiftOptions> options)
{
    private static readonly string[] ActionKinds = [AlertStates.Acknowledged, AlertStates.Dispositioned, AlertStates.Closed];

    public async Task<ShiftReportResponse> BuildAsync(ShiftWindow w, CancellationToken cancellationToken)
    {
        var o = options.Value;
        var now = clock.GetUtcNow();
        var products = await db.Products.AsNoTracking().Include(p => p.Specs).ToDictionaryAsync(p => p.Id, cancellationToken);
        var contexts = await db.ChartContexts.AsNoTracking().OrderBy(c => c.Code).ToListAsync(cancellationToken);
        var contextById = contexts.ToDictionary(c => c.Id);

        // Alerts alive at some time in the shift or raised in it; their history decides their state at the end.
        var alerts = await db.Alerts.AsNoTracking().Where(a => a.RaisedAtMs < w.EndMs && (a.ClosedAtMs == null || a.ClosedAtMs >= w.StartMs))
            .OrderBy(a => a.RaisedAtMs).ThenBy(a => a.Id).ToListAsync(cancellationToken);
        var alertIds = alerts.Select(a => a.Id).ToList();
        var events = await db.AlertEvents.AsNoTracking().Where(e => alertIds.Contains(e.AlertId) && ActionKinds.Contains(e.Kind) && e.AtMs < w.EndMs)
            .OrderBy(e => e.AtMs).ThenBy(e => e.Id).ToListAsync(cancellationToken);
        var stateAtEnd = alerts.ToDictionary(a => a.Id, a => events.LastOrDefault(e => e.AlertId == a.Id)?.Kind ?? AlertStates.Open);
        var alertById = alerts.ToDictionary(a => a.Id);

        ShiftAlertRow Row(Alert a) => new(a.Id, contextById[a.ContextId].Code, contextById[a.ContextId].Title, a.Rule, AlertViews.Text(a.Rule),
            a.Rules.Split(',', StringSplitOptions.RemoveEmptyEntries), a.Severity, stateAtEnd[a.Id], DateTimeOffset.FromUnixTimeMilliseconds(a.RaisedAtMs),
            DateTimeOffset.FromUnixTimeMilliseconds(a.FirstSignalAtMs), DateTimeOffset.FromUnixTimeMilliseconds(a.LastSignalAtMs), a.SignalCount, a.PointCount,
            a.LotId, a.WaferSlot, a.Chamber, a.PredictedDvtSatMv, a.EscalatedAtMs is { } esc && esc < w.EndMs);

        var raised = alerts.Where(a => a.RaisedAtMs >= w.StartMs).Select(Row).ToList();
        var notClosed = alerts.Where(a => stateAtEnd[a.Id] != AlertStates.Closed).OrderByDescending(a => a.SeverityRank).ThenBy(a => a.RaisedAtMs).ToList();
        var actions = events.Where(e => e.AtMs >= w.StartMs).Select(e =>
        {
            var a = alertById[e.AlertId];
            return new AlertActionRow(a.Id, contextById[a.ContextId].Code, contextById[a.ContextId].Title, a.Rule, a.Severity, a.LotId, e.Kind, DateTimeOffset.FromUnixTimeMilliseconds(e.AtMs),
                e.By, e.Comment, e.StepsJson is null ? null : JsonSerializer.Deserialize<List<StepTaken>>(e.StepsJson, FeedLog.Json));
        }).ToList();

        var approved = await db.LimitVersions.AsNoTracking().Where(l => l.Status == "approved" && l.ApprovedAtMs < w.EndMs)
            .Select(l => l.ContextId).Distinct().ToListAsync(cancellationToken);
        var outOfControl = notClosed.Where(a => approved.Contains(a.ContextId)).GroupBy(a => a.ContextId).Select(g =>
        {
            var c = contextById[g.Key];
            return new OutOfControlRow(c.Code, c.Title, products[c.ProductId].Code, c.Step, c.Parameter, c.Chamber, g.Count(),
                Severity.Name(g.Max(a => a.SeverityRank)), [.. g.Select(a => a.Rule).Distinct().Order(StringComparer.Ordinal)]);
        }).OrderByDescending(r => Array.IndexOf(Severity.Names, r.WorstSeverity)).ThenBy(r => r.Context, StringComparer.Ordinal).ToList();

        var points = new Dictionary<int, List<ChartPoint>>();
        var previousStartMs = w.Start.AddDays(-7).ToUnixTimeMilliseconds();
        foreach (var c in contexts)
        {
            // The (context, measured-at) index serves this; the previous week is needed for the capability comparison.
            points[c.Id] = await db.ChartPoints.AsNoTracking().Where(p => p.ContextId == c.Id && p.MeasuredAtMs >= previousStartMs && p.MeasuredAtMs < w.EndMs)
                .OrderBy(p => p.Seq).ToListAsync(cancellationToken);
        }

        var openRows = notClosed.Select(Row).ToList();
        var needsAction = new NeedsActionSummary(openRows.Count, openRows.Count(a => a.StateAtShiftEnd == AlertStates.Open),
            openRows.Count(a => a.EscalatedByShiftEnd), outOfControl.Count);
        var contextState = contexts.ToDictionary(c => c.Id, c => outOfControl.Any(r => r.Context == c.Code) ? ContextStates.OutOfControl
            : approved.Contains(c.Id) ? ContextStates.InControl : ContextStates.Baseline);
        return new ShiftReportResponse(w.Name, w.Date, o.TimeZone, w.Start, w.End, (w.End - w.Start).TotalHours,
            now >= w.End ? "finished" : now >= w.Start ? "in_progress" : "not_started", now, [.. o.EffectivePattern.Select(s => s.Name)],
            needsAction, ShiftHandoverResponse.Of(w, await HandoverEndpoints.FindAsync(db, w, cancellationToken)),
            await LotsAsync(w, products, cancellationToken), raised, await SignalsMeasuredAsync(w, contexts, points, cancellationToken), actions,
            await MaintenanceAsync(w, contexts, cancellationToken), openRows, outOfControl,
            Risks(w, contexts, points, o.TopRisks), Capability(w, contexts, products, points, contextState, o.CapabilityMinPoints), EvaluateModel.PredictionCaution);
    }

    // Signal points by their measured time, each with the excursion that holds it (the alert of its chart whose chart
    // positions include it), so the report agrees with the floor and the alert pages whenever the lot was uploaded.
    private async Task<List<SignalsMeasuredRow>> SignalsMeasuredAsync(ShiftWindow w, List<ChartContext> contexts,
        Dictionary<int, List<ChartPoint>> points, CancellationToken cancellationToken)
    {
        var rows = new List<SignalsMeasuredRow>();
        foreach (var c in contexts)
        {
            var signalled = points[c.Id].Where(p => p.MeasuredAtMs >= w.StartMs && p.Signals.Length > 0).ToList();
            if (signalled.Count == 0)
            {
                continue;
            }

            var (low, high) = (signalled.Min(p => p.Seq), signalled.Max(p => p.Seq));
            var alerts = await db.Alerts.AsNoTracking().Where(a => a.ContextId == c.Id && a.FirstSeq <= high && a.LastSeq >= low)
                .ToListAsync(cancellationToken);
            foreach (var g in signalled.GroupBy(p => alerts.FirstOrDefault(a => a.FirstSeq <= p.Seq && p.Seq <= a.LastSeq)))
            {
                var rules = g.SelectMany(p => p.Signals.Split(',')).Distinct().Order(StringComparer.Ordinal).ToList();
                rows.Add(new SignalsMeasuredRow(g.Key?.Id, c.Code, c.Title, rules, [.. rules.Select(AlertViews.Text)], g.Count(),
                    g.Select(p => p.LotId).Distinct().Count(), DateTimeOffset.FromUnixTimeMilliseconds(g.Min(p => p.MeasuredAtMs)),
                    DateTimeOffset.FromUnixTimeMilliseconds(g.Max(p => p.MeasuredAtMs)),
                    g.Key is null ? null : DateTimeOffset.FromUnixTimeMilliseconds(g.Key.RaisedAtMs),
                    g.Key is { } a && a.RaisedAtMs >= w.StartMs && a.RaisedAtMs < w.EndMs));
            }
        }

        return [.. rows.OrderBy(r => r.FirstMeasuredAt).ThenBy(r => r.Context, StringComparer.Ordinal)];
    }

    // Maintenance by the time it finished (the chamber went back to production), through the occurred-at index.
    private async Task<List<MaintenancePerformedRow>> MaintenanceAsync(ShiftWindow w, List<ChartContext> contexts, CancellationToken cancellationToken)
    {
        var events = await db.MaintenanceEvents.AsNoTracking().Where(e => e.OccurredAtMs >= w.StartMs && e.OccurredAtMs < w.EndMs)
            .OrderBy(e => e.OccurredAtMs).ThenBy(e => e.Id).ToListAsync(cancellationToken);
        return [.. events.Select(MaintenanceLog.Describe).Select(m => new MaintenancePerformedRow(m.Id, m.Chamber, m.Kind, m.OccurredAt, m.PerformedBy,
            m.Note, m.RecordedBy, [.. contexts.Where(c => c.Chamber == m.Chamber).Select(c => new ChamberContextRow(c.Code, c.Title))]))];
    }

    private async Task<List<LotMeasuredRow>> LotsAsync(ShiftWindow w, Dictionary<int, Product> products, CancellationToken cancellationToken)
    {
        // The lot summaries (indexed by last measured time) say which product and step had sites in the shift; the
        // sites themselves are then read through the (product, step, measured-at) index, one wafer and chamber per row.
        var steps = await db.LotSteps.AsNoTracking().Where(l => l.LastMeasuredAtMs >= w.StartMs && l.FirstMeasuredAtMs < w.EndMs)
            .Select(l => new { l.ProductId, l.Step }).Distinct().ToListAsync(cancellationToken);
        var rows = new List<LotMeasuredRow>();
        foreach (var s in steps)
        {
            var wafers = await db.Measurements.AsNoTracking()
                .Where(m => m.ProductId == s.ProductId && m.Step == s.Step && m.MeasuredAtMs >= w.StartMs && m.MeasuredAtMs < w.EndMs)
                .GroupBy(m => new { m.LotId, m.WaferSlot, m.EtchChamber, m.LinerChamber })
                .Select(g => new { g.Key.LotId, g.Key.WaferSlot, g.Key.EtchChamber, g.Key.LinerChamber, Sites = g.Count(), First = g.Min(m => m.MeasuredAtMs), Last = g.Max(m => m.MeasuredAtMs) })
                .ToListAsync(cancellationToken);
            rows.AddRange(wafers.GroupBy(x => x.LotId).Select(g => new LotMeasuredRow(g.Key, products[s.ProductId].Code, s.Step,
                g.Select(x => x.WaferSlot).Distinct().Count(), g.Sum(x => x.Sites),
                [.. g.SelectMany(x => new[] { x.EtchChamber, x.LinerChamber }).OfType<string>().Distinct().Order(StringComparer.Ordinal)],
                DateTimeOffset.FromUnixTimeMilliseconds(g.Min(x => x.First)), DateTimeOffset.FromUnixTimeMilliseconds(g.Max(x => x.Last)))));
        }

        return [.. rows.OrderBy(r => r.FirstMeasuredAt).ThenBy(r => r.LotId, StringComparer.Ordinal).ThenBy(r => r.Step, StringComparer.Ordinal)];
    }

    private static List<DvtRiskRow> Risks(ShiftWindow w, List<ChartContext> contexts, Dictionary<int, List<ChartPoint>> points, int top)
    {
        // A wafer watched by several contexts is listed once, by its largest |ΔVT sat| among them, with the others named.
        var inShift = contexts.SelectMany(c => points[c.Id].Where(p => p.MeasuredAtMs >= w.StartMs && p.PredictedDvtSatMv is not null).Select(p => (c, p)));
        return [.. inShift.GroupBy(x => (x.p.LotId, x.p.WaferSlot)).Select(g =>
            {
                var (c, p) = g.OrderByDescending(x => Math.Abs(x.p.PredictedDvtSatMv!.Value)).ThenBy(x => x.c.Code, StringComparer.Ordinal).First();
                var others = g.Select(x => x.c).Where(o => o.Code != c.Code).DistinctBy(o => o.Code).OrderBy(o => o.Code, StringComparer.Ordinal).ToList();
                return new DvtRiskRow(p.LotId, p.WaferSlot, p.Chamber, DateTimeOffset.FromUnixTimeMilliseconds(p.MeasuredAtMs), p.PredictedDvtSatMv!.Value,
                    c.Code, c.Title, c.ElectricalConcernMv, [.. others.Select(o => o.Code)], [.. others.Select(o => o.Title)]);
            })
            .OrderByDescending(r => Math.Abs(r.PredictedDvtSatMv)).ThenBy(r => r.LotId, StringComparer.Ordinal).ThenBy(r => r.WaferSlot).Take(top)];
    }

    private static List<CapabilityChangeRow> Capability(ShiftWindow w, List<ChartContext> contexts, Dictionary<int, Product> products,
        Dictionary<int, List<ChartPoint>> points, Dictionary<int, string> stateAtEnd, int minPoints)
    {
        var rows = new List<CapabilityChangeRow>();
        foreach (var c in contexts)
        {
            var spec = products[c.ProductId].Specs.FirstOrDefault(s => s.Parameter == c.Parameter);
            if (spec is null || (spec.Lower is null && spec.Upper is null))
            {
                continue;
            }

            var limits = new SpecLimits(spec.Lower, spec.Upper, spec.Target);
            var shift = Window(c, limits, points[c.Id].Where(p => p.MeasuredAtMs >= w.StartMs).ToList(), w.Start, w.End, minPoints);
            var previous = Window(c, limits, points[c.Id].Where(p => p.MeasuredAtMs < w.StartMs).ToList(), w.Start.AddDays(-7), w.Start, minPoints);
            // The week through the shift's end: enough points for an index where one shift has only a few lots.
            var week = Window(c, limits, points[c.Id].Where(p => p.MeasuredAtMs >= w.End.AddDays(-7).ToUnixTimeMilliseconds()).ToList(), w.End.AddDays(-7), w.End, minPoints);
            rows.Add(new CapabilityChangeRow(c.Code, c.Title, stateAtEnd[c.Id], c.Parameter, FinParameters.TryGet(c.Parameter, out var p) ? p.Unit : "", spec.Lower, spec.Upper,
                week, shift, previous, shift.Cpk - previous.Cpk));
        }

        return rows;
    }

    private static CapabilityWindowRow Window(ChartContext c, SpecLimits spec, List<ChartPoint> used, DateTimeOffset from, DateTimeOffset to, int minPoints)
    {
        if (used.Count < minPoints)
        {
            return new CapabilityWindowRow(from, to, used.Count, null, null, null,
                $"{used.Count} point{(used.Count == 1 ? "" : "s")}; Cpk needs at least {minPoints}");
        }

        var (_, sigma) = BaselineLimits.Estimate(c, used);
        var r = ProcessCapability.Compute([.. used.Select(p => p.Value)], sigma ?? double.NaN, spec);
        return new CapabilityWindowRow(from, to, used.Count, r.Mean, r.SigmaWithin, r.Cpk,
            r.Cpk is null ? r.Reasons.GetValueOrDefault(CapabilityIndexNames.Cpk) ?? r.Reasons.GetValueOrDefault("SigmaWithin") ?? "not computable" : null);
    }
}
