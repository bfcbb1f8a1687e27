using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Notify;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// The step after store in the one-way flow: turns each stored ingest batch into points of every chart context it
/// concerns, judges them through <see cref="ChartJudge"/> by the limits in force when they were measured (the rule
/// state is rebuilt from the context's last judged points), opens or extends the chart's excursion alert, and
/// records all of it in the live feed, in one transaction per context and batch. Contexts resume after the last batch
/// they evaluated, so a batch missed by a crash is evaluated at the next run and none twice. Several instances on one
/// PostgreSQL database coordinate through the database: each context's transaction takes the monitor lock
/// (<see cref="IDatabaseDialect.LockMonitorAsync"/>) and re-reads the context's <c>EvaluatedThroughBatchId</c> under it,
/// so a batch another instance has evaluated meanwhile is not evaluated again, and batches commit in number order
/// (the ingest lock), so none is skipped.
/// </summary>
public sealed class MonitorEvaluator(FinWatchDbContext db, IDatabaseDialect dialect, MonitorGate gate, TimeProvider clock, MonitorFeed feed, Telemetry telemetry,
    IOptions<MonitorOptions> options, IOptions<NotifyOptions> notify, OutboxSignal outbox, ILogger<MonitorEvaluator> logger)
    : IBatchStoredListener
{
    /// <summary>More than the longest rule window (N7, 15 points), so the replayed state equals the full history's.</summary>
    private const int ReplayPoints = 20;

    // The alerts this evaluation opened, for the telemetry (severity, opening rule).
    private readonly List<(string Severity, string Rule)> raised = [];

    // Notifications written to the outbox by this evaluation: the sender is woken after the commit.
    private int notified;

    /// <summary>A batch was stored: evaluate it (and any batch before it that is still pending).</summary>
    public async Task BatchStoredAsync(StoredBatch batch, CancellationToken cancellationToken) => await EvaluatePendingAsync(cancellationToken);

    /// <summary>Evaluates every batch not yet evaluated by every context, in batch order; returns the new feed entries.</summary>
    public async Task<IReadOnlyList<FeedMessage>> EvaluatePendingAsync(CancellationToken cancellationToken)
    {
        using var measured = telemetry.StartEvaluation();
        await gate.Semaphore.WaitAsync(cancellationToken);
        var published = new List<FeedMessage>();
        try
        {
            var contexts = await db.ChartContexts.AsNoTracking().OrderBy(c => c.Id).ToListAsync(cancellationToken);
            if (contexts.Count == 0)
            {
                measured.Completed();
                return published;
            }

            var lastBatch = await db.IngestBatches.MaxAsync(b => (long?)b.Id, cancellationToken) ?? 0;
            foreach (var context in contexts.Where(c => c.EvaluatedThroughBatchId < lastBatch))
            {
                raised.Clear();
                var committed = await EvaluateContextAsync(context, lastBatch, cancellationToken);
                measured.Committed(committed.Count(m => m.Point is not null), [.. raised]);
                published.AddRange(committed);
            }
        }
        finally
        {
            gate.Semaphore.Release();
        }

        measured.Completed();
        feed.Publish(published);
        if (notified > 0)
        {
            outbox.Nudge();
            notified = 0;
        }

        return published;
    }

    private sealed record SiteValue(string LotId, int WaferSlot, long At, string? EtchChamber, string? LinerChamber, double Value, double? DvtSat);

    private async Task<List<FeedMessage>> EvaluateContextAsync(ChartContext context, long throughBatch, CancellationToken cancellationToken)
    {
        if (!FinParameters.TryGet(context.Parameter, out var parameter))
        {
            logger.LogWarning("Context {Context} names an unknown parameter {Parameter}; skipped", context.Code, context.Parameter);
            return [];
        }

        var candidates = await CandidatesAsync(context, parameter.Property, context.EvaluatedThroughBatchId, throughBatch, cancellationToken);

        // A batch can bring thousands of points per context and every signal saves once (its alert refers to the
        // point by id): automatic change detection would rescan everything tracked at each save, quadratic in the
        // batch. The only entities changed after being attached are the context and alerts; they are detected by hand.
        db.ChangeTracker.AutoDetectChangesEnabled = false;
        try
        {
            await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
            await dialect.LockMonitorAsync(db, cancellationToken);
            var tracked = await db.ChartContexts.SingleAsync(c => c.Id == context.Id, cancellationToken);
            if (tracked.EvaluatedThroughBatchId >= throughBatch)
            {
                return []; // another instance evaluated these batches while this one read them
            }

            if (tracked.EvaluatedThroughBatchId != context.EvaluatedThroughBatchId)
            {
                candidates = await CandidatesAsync(tracked, parameter.Property, tracked.EvaluatedThroughBatchId, throughBatch, cancellationToken);
            }

            var messages = new List<FeedMessage>();
            if (candidates.Count > 0)
            {
                messages = await JudgeAsync(tracked, candidates, cancellationToken);
            }

            tracked.EvaluatedThroughBatchId = throughBatch;
            db.Entry(tracked).DetectChanges();
            await db.SaveChangesAsync(cancellationToken);
            await transaction.CommitAsync(cancellationToken);
            return messages;
        }
        finally
        {
            db.ChangeTracker.Clear();
            db.ChangeTracker.AutoDetectChangesEnabled = true;
        }
    }

    // The points of the batches after fromBatch through throughBatch, read one batch at a time.
    private async Task<List<ChartPoint>> CandidatesAsync(ChartContext context, string column, long fromBatch, long throughBatch, CancellationToken cancellationToken)
    {
        var batches = await db.IngestBatches.AsNoTracking().Where(b => b.Id > fromBatch && b.Id <= throughBatch)
            .OrderBy(b => b.Id).Select(b => b.Id).ToListAsync(cancellationToken);
        var candidates = new List<ChartPoint>();
        foreach (var batchId in batches)
        {
            // One batch at a time by equality, so the (batch, product, step) index serves it however long the history.
            var q = db.Measurements.AsNoTracking().Where(m => m.BatchId == batchId
                && m.ProductId == context.ProductId && m.Step == context.Step && EF.Property<double?>(m, column) != null);
            if (context.Chamber is { } chamber)
            {
                // One chamber or one whole tool: the name is matched against the etch and liner chambers and tools.
                q = q.Where(m => m.EtchChamber == chamber || m.LinerChamber == chamber || m.EtchTool == chamber || m.LinerTool == chamber);
            }

            var sites = await q.Select(m => new SiteValue(m.LotId, m.WaferSlot, m.MeasuredAtMs, m.EtchChamber, m.LinerChamber,
                    EF.Property<double?>(m, column)!.Value, m.DeltaVtSatMv))
                .ToListAsync(cancellationToken);
            candidates.AddRange(Subgroups(context, batchId, sites));
        }

        return candidates;
    }

    // One point per wafer (its sites) or per lot (its wafer means) of each batch, in measured-at order.
    private static IEnumerable<ChartPoint> Subgroups(ChartContext context, long batchId, IEnumerable<SiteValue> sites)
    {
        var wafers = sites.GroupBy(s => (s.LotId, s.WaferSlot)).Select(g => new
        {
            g.Key.LotId,
            g.Key.WaferSlot,
            At = g.Max(s => s.At),
            Chamber = context.Chamber ?? g.Select(s => s.EtchChamber ?? s.LinerChamber).FirstOrDefault(c => c is not null),
            Values = g.Select(s => s.Value).ToArray(),
            Dvt = g.Where(s => s.DvtSat is not null).Select(s => s.DvtSat!.Value).DefaultIfEmpty(double.NaN).Average(),
        }).ToList();
        IEnumerable<ChartPoint> points = context.Subgroup == "lot"
            ? wafers.GroupBy(w => w.LotId).Select(g => Point(context, batchId, g.Key, null, g.Max(w => w.At),
                g.Select(w => w.Chamber).FirstOrDefault(c => c is not null), [.. g.Select(w => w.Values.Average())],
                g.Select(w => w.Dvt).Where(double.IsFinite).DefaultIfEmpty(double.NaN).Average()))
            : wafers.Select(w => Point(context, batchId, w.LotId, w.WaferSlot, w.At, w.Chamber, w.Values, w.Dvt));
        return points.OrderBy(p => p.MeasuredAtMs).ThenBy(p => p.LotId, StringComparer.Ordinal).ThenBy(p => p.WaferSlot);
    }

    private static ChartPoint Point(ChartContext context, long batchId, string lot, int? slot, long at, string? chamber, double[] values, double dvt)
    {
        var mean = values.Average();
        double? sd = values.Length >= 2 ? Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1)) : null;
        return new ChartPoint
        {
            ContextId = context.Id, BatchId = batchId, LotId = lot, WaferSlot = slot, MeasuredAtMs = at, Chamber = chamber,
            Value = mean, N = values.Length, Sd = sd, PredictedDvtSatMv = double.IsFinite(dvt) ? dvt : null,
        };
    }

    private async Task<List<FeedMessage>> JudgeAsync(ChartContext context, List<ChartPoint> points, CancellationToken cancellationToken)
    {
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var limits = await db.LimitVersions.AsNoTracking().Where(l => l.ContextId == context.Id && l.Status == "approved")
            .ToListAsync(cancellationToken);
        var judge = new ChartJudge(context, limits, ContextRules.Parse(context.Rules));
        var history = await db.ChartPoints.AsNoTracking().Where(p => p.ContextId == context.Id && p.Z != null)
            .OrderByDescending(p => p.Seq).Take(ReplayPoints).ToListAsync(cancellationToken);
        foreach (var p in history.OrderBy(p => p.Seq))
        {
            judge.Replay(p);
        }

        var seq = await db.ChartPoints.Where(p => p.ContextId == context.Id).MaxAsync(p => (long?)p.Seq, cancellationToken) ?? 0;

        // The chart's excursion, if one is not closed (the newest, should alerts stored before excursions leave several).
        var open = await db.Alerts.Where(a => a.ContextId == context.Id && a.State != AlertStates.Closed)
            .OrderByDescending(a => a.Id).FirstOrDefaultAsync(cancellationToken);
        var excursion = open is null ? null : await Excursion.ResumeAsync(db, open, [.. points.Select(p => p.LotId).Distinct()], cancellationToken);
        var excursions = new List<Excursion>();
        if (excursion is not null)
        {
            excursions.Add(excursion);
        }

        var staged = new List<(FeedEvent, FeedMessage)>();
        foreach (var point in points)
        {
            point.Seq = ++seq;
            var fired = judge.Judge(point);
            db.ChartPoints.Add(point);
            staged.Add(FeedLog.Stage(db, "point", context, ContextRules.ToMessage(context, point, judge.LimitAt(point.MeasuredAtMs)), null, now));
            if (excursion is null && fired.Count > 0)
            {
                excursion = Excursion.Open(context, point, now);
                excursions.Add(excursion);
            }

            excursion?.Collect(context, point, fired, now, options.Value.BackInControlAfterPoints);
        }

        // Points first (the alerts refer to them by id), then the alerts, then their history and the feed.
        await db.SaveChangesAsync(cancellationToken);
        foreach (var e in excursions)
        {
            e.Attach(db);
        }

        await db.SaveChangesAsync(cancellationToken);
        foreach (var e in excursions.Where(e => e.Changed))
        {
            e.AddEvents(db);
            staged.Add(FeedLog.Stage(db, "alert", context, null, AlertViews.ToMessage(e.Alert, context), now));
            if (e.Raised)
            {
                raised.Add((e.Alert.Severity, e.Alert.Rule));
                // The notifications of a new alert commit with it (the outbox), or neither does.
                notified += await NotificationOutbox.StageRaisedAsync(db, notify.Value, e.Alert, context, now, cancellationToken);
            }
        }

        await db.SaveChangesAsync(cancellationToken);
        return FeedLog.Numbered(staged);
    }
}

/// <summary>
/// One evaluation at a time within this server process (its instances of <see cref="MonitorEvaluator"/> are per request).
/// Between server processes on one PostgreSQL database, the database's monitor lock does the same.
/// </summary>
public sealed class MonitorGate : IDisposable
{
    public SemaphoreSlim Semaphore { get; } = new(1, 1);

    public void Dispose() => Semaphore.Dispose();
}
