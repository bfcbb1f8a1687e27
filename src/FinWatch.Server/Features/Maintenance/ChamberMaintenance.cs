using System.Globalization;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Statistics.Comparison;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Maintenance;

/// <summary>
/// What the charts know of maintenance: the events of a set of chambers around a range of points (one query, however
/// many points), a chart's last maintenance with the lots and hours since, and whether its mean moved at it.
/// An event belongs to a point when it names the point's chamber (or the tool a whole-tool chart watches) and happened
/// before the point was measured.
/// </summary>
public static class ChamberMaintenance
{
    /// <summary>Points compared on each side of a maintenance (at most).</summary>
    public const int Window = 25;

    /// <summary>Points needed on each side before the means are compared (FinWatch convention, docs/statistics.md §4.5).</summary>
    public const int MinimumEachSide = 5;

    /// <summary>Significance level of the comparison (FinWatch convention, docs/statistics.md §4.5).</summary>
    public const double Alpha = 0.01;

    public static MaintenanceMarker Marker(MaintenanceEvent e, long? firstPoint) =>
        new(e.Id, e.Chamber, MaintenanceKindText.ToText(e.Kind), DateTimeOffset.FromUnixTimeMilliseconds(e.OccurredAtMs), firstPoint);

    /// <summary>
    /// The events of <paramref name="chambers"/> that happened up to <paramref name="toMs"/>, in time order, keeping of
    /// those before <paramref name="fromMs"/> only each chamber's last (the maintenance the first points follow). One query.
    /// </summary>
    public static async Task<List<MaintenanceEvent>> AroundAsync(FinWatchDbContext db, IReadOnlyCollection<string> chambers, long fromMs, long toMs,
        CancellationToken cancellationToken)
    {
        if (chambers.Count == 0)
        {
            return [];
        }

        var events = await db.MaintenanceEvents.AsNoTracking().Where(e => chambers.Contains(e.Chamber) && e.OccurredAtMs <= toMs)
            .OrderBy(e => e.OccurredAtMs).ThenBy(e => e.Id).ToListAsync(cancellationToken);
        var lastBefore = events.Where(e => e.OccurredAtMs < fromMs).GroupBy(e => e.Chamber).Select(g => g.Last()).ToHashSet();
        return [.. events.Where(e => e.OccurredAtMs >= fromMs || lastBefore.Contains(e))];
    }

    /// <summary>
    /// Markers for points in measured order: each event with the first of <paramref name="points"/> measured after it
    /// on its chamber (<paramref name="key"/> gives the number the answer uses for a point: seq or position).
    /// </summary>
    public static List<MaintenanceMarker> Markers<T>(IEnumerable<MaintenanceEvent> events, IReadOnlyList<T> points,
        Func<T, long> measuredAtMs, Func<T, string, bool> onChamber, Func<T, int, long> key)
    {
        var markers = new List<MaintenanceMarker>();
        foreach (var e in events)
        {
            long? first = null;
            for (var i = 0; i < points.Count; i++)
            {
                if (measuredAtMs(points[i]) > e.OccurredAtMs && onChamber(points[i], e.Chamber))
                {
                    first = key(points[i], i);
                    break;
                }
            }

            markers.Add(Marker(e, first));
        }

        return markers;
    }

