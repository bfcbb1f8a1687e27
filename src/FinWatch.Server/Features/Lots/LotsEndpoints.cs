using FinWatch.Data;
using FinWatch.Physics;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Lots;

public static class LotsEndpoints
{
    public const int MaxPageSize = 500;

    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/lots").WithTags("Lots");
        group.MapGet("/", ListAsync).WithSummary("Lots by step, newest first; filter by product, step, chamber and time range (UTC)");
        group.MapGet("/{lot}", GetAsync).WithSummary("One lot: its steps, wafers and sites with measured and derived values");
    }

    private static async Task<Results<Ok<LotPageResponse>, ValidationProblem>> ListAsync(
        FinWatchDbContext db, string? product, string? step, string? chamber, DateTimeOffset? from, DateTimeOffset? to,
        int? page, [FromQuery(Name = "page_size")] int? pageSize, CancellationToken cancellationToken)
    {
        var p = page ?? 1;
        var size = pageSize ?? 50;
        if (p < 1 || size < 1 || size > MaxPageSize || (from is { } f && to is { } t && f > t))
        {
            return Problems.Invalid("paging", $"page must be ≥ 1, page_size 1 to {MaxPageSize}, and from not after to");
        }

        var q = from l in db.LotSteps.AsNoTracking()
                join pr in db.Products on l.ProductId equals pr.Id
                select new { l, pr.Code };
        if (product is not null)
        {
            q = q.Where(x => x.Code == product);
        }

        if (step is not null)
        {
            q = q.Where(x => x.l.Step == step);
        }

        if (chamber is not null)
        {
            q = q.Where(x => db.LotChambers.Any(c => c.LotId == x.l.LotId && c.Step == x.l.Step && c.Chamber == chamber));
        }

        if (from is { } fromTime)
        {
            var ms = Time.ToMs(fromTime);
            q = q.Where(x => x.l.LastMeasuredAtMs >= ms);
        }

        if (to is { } toTime)
        {
            var ms = Time.ToMs(toTime);
            q = q.Where(x => x.l.FirstMeasuredAtMs <= ms);
        }

        var total = await q.CountAsync(cancellationToken);
        var rows = await q.OrderByDescending(x => x.l.LastMeasuredAtMs).ThenBy(x => x.l.LotId).ThenBy(x => x.l.Step)
            .Skip((p - 1) * size).Take(size).ToListAsync(cancellationToken);
        var lotIds = rows.Select(r => r.l.LotId).Distinct().ToList();
        var chambers = (await db.LotChambers.AsNoTracking().Where(c => lotIds.Contains(c.LotId)).ToListAsync(cancellationToken))
            .ToLookup(c => (c.LotId, c.Step), c => c.Chamber);
        var items = rows.Select(r => new LotSummaryResponse(
            r.l.LotId, r.l.Step, r.Code, Time.FromMs(r.l.FirstMeasuredAtMs), Time.FromMs(r.l.LastMeasuredAtMs),
            r.l.WaferCount, r.l.SiteCount, chambers[(r.l.LotId, r.l.Step)].Order(StringComparer.Ordinal).ToList())).ToList();
        return TypedResults.Ok(new LotPageResponse(p, size, total, items));
    }

    private static async Task<Results<Ok<LotResponse>, ProblemHttpResult>> GetAsync(
        string lot, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var rows = await db.Measurements.AsNoTracking().Where(m => m.LotId == lot)
            .OrderBy(m => m.Step).ThenBy(m => m.WaferSlot).ThenBy(m => m.MeasuredAtMs).ThenBy(m => m.SiteId)
            .ToListAsync(cancellationToken);
        if (rows.Count == 0)
        {
            return Problems.NotFound("No such lot.", $"No measurements are stored for lot '{lot}'.");
        }

        var productId = rows[0].ProductId;
        var code = await db.Products.Where(p => p.Id == productId).Select(p => p.Code).SingleAsync(cancellationToken);
        var steps = rows.GroupBy(m => m.Step).Select(s => new LotStepResponse(s.Key,
            s.GroupBy(m => m.WaferSlot).Select(w => new WaferResponse(w.Key, w.Select(m => new SiteResponse(
                m.SiteId, m.SiteXMm, m.SiteYMm, Time.FromMs(m.MeasuredAtMs),
                m.EtchTool, m.EtchChamber, m.LinerTool, m.LinerChamber, m.MetrologyTool, m.Operator,
                m.TopWidthNm, m.BottomWidthNm, m.FinHeightNm, m.CornerRadiusNm, m.LinerThicknessNm,
                m.TaperDeg, m.MidWidthNm, m.AreaNm2, m.GatedPerimeterNm, m.MaxCornerRadiusNm,
                FlagNames((GeometryFlags)m.Flags), m.BatchId, m.DeltaVtLinMv, m.DeltaVtSatMv)).ToList())).ToList())).ToList();
        return TypedResults.Ok(new LotResponse(lot, code, steps));
    }

    /// <summary>Consistency flags as words: "re_entrant_profile", "radius_exceeds_max".</summary>
    public static IReadOnlyList<string> FlagNames(GeometryFlags flags)
    {
        var names = new List<string>(2);
        if ((flags & GeometryFlags.ReEntrant) != 0)
        {
            names.Add("re_entrant_profile");
        }

        if ((flags & GeometryFlags.RadiusExceedsMax) != 0)
        {
            names.Add("radius_exceeds_max");
        }

        return names;
    }
}
