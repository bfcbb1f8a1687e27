using FinWatch.Data.Entities;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.Shewhart;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// Judges a context's points in chart order through the statistics library's incremental chart monitor
/// (<see cref="ShewhartMonitor"/>): each point is placed against the approved limit version in force at its measured
/// time, gets its zone score, and feeds the context's run rules. When the limits change the monitor continues with the
/// new ones and keeps its rule state. No limit, z or rule arithmetic lives here; only the choice of limits and the
/// mapping of a context to a chart type ("xbar": subgroup means against σ/√n, an Xbar-S chart; "individuals": subgroup
/// means as individual values, an I-MR chart).
/// </summary>
public sealed class ChartJudge(ChartContext context, IReadOnlyList<LimitVersion> approvedLimits, IReadOnlyList<RunRule> rules)
{
    private readonly IReadOnlyList<LimitVersion> limits = [.. approvedLimits.OrderBy(l => l.EffectiveFromMs)];
    private ShewhartMonitor? monitor;
    private int? monitorLimitId;

    public ShewhartChartType ChartType { get; } = ChartTypeOf(context);

    public static ShewhartChartType ChartTypeOf(ChartContext context) =>
        context.ChartType == "xbar" ? ShewhartChartType.MeanStandardDeviation : ShewhartChartType.IndividualsMovingRange;

    /// <summary>The approved version that judges a point measured at this time: the newest in force then; null before any.</summary>
    public LimitVersion? LimitAt(long measuredAtMs) => limits.LastOrDefault(l => l.EffectiveFromMs <= measuredAtMs);

    /// <summary>
    /// Restores the rule state from a point judged earlier (under its stored limit version); its signals are not
    /// reported again.
    /// </summary>
    public void Replay(ChartPoint point)
    {
        var limit = point.LimitVersionId is { } id ? limits.FirstOrDefault(l => l.Id == id) : null;
        if (limit is not null)
        {
            Place(point, limit, null);
        }
    }

    /// <summary>
    /// Judges a new point: sets its limit version, z and signal ids, and returns the rules it fired. A point before any
    /// approved limits is stored unjudged.
    /// </summary>
    public IReadOnlyList<RunRule> Judge(ChartPoint point)
    {
        var limit = LimitAt(point.MeasuredAtMs);
        if (limit is null)
        {
            return [];
        }

        var signals = new List<RuleSignal>();
        var placed = Place(point, limit, signals);
        point.LimitVersionId = limit.Id;
        point.Z = double.IsNaN(placed.Z) ? null : placed.Z;
        point.Signals = string.Join(',', signals.Select(s => RunRules.Id(s.Rule)));
        return [.. signals.Select(s => s.Rule)];
    }

    private MonitorPoint Place(ChartPoint point, LimitVersion limit, List<RuleSignal>? signals)
    {
        if (monitor is null)
        {
            monitor = new ShewhartMonitor(ChartType, limit.Centre, limit.Sigma, rules);
        }
        else if (monitorLimitId != limit.Id)
        {
            monitor = monitor.Continue(limit.Centre, limit.Sigma);
        }

        monitorLimitId = limit.Id;
        return ChartType == ShewhartChartType.IndividualsMovingRange
            ? monitor.Append(point.Value, signals)
            : monitor.AppendSummary(point.Value, point.N, point.Sd ?? double.NaN, signals);
    }
}
