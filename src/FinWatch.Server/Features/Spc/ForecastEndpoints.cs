using FinWatch.Server.Infrastructure;
using FinWatch.Data;
using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Features.Series;
using FinWatch.Statistics.Forecast;
using FinWatch.Statistics.Shewhart;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Spc;

public sealed record ForecastResponse(
    DriftForecastStatus Status,
    string Message,
    int N,
    double? Slope,
    double? PValue,
    LimitKind? Limit,
    double? LimitValue,
    double? Estimate,
    double? Low,
    double? High,
    IReadOnlyList<string> Notes);

/// <summary>
/// The drift forecast of a stored series in lots and in hours, from the lot means of the last <c>window</c> lots; with a
/// chamber, next to the time since that chamber's last maintenance before the last lot (null without one).
/// </summary>
public sealed record DriftResponse(
    StoredContext Context,
    int Window,
    int Lots,
    double? Lcl,
    double? Ucl,
    double? Lsl,
    double? Usl,
    ForecastResponse InLots,
    ForecastResponse InHours,
    ForecastMaintenance? Maintenance);

public static class ForecastEndpoints
{
    public const int MaxWindow = 500;

    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/api/series/forecast", ForecastAsync).WithTags("Series")
            .WithSummary("Trend of the recent lot means and when it would cross a control or specification limit");
    }

    private static async Task<Results<Ok<DriftResponse>, ValidationProblem>> ForecastAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber, DateTimeOffset? from, DateTimeOffset? to,
        int? window, CancellationToken cancellationToken)
    {
        var (query, errors) = await SeriesQuery.ResolveAsync(db, product, step, parameter, chamber, from, to, cancellationToken);
        var w = window ?? 30;
        if (w is < 6 or > MaxWindow)
        {
            errors["window"] = $"window is 6 to {MaxWindow} lots";
        }

        if (query is null || errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        // Lot means in the order the lots were measured; control limits from the I-MR chart of all lot means in range.
        var lots = new List<(long At, double Sum, int N)>();
        var index = new Dictionary<string, int>(StringComparer.Ordinal);
        await foreach (var r in query.Rows(db).WithCancellation(cancellationToken))
        {
            if (!index.TryGetValue(r.Lot, out var i))
            {
                i = lots.Count;
                index[r.Lot] = i;
                lots.Add((r.At, 0, 0));
            }

            lots[i] = (lots[i].At, lots[i].Sum + r.Value, lots[i].N + 1);
        }

        var means = lots.Select(l => l.Sum / l.N).ToArray();
        var chart = ShewhartCharts.Individuals(means, LimitRequest.FromData);
        var spec = await db.SpecLimits.AsNoTracking()
            .SingleOrDefaultAsync(s => s.ProductId == query.ProductId && s.Parameter == query.Parameter.Name, cancellationToken);
        double? ucl = means.Length > 0 ? RunAnalysis.Nullable(chart.Primary.Upper[0]) : null;
        double? lcl = means.Length > 0 ? RunAnalysis.Nullable(chart.Primary.Lower[0]) : null;
        var limits = new DriftLimits(lcl, ucl, spec?.Lower, spec?.Upper);

        var start = Math.Max(0, means.Length - w);
        var recent = means[start..];
        var lotPositions = Enumerable.Range(start, recent.Length).Select(i => (double)i).ToArray();
        var t0 = lots.Count > 0 ? lots[0].At : 0;
        var hours = lots.Skip(start).Select(l => (l.At - t0) / 3_600_000.0).ToArray();
        var inLots = DriftForecast.Estimate(lotPositions, recent, limits, PositionUnit.LotIndex);
        var inHours = DriftForecast.Estimate(hours, recent, limits, PositionUnit.Hours);
        var context = new StoredContext(query.Product, query.Step, query.Parameter.Name, query.Parameter.Unit, chamber, "lot", false);
        var maintenance = await ChamberMaintenance.BeforeLastLotAsync(db, chamber, [.. lots.Select(l => l.At)], cancellationToken);
        return TypedResults.Ok(new DriftResponse(context, w, means.Length, lcl, ucl, spec?.Lower, spec?.Upper, Map(inLots), Map(inHours), maintenance));
    }

    private static ForecastResponse Map(DriftForecastResult r) => new(
        r.Status, r.Message, r.N, r.Slope, r.PValue, r.Limit, r.LimitValue,
        r.DistanceEstimate, r.DistanceLow, r.DistanceHigh, r.Notes);
}
