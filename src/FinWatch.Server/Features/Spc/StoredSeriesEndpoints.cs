using FinWatch.Server.Features.Access;
using FinWatch.Data;
using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Features.Series;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Spc;

/// <summary>What a chart point of a stored series stands for.</summary>
public sealed record StoredPoint(
    DateTime MeasuredAt,
    string LotId,
    int WaferSlot,
    string? SiteId,
    string? EtchChamber,
    string? LinerChamber,
    int N);

public sealed record StoredContext(
    string Product,
    string Step,
    string Parameter,
    string Unit,
    string? Chamber,
    string Level,
    bool Truncated);

/// <summary>
/// The analysis of a stored series: its context, what each position is, the analysis in the contract's shape, and the
/// maintenance events its points follow (<c>first_point</c> is a position in <c>points</c>).
/// </summary>
public sealed record StoredAnalysisResponse(
    StoredContext Context,
    IReadOnlyList<StoredPoint> Points,
    AnalysisResponse Analysis,
    IReadOnlyList<MaintenanceMarker> Maintenance);

/// <summary>
/// GET /api/series/chart and /api/series/capability: the same engine and response shapes as POST /api/spc/analyses, on
/// stored data. I-MR charts site values (level=site) or wafer means (level=wafer); Xbar-R and Xbar-S take the sites of
/// each wafer as a subgroup. Capability uses the product's specification limits unless lsl/usl are given.
/// </summary>
public static class StoredSeriesEndpoints
{
    public const int MaxPoints = 50_000;

