using System.Runtime.InteropServices;
using FinWatch.Data;
using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Infrastructure;
using FinWatch.Statistics;
using Microsoft.AspNetCore.Http.HttpResults;

namespace FinWatch.Server.Features.Series;

/// <summary>One point of a series: a site value, or a wafer mean with its site count and standard deviation.</summary>
public sealed record SeriesPoint(
    DateTime MeasuredAt, string LotId, int WaferSlot, string? SiteId, string? EtchChamber, string? LinerChamber,
    double Value, int N, double? Sd);

/// <summary>A stored series with the maintenance events its points follow (<c>first_point</c> is a position in <c>points</c>).</summary>
public sealed record SeriesResponse(
    string Product, string Step, string Parameter, string Unit, string Level, string? Chamber,
    int Count, bool Truncated, IReadOnlyList<SeriesPoint> Points, IReadOnlyList<MaintenanceMarker> Maintenance);

public static class SeriesEndpoints
{
    public const int DefaultLimit = 20_000, MaxLimit = 200_000;

    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/api/series", GetAsync).WithTags("Series")
            .WithSummary("One parameter of one product and step in time order: site values (level=site) or wafer means (level=wafer)");
    }

    private static async Task<Results<Ok<SeriesResponse>, ValidationProblem>> GetAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber,
        DateTimeOffset? from, DateTimeOffset? to, string? level, int? limit, CancellationToken cancellationToken)
    {
        var (query, errors) = await SeriesQuery.ResolveAsync(db, product, step, parameter, chamber, from, to, cancellationToken);
        var (lvl, max) = SeriesQuery.CheckLevelAndLimit(level, limit, DefaultLimit, MaxLimit, errors);

        if (query is null || errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var rows = query.Rows(db);
        var (points, truncated) = lvl == "site"
            ? await SitesAsync(rows, max, cancellationToken)
            : await WaferMeansAsync(rows, max, cancellationToken);
        var maintenance = await ChamberMaintenance.ForSeriesAsync(db, chamber, to, points, p => p.MeasuredAt, p => p.EtchChamber, p => p.LinerChamber, cancellationToken);
        return TypedResults.Ok(new SeriesResponse(query.Product, query.Step, query.Parameter.Name, query.Parameter.Unit, lvl, chamber, points.Count, truncated, points,
            maintenance));
    }

    private static async Task<(List<SeriesPoint>, bool)> SitesAsync(IAsyncEnumerable<SeriesRow> rows, int max, CancellationToken cancellationToken)
    {
        var points = new List<SeriesPoint>();
        await foreach (var r in rows.WithCancellation(cancellationToken))
        {
            if (points.Count == max)
            {
                return (points, true);
            }

            points.Add(new SeriesPoint(Time.FromMs(r.At), r.Lot, r.Slot, r.Site, r.EtchChamber, r.LinerChamber, r.Value, 1, null));
        }

        return (points, false);
    }

    private static async Task<(List<SeriesPoint>, bool)> WaferMeansAsync(IAsyncEnumerable<SeriesRow> rows, int max, CancellationToken cancellationToken)
    {
        var (wafers, truncated) = await WaferGroup.CollectAsync(rows, max, cancellationToken);
        var points = wafers.Select(w =>
        {
            var m = new RunningMoments();
            m.AddRange(CollectionsMarshal.AsSpan(w.Values));
            return new SeriesPoint(Time.FromMs(w.First.At), w.First.Lot, w.First.Slot, null, w.First.EtchChamber, w.First.LinerChamber,
                m.Mean, (int)m.Count, m.Count > 1 ? m.SampleStandardDeviation : null);
        }).ToList();
        return (points, truncated);
    }
}
