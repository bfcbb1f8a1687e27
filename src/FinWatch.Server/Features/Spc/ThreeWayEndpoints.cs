using FinWatch.Server.Infrastructure;
using FinWatch.Data;
using FinWatch.Server.Features.Series;
using FinWatch.Statistics.Constants;
using FinWatch.Statistics.Shewhart;
using Microsoft.AspNetCore.Http.HttpResults;

namespace FinWatch.Server.Features.Spc;

/// <summary>The three-way chart of a stored series: lot means, wafer-to-wafer within lots, site-to-site within wafers.</summary>
public sealed record ThreeWayResponse(
    StoredContext Context,
    IReadOnlyList<string> Lots,
    ChartResponse BetweenLots,
    ChartLineResponse WithinLot,
    int[] WithinLotBeyondLimits,
    ChartLineResponse WithinWafer,
    int[] WithinWaferBeyondLimits,
    int[] WaferLot,
    double? SigmaSite,
    double? SigmaWafer,
    double? SigmaLot);

public static class ThreeWayEndpoints
{
    public const int MaxLots = 5_000;

    public static void Map(IEndpointRouteBuilder app)
    {
        app.MapGet("/api/series/three-way", GetAsync).WithTags("Series")
            .WithSummary("Three-way chart: lot means (I-MR), wafer means within each lot and sites within each wafer (range charts)");
    }

    private static async Task<Results<Ok<ThreeWayResponse>, ValidationProblem>> GetAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber, DateTimeOffset? from, DateTimeOffset? to,
        string? constants, CancellationToken cancellationToken)
    {
        var (query, errors) = await SeriesQuery.ResolveAsync(db, product, step, parameter, chamber, from, to, cancellationToken);
        if (constants is not (null or "exact" or "table"))
        {
            errors["constants"] = "constants is 'exact' or 'table'";
        }

        if (query is null || errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var (wafers, _) = await WaferGroup.CollectAsync(query.Rows(db), MaxLots * 25, cancellationToken);
        var lotIds = new List<string>();
        var lots = new List<List<double[]>>();
        var byLot = new Dictionary<string, int>(StringComparer.Ordinal);
        foreach (var w in wafers)
        {
            if (!byLot.TryGetValue(w.First.Lot, out var i))
            {
                if (lots.Count == MaxLots)
                {
                    break;
                }

                i = lots.Count;
                byLot[w.First.Lot] = i;
                lotIds.Add(w.First.Lot);
                lots.Add([]);
            }

            // The charts' constants are defined for up to 25 values a subgroup: a wafer or lot beyond that is cut to 25.
            if (lots[i].Count < ControlChartConstants.MaxSubgroupSize)
            {
                lots[i].Add([.. w.Values.Take(ControlChartConstants.MaxSubgroupSize)]);
            }
        }

        var mode = constants == "table" ? ConstantsMode.Table : ConstantsMode.Exact;
        var chart = ThreeWayChart.Compute(lots.Select(l => (IReadOnlyList<double[]>)l).ToList(), useRange: true, mode);
        var context = new StoredContext(query.Product, query.Step, query.Parameter.Name, query.Parameter.Unit, chamber, "lot", lots.Count == MaxLots);
        return TypedResults.Ok(new ThreeWayResponse(context, lotIds,
            RunAnalysis.ToChart(chart.BetweenLots, "I-MR", mode, [], [.. chart.BetweenLots.Warnings]),
            RunAnalysis.ToSeries(chart.WithinLot), chart.WithinLot.BeyondLimits(),
            RunAnalysis.ToSeries(chart.WithinWafer), chart.WithinWafer.BeyondLimits(),
            chart.WaferLot, chart.SigmaSite, chart.SigmaWafer, chart.SigmaLot));
    }
}