    /// <summary>The query parameter that sets each field of the analysis request.</summary>
    private static readonly Dictionary<string, string> QueryNames = new(StringComparer.Ordinal)
    {
        ["limits.count"] = "baseline_count",
        ["ewma.lambda"] = "ewma_lambda",
        ["ewma.l"] = "ewma_l",
        ["cusum.k"] = "cusum_k",
        ["cusum.h"] = "cusum_h",
        ["capability.lsl"] = "lsl",
        ["capability.usl"] = "usl",
        ["capability.target"] = "target",
        ["capability.confidence"] = "confidence",
        ["percentile_capability.lsl"] = "lsl",
        ["percentile_capability.usl"] = "usl",
        ["capability"] = "lsl",
        ["percentile_capability"] = "lsl",
    };

    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/series").WithTags("Series");
        group.MapGet("/chart", ChartAsync).WithSummary("Control chart, run rules, EWMA and CUSUM of a stored series");
        group.MapGet("/capability", CapabilityAsync).RequireAuthorization(Permissions.Floor).WithSummary("Capability, normality and percentile capability of a stored series");
    }

    private static Task<Results<Ok<StoredAnalysisResponse>, ValidationProblem>> ChartAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber, DateTimeOffset? from, DateTimeOffset? to,
        string? level, string? chart, string? constants, string? rules, [FromQuery(Name = "baseline_count")] int? baselineCount,
        [FromQuery(Name = "sigma_multiplier")] double? sigmaMultiplier, [FromQuery(Name = "ewma_lambda")] double? ewmaLambda,
        [FromQuery(Name = "ewma_l")] double? ewmaL, [FromQuery(Name = "cusum_k")] double? cusumK, [FromQuery(Name = "cusum_h")] double? cusumH,
        int? limit, CancellationToken cancellationToken)
    {
        var request = new AnalysisRequest
        {
            Chart = chart,
            Constants = constants,
            Limits = baselineCount is { } k ? new LimitsRequest { Source = "baseline", Count = k } : null,
            SigmaMultiplier = sigmaMultiplier,
            Rules = rules?.Split(',', StringSplitOptions.RemoveEmptyEntries | StringSplitOptions.TrimEntries),
            Ewma = ewmaLambda is not null || ewmaL is not null ? new EwmaRequest { Lambda = ewmaLambda, L = ewmaL } : null,
            Cusum = cusumK is not null || cusumH is not null ? new CusumRequest { K = cusumK, H = cusumH } : null,
        };
        return AnalyseAsync(db, product, step, parameter, chamber, from, to, level, request, limit, useSpecs: false, cancellationToken);
    }

    private static Task<Results<Ok<StoredAnalysisResponse>, ValidationProblem>> CapabilityAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber, DateTimeOffset? from, DateTimeOffset? to,
        string? level, string? chart, double? lsl, double? usl, double? target, double? confidence, int? limit, CancellationToken cancellationToken)
    {
        var request = new AnalysisRequest
        {
            Chart = chart,
            Capability = new CapabilityRequest { Lsl = lsl, Usl = usl, Target = target, Confidence = confidence },
            PercentileCapability = new PercentileCapabilityRequest { Lsl = lsl, Usl = usl, Distribution = "lognormal" },
            Normality = true,
        };
        return AnalyseAsync(db, product, step, parameter, chamber, from, to, level, request, limit, useSpecs: lsl is null && usl is null, cancellationToken);
    }

    private static async Task<Results<Ok<StoredAnalysisResponse>, ValidationProblem>> AnalyseAsync(
        FinWatchDbContext db, string? product, string? step, string? parameter, string? chamber, DateTimeOffset? from, DateTimeOffset? to,
        string? level, AnalysisRequest request, int? limit, bool useSpecs, CancellationToken cancellationToken)
    {
        var (query, errors) = await SeriesQuery.ResolveAsync(db, product, step, parameter, chamber, from, to, cancellationToken);
        var (lvl, max) = SeriesQuery.CheckLevelAndLimit(level, limit, MaxPoints, MaxPoints, errors);

        if (query is null || errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var subgrouped = request.Chart is "Xbar-R" or "Xbar-S";
        var points = new List<StoredPoint>();
        bool truncated;
        if (subgrouped || lvl == "wafer")
        {
            var (wafers, cut) = await WaferGroup.CollectAsync(query.Rows(db), max, cancellationToken);
            truncated = cut;
            points.AddRange(wafers.Select(w => new StoredPoint(Time.FromMs(w.First.At), w.First.Lot, w.First.Slot, null,
                w.First.EtchChamber, w.First.LinerChamber, w.Values.Count)));
            request = subgrouped
                ? request with { Subgroups = wafers.Select(w => w.Values.Select(v => (double?)v).ToArray()).ToArray() }
                : request with { Values = wafers.Select(w => (double?)w.Values.Average()).ToArray() };
        }
        else
        {
            var values = new List<double?>();
            truncated = false;
            await foreach (var r in query.Rows(db).WithCancellation(cancellationToken))
            {
                if (values.Count == max)
                {
                    truncated = true;
                    break;
                }

                values.Add(r.Value);
                points.Add(new StoredPoint(Time.FromMs(r.At), r.Lot, r.Slot, r.Site, r.EtchChamber, r.LinerChamber, 1));
            }

            request = request with { Values = [.. values] };
        }

        if (useSpecs && request.Capability is not null)
        {
            var spec = await db.SpecLimits.AsNoTracking()
                .SingleOrDefaultAsync(s => s.ProductId == query.ProductId && s.Parameter == query.Parameter.Name, cancellationToken);
            request = request with
            {
                Capability = request.Capability with { Lsl = spec?.Lower, Usl = spec?.Upper, Target = spec?.Target },
                PercentileCapability = request.PercentileCapability! with { Lsl = spec?.Lower, Usl = spec?.Upper },
            };
        }

        var problems = new ValidationErrors();
        AnalysisRules.Check(request, problems);
        if (problems.Count > 0)
        {
            // The analysis names its fields as in the body of POST /api/spc/analyses; here they are query parameters.
            return Problems.Invalid(problems.Renamed(QueryNames));
        }

        var context = new StoredContext(query.Product, query.Step, query.Parameter.Name, query.Parameter.Unit, chamber, subgrouped ? "wafer" : lvl, truncated);
        var maintenance = await ChamberMaintenance.ForSeriesAsync(db, chamber, to, points, p => p.MeasuredAt, p => p.EtchChamber, p => p.LinerChamber, cancellationToken);
        return TypedResults.Ok(new StoredAnalysisResponse(context, points, RunAnalysis.Run(request), maintenance));
    }
}