    /// <summary>
    /// Markers for the points of a stored series (in measured order), whose sites name an etch and a liner chamber: the
    /// events of the series' chamber (or of every chamber its points name) from the last one before the first point up
    /// to <paramref name="to"/>, each with the position of the first point after it on its chamber. One query.
    /// </summary>
    public static async Task<List<MaintenanceMarker>> ForSeriesAsync<T>(FinWatchDbContext db, string? chamber, DateTimeOffset? to, IReadOnlyList<T> points,
        Func<T, DateTime> measuredAt, Func<T, string?> etchChamber, Func<T, string?> linerChamber, CancellationToken cancellationToken)
    {
        if (points.Count == 0)
        {
            return [];
        }

        List<string> chambers = chamber is not null ? [chamber]
            : [.. points.SelectMany(p => new[] { etchChamber(p), linerChamber(p) }).OfType<string>().Distinct(StringComparer.Ordinal)];
        long AtMs(T p) => new DateTimeOffset(measuredAt(p), TimeSpan.Zero).ToUnixTimeMilliseconds();
        var events = await AroundAsync(db, chambers, AtMs(points[0]), to?.ToUnixTimeMilliseconds() ?? long.MaxValue, cancellationToken);
        return Markers(events, points, AtMs, (p, c) => etchChamber(p) == c || linerChamber(p) == c, (_, i) => i);
    }

    /// <summary>
    /// The chart's last maintenance of its chamber (the context's, or else the chamber of its latest point) and what
    /// followed, up to the latest point; null when the chart has no chamber yet or the chamber has no recorded
    /// maintenance. Three queries: the event, the points after it, the points before it.
    /// </summary>
    public static async Task<MaintenanceSince?> SinceAsync(FinWatchDbContext db, ChartContext context, string? latestPointChamber, string unit,
        CancellationToken cancellationToken)
    {
        var chamber = context.Chamber ?? latestPointChamber;
        if (chamber is null)
        {
            return null;
        }

        var last = await db.MaintenanceEvents.AsNoTracking().Where(e => e.Chamber == chamber)
            .OrderByDescending(e => e.OccurredAtMs).ThenByDescending(e => e.Id).FirstOrDefaultAsync(cancellationToken);
        if (last is null)
        {
            return null;
        }

        // A chart of every chamber compares the points of this chamber only.
        var points = db.ChartPoints.AsNoTracking().Where(p => p.ContextId == context.Id && (context.Chamber != null || p.Chamber == chamber));
        var after = await points.Where(p => p.MeasuredAtMs > last.OccurredAtMs).OrderBy(p => p.Seq)
            .Select(p => new { p.Seq, p.LotId, p.MeasuredAtMs, p.Value }).ToListAsync(cancellationToken);
        var before = await points.Where(p => p.MeasuredAtMs <= last.OccurredAtMs).OrderByDescending(p => p.Seq).Take(Window)
            .Select(p => p.Value).ToListAsync(cancellationToken);
        before.Reverse();
        double? hours = after.Count == 0 ? null : (after.Max(p => p.MeasuredAtMs) - last.OccurredAtMs) / 3_600_000.0;
        var marker = Marker(last, after.Count == 0 ? null : after[0].Seq);
        var suggestion = Suggest(marker, [.. before], [.. after.Take(Window).Select(p => p.Value)], unit);
        if (suggestion.SuggestNewBaseline)
        {
            // Once limits computed from points after the maintenance are approved, the suggestion has been followed.
            var rebased = await db.LimitVersions.AsNoTracking()
                .Where(l => l.ContextId == context.Id && l.Status == "approved" && l.FromMs > last.OccurredAtMs)
                .OrderByDescending(l => l.Version).Select(l => (int?)l.Version).FirstOrDefaultAsync(cancellationToken);
            if (rebased is { } version)
            {
                suggestion = suggestion with
                {
                    SuggestNewBaseline = false,
                    Message = suggestion.Message.Replace(ConsiderNewLimits, string.Create(CultureInfo.InvariantCulture,
                        $" New limits (v{version}) computed from the points after it are approved."), StringComparison.Ordinal),
                };
            }
        }

        return new MaintenanceSince(chamber, marker, after.Select(p => p.LotId).Distinct(StringComparer.Ordinal).Count(), after.Count, hours, suggestion);
    }

