using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Audit;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Products;

/// <summary>
/// A product's site plans: per step, the sites the metrology measures (id, x and y in mm) in their order. The data-entry
/// page fills its grid from them; engineers change them.
/// </summary>
public static class SitePlanEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/products/{code}/site-plans").WithTags("Products").ValidateRequests();
        group.MapGet("/", ListAsync).RequireAuthorization(Permissions.Floor).WithSummary("A product's site plans, one per step");
        group.MapPut("/", ReplaceAsync).RequireAuthorization(Permissions.Engineer)
            .WithSummary("Replace a product's site plan at one step (an empty site list removes it)");
    }

    private static async Task<Results<Ok<SitePlansResponse>, ProblemHttpResult>> ListAsync(
        string code, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var product = await db.Products.AsNoTracking().SingleOrDefaultAsync(p => p.Code == code, cancellationToken);
        if (product is null)
        {
            return ProductsEndpoints.NotFound(code);
        }

        var sites = await db.SitePlanSites.AsNoTracking().Where(s => s.ProductId == product.Id).ToListAsync(cancellationToken);
        var plans = sites.GroupBy(s => s.Step).OrderBy(g => g.Key, StringComparer.Ordinal).Select(g => Describe(code, g.Key, g)).ToList();
        return TypedResults.Ok(new SitePlansResponse(code, plans));
    }

    private static async Task<Results<Ok<SitePlanResponse>, ProblemHttpResult>> ReplaceAsync(
        string code, SitePlanRequest request, FinWatchDbContext db, TimeProvider clock, HttpContext http, CancellationToken cancellationToken)
    {
        var product = await db.Products.SingleOrDefaultAsync(p => p.Code == code, cancellationToken);
        if (product is null)
        {
            return ProductsEndpoints.NotFound(code);
        }

        var after = await StageAsync(db, product, request.Step!, request.Sites!.Select(s => s!).ToList(), http.User.Who(), clock, cancellationToken);
        await db.SaveChangesAsync(cancellationToken);
        return TypedResults.Ok(after);
    }

    /// <summary>
    /// Stages the replacement of a product's plan at a step and its audit entry (the caller saves both in one
    /// SaveChanges). The sites are valid (<see cref="SitePlanRequest.Validate"/>).
    /// </summary>
    internal static async Task<SitePlanResponse> StageAsync(FinWatchDbContext db, Product product, string step,
        IReadOnlyList<SitePlanSiteDto> sites, string by, TimeProvider clock, CancellationToken cancellationToken)
    {
        var old = await db.SitePlanSites.Where(s => s.ProductId == product.Id && s.Step == step).ToListAsync(cancellationToken);
        var before = old.Count == 0 ? null : Describe(product.Code, step, old);
        db.SitePlanSites.RemoveRange(old);
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        // Adding 0.0 stores a typed −0 as 0, so a plan reads back as the rows write their positions.
        var rows = sites.Select((s, i) => new SitePlanSite
        {
            ProductId = product.Id, Step = step, Position = i + 1, SiteId = s.SiteId!, SiteXMm = s.SiteXMm!.Value + 0.0, SiteYMm = s.SiteYMm!.Value + 0.0,
            UpdatedAtMs = now, UpdatedBy = by,
        }).ToList();
        db.SitePlanSites.AddRange(rows);
        var after = Describe(product.Code, step, rows);
        var action = before is null ? "created" : rows.Count == 0 ? "removed" : "changed";
        AuditLog.Add(db, by, "site-plan", $"{product.Code} {step}", action, before, rows.Count == 0 ? null : after, clock);
        return after;
    }

    private static SitePlanResponse Describe(string code, string step, IEnumerable<SitePlanSite> sites)
    {
        var ordered = sites.OrderBy(s => s.Position).ToList();
        var last = ordered.MaxBy(s => s.UpdatedAtMs);
        return new SitePlanResponse(code, step, [.. ordered.Select(s => new SitePlanSiteDto(s.SiteId, s.SiteXMm, s.SiteYMm))],
            last is null ? null : Time.FromMs(last.UpdatedAtMs), last?.UpdatedBy);
    }
}
