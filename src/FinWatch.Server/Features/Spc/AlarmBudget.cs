using System.Globalization;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Reports;
using FinWatch.Server.Infrastructure;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.RunLength;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// The alarm budget of a chart (docs/statistics.md §4.5): how often its rules raise a false alarm while the process is in
/// control, and how soon they catch a 1σ and a 2σ shift of the plotted statistic, in points and, at the chart's
/// recent point rate, in hours; and the floor's expected false alarms per shift.
/// </summary>
public static class AlarmBudget
{
    /// <summary>The point rate is taken over this many days before now (or since the chart's first point, if later).</summary>
    public const int RateWindowDays = 14;

    /// <summary>Shifts of the plotted statistic whose detection is reported, in its sigmas.</summary>
    public static readonly double[] DetectionShifts = [1, 2];

    private const long DayMs = 86_400_000;

    /// <summary>
    /// The point rate of each context (of one when <paramref name="contextId"/> is given) with points: the points measured
    /// in the last <see cref="RateWindowDays"/> days over the days covered, counted from the chart's first point when the
    /// chart is younger than that, and at least one day.
    /// </summary>
    public static async Task<Dictionary<int, RunLengthRate>> RatesAsync(FinWatchDbContext db, DateTimeOffset now, int? contextId, CancellationToken cancellationToken)
    {
        var nowMs = now.ToUnixTimeMilliseconds();
        var windowStartMs = nowMs - (RateWindowDays * DayMs);
        var points = db.ChartPoints.AsNoTracking().Where(p => p.MeasuredAtMs <= nowMs);
        if (contextId is { } id)
        {
            points = points.Where(p => p.ContextId == id);
        }

        var rows = await points.GroupBy(p => p.ContextId)
            .Select(g => new { ContextId = g.Key, FirstMs = g.Min(p => p.MeasuredAtMs), Recent = g.Count(p => p.MeasuredAtMs > windowStartMs) })
            .ToListAsync(cancellationToken);
        return rows.ToDictionary(r => r.ContextId, r =>
        {
            var fromMs = Math.Max(windowStartMs, r.FirstMs);
            var days = Math.Max(1.0, (nowMs - fromMs) / (double)DayMs);
            return new RunLengthRate(r.Recent, Time.FromMs(fromMs), Time.FromMs(nowMs), days);
        });
    }

    /// <summary>The budget of a stored context at its rate (null: no points measured yet).</summary>
    public static RunLengthResponse ForContext(ChartContext context, bool monitoring, RunLengthRate? rate)
    {
        var notes = new List<string>();
        if (!monitoring)
        {
            notes.Add("The chart has no approved limits yet, so it raises no alarms; these are the figures once limits are approved.");
        }

        return Compose(context.ChartType, ContextRules.Parse(context.Rules), context, monitoring, rate, RateOf(rate, notes), notes);
    }

    /// <summary>The budget of a rule set not saved yet, at a stored context's rate or at a given one.</summary>
    public static RunLengthResponse ForRequest(RunLengthRequest request, ChartContext? context, bool monitoring, RunLengthRate? rate)
    {
        var notes = new List<string>();
        var perDay = request.PointsPerDay ?? (context is null ? null : RateOf(rate, notes));
        if (context is null && request.PointsPerDay is null)
        {
            notes.Add("No point rate: give context or points_per_day to have the times in hours.");
        }

        return Compose(request.ChartType!, ContextRules.Parse(string.Join(',', request.Rules!)), context, monitoring, rate, perDay, notes);
    }

    /// <summary>The floor's expected false alarms: the sum over the charts with approved limits, per day and per shift.</summary>
    public static FloorRunLengthResponse Floor(DateTimeOffset now, IReadOnlyList<RunLengthResponse> charts, IReadOnlyList<ShiftDefinition> pattern)
    {
        var counted = charts.Where(c => c.Phase == Monitoring).ToList();
        var perDay = counted.Sum(c => c.FalseAlarmsPerDay ?? 0);
        return new FloorRunLengthResponse(now.UtcDateTime, charts, counted.Count, perDay,
            [.. pattern.Select(s => new ShiftFalseAlarms(s.Name, s.LengthHours, perDay * s.LengthHours / 24))],
            "Expected false alarms of the charts with approved limits (in control, at each chart's point rate of the last "
            + $"{RateWindowDays} days); charts in their baseline phase raise no alarms and are not counted.");
    }

    private const string Monitoring = "monitoring";

    private static double? RateOf(RunLengthRate? rate, List<string> notes)
    {
        if (rate is not { Points: > 0 })
        {
            notes.Add($"No points were measured in the last {RateWindowDays} days, so the times cannot be estimated; the numbers of points hold.");
            return rate is null ? null : 0;
        }

        return rate.Points / rate.Days;
    }

    private static RunLengthResponse Compose(
        string chartType, IReadOnlyList<RunRule> rules, ChartContext? context, bool monitoring, RunLengthRate? rate, double? perDay, List<string> notes)
    {
        var falseAlarm = Figure(rules, 0, perDay);
        double? falseAlarmsPerDay = perDay is { } r && falseAlarm.Points is { } arl ? r / arl : null;
        if (falseAlarm.Points is null)
        {
            notes.Add("False alarms are too rare to estimate with this rule set.");
        }

        notes.Add("Run lengths assume independent, normally distributed points and limits at the true mean ± 3σ; a shift is present from the first point.");
        return new RunLengthResponse(context?.Code, context?.Title, context is null ? null : monitoring ? Monitoring : "baseline", chartType,
            PlottedStatistic(chartType, context?.Subgroup), [.. rules.Order().Select(RunRules.Id)], perDay, rate, falseAlarm, falseAlarmsPerDay,
            [.. DetectionShifts.Select(d => Figure(rules, d, perDay))], notes);
    }

    private static RunLengthFigure Figure(IReadOnlyList<RunRule> rules, double shift, double? perDay)
    {
        var estimate = RuleSetRunLength.Estimate(rules, shift);
        var points = RunAnalysis.Nullable(estimate.Points);
        double? hours = points is { } p && perDay is > 0 ? p / perDay.Value * 24 : null;
        return new RunLengthFigure(shift, points, hours, points is null ? null : estimate.StandardError, Method(estimate));
    }

    /// <summary>"exact Markov chain" or "simulation, R runs, standard error x points".</summary>
    public static string Method(RunLengthEstimate e) => e.Method == RunLengthMethod.MarkovChain
        ? "exact Markov chain"
        : e.IsResolved
            ? string.Create(CultureInfo.InvariantCulture, $"simulation, {e.Runs} runs, standard error {e.StandardError:G3} points")
            : string.Create(CultureInfo.InvariantCulture,
                $"simulation: {e.Runs} of at least {RunLengthSimulation.MinRuns} runs signalled within {RunLengthSimulation.DefaultPointBudget} simulated points, so the run length is too long to estimate");

    private static string PlottedStatistic(string chartType, string? subgroup)
    {
        var group = subgroup switch { "wafer" => "a wafer's sites", "lot" => "a lot's wafer means", _ => "a subgroup" };
        return chartType == "xbar"
            ? $"the mean of {group}, against 3σ limits of that mean"
            : $"the mean of {group} as an individual value, against 3σ limits from the moving range";
    }
}