    /// <summary>
    /// The last maintenance of <paramref name="chamber"/> at or before the last of <paramref name="lotTimesMs"/> (the
    /// lots of a forecast, in measured order), with the lots measured after it and the hours from it to the last lot;
    /// null without a chamber, lots or a recorded maintenance. One query.
    /// </summary>
    public static async Task<ForecastMaintenance?> BeforeLastLotAsync(FinWatchDbContext db, string? chamber, IReadOnlyList<long> lotTimesMs,
        CancellationToken cancellationToken)
    {
        if (chamber is null || lotTimesMs.Count == 0)
        {
            return null;
        }

        var lastLot = lotTimesMs.Max();
        var e = await db.MaintenanceEvents.AsNoTracking().Where(m => m.Chamber == chamber && m.OccurredAtMs <= lastLot)
            .OrderByDescending(m => m.OccurredAtMs).ThenByDescending(m => m.Id).FirstOrDefaultAsync(cancellationToken);
        if (e is null)
        {
            return null;
        }

        var lots = lotTimesMs.Count(t => t > e.OccurredAtMs);
        var hours = (lastLot - e.OccurredAtMs) / 3_600_000.0;
        var marker = Marker(e, null);
        var message = string.Create(CultureInfo.InvariantCulture,
            $"The last maintenance of {chamber} ({Words(marker.Kind)}, {marker.At:yyyy-MM-dd HH:mm} UTC) was {lots} lot{(lots == 1 ? "" : "s")} and {hours:0.#} h before the last lot.");
        return new ForecastMaintenance(chamber, marker, lots, hours, message);
    }

    private const string ConsiderNewLimits = " Consider computing new limits from the points after it.";

    /// <summary>
    /// Welch's t-test of the points after a maintenance against those before it (docs/statistics.md §4.5): a new
    /// baseline is suggested when both sides have at least <see cref="MinimumEachSide"/> points and p &lt; <see cref="Alpha"/>.
    /// </summary>
    public static BaselineSuggestion Suggest(MaintenanceMarker at, double[] before, double[] after, string unit)
    {
        var what = $"the {Words(at.Kind)} of {at.Chamber}";
        if (before.Length < MinimumEachSide || after.Length < MinimumEachSide)
        {
            return new(false, $"Not compared yet: {before.Length} points before and {after.Length} after {what}; {MinimumEachSide} are needed on each side.",
                Window, before.Length, after.Length, Mean(before), Mean(after), null, unit, null, null, null, Alpha);
        }

        var r = WelchTest.Compare(before, after);
        double? p = double.IsNaN(r.PValue) ? null : r.PValue;
        var suggest = p < Alpha;
        var moved = $"mean {Format(r.FirstMean, unit)} in the {r.FirstCount} points before {what}, {Format(r.SecondMean, unit)} in the {r.SecondCount} after (Welch's t-test, {Probability(p)})";
        var message = suggest
            ? $"The mean moved at the maintenance: {moved}.{ConsiderNewLimits}"
            : $"No shift at the maintenance: {moved}; no new baseline is suggested.";
        return new(suggest, message, Window, r.FirstCount, r.SecondCount, r.FirstMean, r.SecondMean, r.Difference, unit,
            Finite(r.T), Finite(r.DegreesOfFreedom), p, Alpha);
    }

    /// <summary>The kind in the fab's words ("wet clean").</summary>
    public static string Words(string kind) => kind.Replace('_', ' ');

    // As the pages write numbers: more decimals for small magnitudes.
    private static string Format(double value, string unit) =>
        (value.ToString(Math.Abs(value) >= 100 ? "0.0" : Math.Abs(value) >= 10 ? "0.00" : "0.000", CultureInfo.InvariantCulture) + " " + unit).TrimEnd();

    private static string Probability(double? p) => p switch
    {
        null => "p not defined: neither side varies",
        < 0.0001 => "p < 0.0001",
        _ => string.Create(CultureInfo.InvariantCulture, $"p = {p:0.####}"),
    };

    private static double? Mean(double[] values) => values.Length == 0 ? null : values.Average();

    private static double? Finite(double value) => double.IsFinite(value) ? value : null;
}
