using FinWatch.Data;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Measurements;

/// <summary>A tool and the chambers of it seen in stored rows.</summary>
public sealed record KnownTool(string Tool, IReadOnlyList<string> Chambers);

/// <summary>
/// Steps, tools, chambers and metrology tools seen in stored rows (of one product and step when asked), for the
/// data-entry page's lists; a new value can still be typed deliberately.
/// </summary>
public sealed record KnownValuesResponse(
    string? Product, string? Step, IReadOnlyList<string> Steps, IReadOnlyList<KnownTool> EtchTools, IReadOnlyList<KnownTool> LinerTools,
    IReadOnlyList<string> MetrologyTools);

/// <summary>One numeric column's plausibility range (low &lt; value, or low ≤ value when low_inclusive; value ≤ high).</summary>
public sealed record ValueRangeResponse(string Field, double Low, double High, bool LowInclusive, string Unit);

/// <summary>The checks ingest applies to every row, for a page that checks before sending (the server checks again).</summary>
public sealed record IngestRangesResponse(
    IReadOnlyList<ValueRangeResponse> Values, double WaferRadiusMm, int MaxWaferSlot, int MaxTextLength, int FutureToleranceMinutes);

/// <summary>Optional filters: the product code and the step.</summary>
public sealed record KnownValuesQuery([FromQuery(Name = "product")] string? Product, [FromQuery(Name = "step")] string? Step) : IValidatedRequest
{
    public void Validate(ValidationErrors errors)
    {
        if (Step is { Length: 0 })
        {
            errors["step"] = "give a step or leave the parameter out";
        }
    }
}

public static class EntryAidEndpoints
{
    /// <summary>Tools and chambers count as known when a row measured in this window names them (retired ones drop out).</summary>
    public static readonly TimeSpan KnownWindow = TimeSpan.FromDays(90);

    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/measurements").WithTags("Measurements").ValidateRequests();
        group.MapGet("/known-values", KnownValuesAsync).RequireAuthorization(Permissions.Read)
            .WithSummary("Steps, tools with their chambers and metrology tools seen in rows of the last 90 days (of a product and step when given)");
        group.MapGet("/ranges", Ranges).RequireAuthorization(Permissions.Read)
            .WithSummary("The plausibility ranges and limits ingest checks every row against");
    }

    private static async Task<Results<Ok<KnownValuesResponse>, ValidationProblem>> KnownValuesAsync(
        [AsParameters] KnownValuesQuery query, FinWatchDbContext db, TimeProvider clock, CancellationToken cancellationToken)
    {
        int? productId = null;
        if (query.Product is { } code)
        {
            productId = await db.Products.Where(p => p.Code == code).Select(p => (int?)p.Id).SingleOrDefaultAsync(cancellationToken);
            if (productId is null)
            {
                return Problems.Invalid("product", Problems.NotAProduct(code));
            }
        }

        var steps = await db.LotSteps.Where(l => productId == null || l.ProductId == productId).Select(l => l.Step)
            .Union(db.SitePlanSites.Where(s => productId == null || s.ProductId == productId).Select(s => s.Step))
            .ToListAsync(cancellationToken);
        var since = clock.GetUtcNow().Add(-KnownWindow).ToUnixTimeMilliseconds();
        var rows = db.Measurements.Where(m => (productId == null || m.ProductId == productId) && (query.Step == null || m.Step == query.Step)
            && m.MeasuredAtMs >= since);
        var etch = await rows.Where(m => m.EtchTool != null).Select(m => new { Tool = m.EtchTool!, Chamber = m.EtchChamber }).Distinct().ToListAsync(cancellationToken);
        var liner = await rows.Where(m => m.LinerTool != null).Select(m => new { Tool = m.LinerTool!, Chamber = m.LinerChamber }).Distinct().ToListAsync(cancellationToken);
        var metrology = await rows.Where(m => m.MetrologyTool != null).Select(m => m.MetrologyTool!).Distinct().ToListAsync(cancellationToken);

        static List<KnownTool> Tools(IEnumerable<(string Tool, string? Chamber)> pairs) =>
        [
            .. pairs.GroupBy(p => p.Tool, StringComparer.Ordinal).OrderBy(g => g.Key, StringComparer.Ordinal)
                .Select(g => new KnownTool(g.Key, [.. g.Select(p => p.Chamber).OfType<string>().Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal)])),
        ];

        return TypedResults.Ok(new KnownValuesResponse(query.Product, query.Step,
            [.. steps.Distinct(StringComparer.Ordinal).Order(StringComparer.Ordinal)],
            Tools(etch.Select(e => (e.Tool, e.Chamber))), Tools(liner.Select(e => (e.Tool, e.Chamber))),
            [.. metrology.Order(StringComparer.Ordinal)]));
    }

    private static Ok<IngestRangesResponse> Ranges(IOptions<IngestOptions> options) => TypedResults.Ok(new IngestRangesResponse(
        [.. RowValidator.Ranges.Select(r => new ValueRangeResponse(IngestColumns.NameOf(r.Column), r.Low, r.High, r.LowInclusive, r.Unit))],
        RowValidator.WaferRadiusMm, RowValidator.MaxSlot, RowValidator.MaxTextLength, options.Value.FutureToleranceMinutes));
}
