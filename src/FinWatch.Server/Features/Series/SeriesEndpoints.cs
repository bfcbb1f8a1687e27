using FinWatch.Data;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;
using FinWatch.Statistics;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Series;

/// <summary>One point of a series: a site value, or a wafer mean with its site count and standard deviation.</summary>
public sealed record SeriesPoint(
    DateTime MeasuredAt, string LotId, int WaferSlot, string? SiteId, string? EtchChamber, string? LinerChamber,
    double Value, int N, double? Sd);

public sealed record SeriesResponse(
    string Product, string Step, string Parameter, string Unit, string Level, string? Chamber,
    int Count, bool Truncated, IReadOnlyList<SeriesPoint> Points);

public static class SeriesEndpoints
{
    public const int DefaultLimit = 20_000, MaxLimit = 200_000;

    public static IEndpointRouteBuilder MapSeries(this IEndpointRouteBuilder app)
    {
        app.MapGet("/api/series", GetAsync).WithTags("Series")
            .WithSummary("One parameter of one product and step in time order: site values (level=site) or wafer means (level=wafer)");
        return app;
    }

    private static async Task<Results<Ok<SeriesResponse>, ValidationProblem>> GetAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber,
        DateTimeOffset? from, DateTimeOffset? to, string? level, int? limit, CancellationToken cancellationToken)
    {
        var errors = new Dictionary<string, string[]>();
        if (string.IsNullOrEmpty(product))
        {
            errors["product"] = ["a product code is required"];
        }

        if (string.IsNullOrEmpty(step))
        {
            errors["step"] = ["a process step is required"];
        }

        FinParameter? p = null;
        if (parameter is null || !FinParameters.TryGet(parameter, out p))
        {
            errors["parameter"] = [$"'{parameter}' is not a parameter; expected one of {FinParameters.NameList}"];
        }

        var lvl = level ?? "site";
        if (lvl is not ("site" or "wafer"))
        {
            errors["level"] = ["level is 'site' or 'wafer'"];
        }

        var max = limit ?? DefaultLimit;
        if (max is < 1 or > MaxLimit)
        {
            errors["limit"] = [$"limit is 1 to {MaxLimit}"];
        }

        var productId = errors.Count == 0
            ? await db.Products.Where(x => x.Code == product).Select(x => (int?)x.Id).SingleOrDefaultAsync(cancellationToken)
            : null;
        if (errors.Count == 0 && productId is null)
        {
            errors["product"] = [$"unknown product '{product}'"];
        }

        if (errors.Count > 0)
        {
            return TypedResults.ValidationProblem(errors);
        }

        var q = db.Measurements.AsNoTracking().Where(m => m.ProductId == productId && m.Step == step);
        if (chamber is not null)
        {
            q = q.Where(m => m.EtchChamber == chamber || m.LinerChamber == chamber);
        }

        if (from is { } f)
        {
            var ms = Time.ToMs(f);
            q = q.Where(m => m.MeasuredAtMs >= ms);
        }

        if (to is { } t)
        {
            var ms = Time.ToMs(t);
            q = q.Where(m => m.MeasuredAtMs <= ms);
        }

        var column = p!.Property;
        var rows = q.Where(m => EF.Property<double?>(m, column) != null)
            .OrderBy(m => m.MeasuredAtMs).ThenBy(m => m.LotId).ThenBy(m => m.WaferSlot).ThenBy(m => m.SiteId)
            .Select(m => new Row(m.MeasuredAtMs, m.LotId, m.WaferSlot, m.SiteId, m.EtchChamber, m.LinerChamber, EF.Property<double?>(m, column)!.Value))
            .AsAsyncEnumerable();
        var (points, truncated) = lvl == "site"
            ? await SitesAsync(rows, max, cancellationToken)
            : await WaferMeansAsync(rows, max, cancellationToken);
        return TypedResults.Ok(new SeriesResponse(product!, step!, p.Name, p.Unit, lvl, chamber, points.Count, truncated, points));
    }

    private static async Task<(List<SeriesPoint>, bool)> SitesAsync(IAsyncEnumerable<Row> rows, int max, CancellationToken cancellationToken)
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

    // A wafer's point sits at the time of its first site; sd is the sample standard deviation of its sites.
    // Rows come in time order, and a wafer's sites are measured together, so a wafer is complete once a later one starts
    // except for interleaved wafers, which the dictionary keeps apart.
    private static async Task<(List<SeriesPoint>, bool)> WaferMeansAsync(IAsyncEnumerable<Row> rows, int max, CancellationToken cancellationToken)
    {
        var wafers = new Dictionary<(string, int), int>();
        var firsts = new List<Row>();
        var moments = new List<RunningMoments>();
        var truncated = false;
        await foreach (var r in rows.WithCancellation(cancellationToken))
        {
            if (!wafers.TryGetValue((r.Lot, r.Slot), out var i))
            {
                if (firsts.Count == max)
                {
                    truncated = true;
                    break;
                }

                i = firsts.Count;
                wafers[(r.Lot, r.Slot)] = i;
                firsts.Add(r);
                moments.Add(default);
            }

            var m = moments[i];
            m.Add(r.Value);
            moments[i] = m;
        }

        var points = firsts.Select((first, i) => new SeriesPoint(
            Time.FromMs(first.At), first.Lot, first.Slot, null, first.EtchChamber, first.LinerChamber,
            moments[i].Mean, (int)moments[i].Count, moments[i].Count > 1 ? moments[i].SampleStandardDeviation : null)).ToList();
        return (points, truncated);
    }

    private sealed record Row(long At, string Lot, int Slot, string Site, string? EtchChamber, string? LinerChamber, double Value);
}
