using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Statistics.Rules;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// One excursion of one chart while a batch is evaluated: its alert, the points it collects (every point of the chart
/// from the first signal until a person closes it), the rules that fired, the lots and wafers involved, its highest
/// severity, and whether the last N points (a setting) fired no rule, which marks it back in control. The history
/// entries (raised, rule added, back in control, signalling again) are kept until the points have ids.
/// </summary>
public sealed class Excursion
{
    private readonly HashSet<string> lots;
    private readonly HashSet<(string, int)> wafers;
    private readonly List<string> rules;
    private readonly List<(string Kind, ChartPoint Point, string Comment)> events = [];
    private ChartPoint? firstPoint;
    private ChartPoint? lastPoint;

    private Excursion(Alert alert, bool raised, HashSet<string> lots, HashSet<(string, int)> wafers)
    {
        Alert = alert;
        Raised = raised;
        this.lots = lots;
        this.wafers = wafers;
        rules = [.. alert.Rules.Split(',', StringSplitOptions.RemoveEmptyEntries)];
    }

    public Alert Alert { get; }

    /// <summary>Opened by this evaluation.</summary>
    public bool Raised { get; }

    /// <summary>Collected a point in this evaluation.</summary>
    public bool Changed { get; private set; }

    /// <summary>A new excursion, opened by a point that fired a rule.</summary>
    public static Excursion Open(ChartContext context, ChartPoint point, long nowMs)
    {
        var alert = new Alert
        {
            ContextId = context.Id, Rule = "", Rules = "", State = AlertStates.Open, RaisedAtMs = nowMs, UpdatedAtMs = nowMs,
            FirstSeq = point.Seq, LastSeq = point.Seq, LastSignalSeq = point.Seq, FirstSignalAtMs = point.MeasuredAtMs,
            LastSignalAtMs = point.MeasuredAtMs, LotId = point.LotId, WaferSlot = point.WaferSlot, Chamber = point.Chamber,
            Severity = Severity.Name(0),
        };
        return new Excursion(alert, true, [], []) { firstPoint = point };
    }

    /// <summary>
    /// The chart's excursion that is not closed. Of the lots and wafers it has collected so far, only those the new
    /// points could repeat are read (<paramref name="incomingLots"/>): the stored counts cover the rest.
    /// </summary>
    public static async Task<Excursion> ResumeAsync(FinWatchDbContext db, Alert alert, IReadOnlyCollection<string> incomingLots, CancellationToken cancellationToken)
    {
        var involved = await db.ChartPoints.AsNoTracking()
            .Where(p => p.ContextId == alert.ContextId && p.Seq >= alert.FirstSeq && p.Seq <= alert.LastSeq && incomingLots.Contains(p.LotId))
            .Select(p => new { p.LotId, p.WaferSlot }).Distinct().ToListAsync(cancellationToken);
        return new Excursion(alert, false, [.. involved.Select(w => w.LotId)],
            [.. involved.Where(w => w.WaferSlot is not null).Select(w => (w.LotId, w.WaferSlot!.Value))]);
    }

    /// <summary>Adds a point of the chart (after the first signal) with the rules it fired, if any.</summary>
    public void Collect(ChartContext context, ChartPoint point, IReadOnlyList<RunRule> fired, long nowMs, int quietPoints)
    {
        var a = Alert;
        Changed = true;
        lastPoint = point;
        a.UpdatedAtMs = nowMs;
        a.LastSeq = point.Seq;
        a.PointCount++;
        if (lots.Add(point.LotId))
        {
            a.LotCount++;
        }

        if (point.WaferSlot is { } slot && wafers.Add((point.LotId, slot)))
        {
            a.WaferCount++;
        }
        if (fired.Count > 0)
        {
            Signal(context, point, fired);
        }
        else if (a.BackInControlAtMs is null && point.Seq - a.LastSignalSeq >= quietPoints)
        {
            a.BackInControlAtMs = nowMs;
            events.Add(("back-in-control", point, $"no rule fired on the last {quietPoints} points (through lot {Where(point)})"));
        }
    }

    private void Signal(ChartContext context, ChartPoint point, IReadOnlyList<RunRule> fired)
    {
        var a = Alert;
        a.SignalCount++;
        a.LastSignalSeq = point.Seq;
        a.LastSignalAtMs = point.MeasuredAtMs;
        a.LotId = point.LotId;
        a.WaferSlot = point.WaferSlot;
        a.Chamber = point.Chamber;
        if (point.PredictedDvtSatMv is { } d && (a.PredictedDvtSatMv is not { } old || Math.Abs(d) > Math.Abs(old)))
        {
            a.PredictedDvtSatMv = d;
        }

        if (a.BackInControlAtMs is not null)
        {
            a.BackInControlAtMs = null;
            events.Add(("signalling-again", point, $"{Severity.Describe(fired[0])} at lot {Where(point)}"));
        }

        foreach (var rule in fired)
        {
            var id = RunRules.Id(rule);
            if (!rules.Contains(id))
            {
                rules.Add(id);
                events.Add((rules.Count == 1 ? "raised" : "rule-added", point, $"{Severity.Describe(rule)} at lot {Where(point)}"));
            }

            a.SeverityRank = Math.Max(a.SeverityRank, Severity.Rank(rule, a.PredictedDvtSatMv, context.ElectricalConcernMv));
        }

        if (a.Rule.Length == 0)
        {
            a.Rule = rules[0];
        }

        a.Rules = string.Join(',', rules);
        a.Severity = Severity.Name(a.SeverityRank);
    }

    /// <summary>After the points are saved: points the alert at them and adds it (new) or marks its changes (resumed).</summary>
    public void Attach(FinWatchDbContext db)
    {
        if (firstPoint is not null)
        {
            Alert.FirstPointId = firstPoint.Id;
        }

        if (lastPoint is not null)
        {
            Alert.LastPointId = lastPoint.Id;
        }

        if (Raised)
        {
            db.Alerts.Add(Alert);
        }
        else
        {
            db.Entry(Alert).DetectChanges();
        }
    }

    /// <summary>After the alert is saved: its new history entries.</summary>
    public void AddEvents(FinWatchDbContext db)
    {
        foreach (var (kind, point, comment) in events)
        {
            db.AlertEvents.Add(new AlertEvent { AlertId = Alert.Id, Kind = kind, AtMs = Alert.UpdatedAtMs, By = "FinWatch", PointId = point.Id, Comment = comment });
        }

        events.Clear();
    }

    private static string Where(ChartPoint point) => point.WaferSlot is { } s ? $"{point.LotId} wafer {s}" : point.LotId;
}
