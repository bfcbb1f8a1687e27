using FinWatch.Data;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Reports;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Spc;

/// <summary>
/// The alarm budget (docs/statistics.md §4.5): per stored chart context, for a rule set being chosen, and for the floor.
/// Everyone signed in may read it.
/// </summary>
public static class RunLengthEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var contexts = app.MapGroup("/api/contexts").WithTags("SPC").ValidateRequests().RequireAuthorization(Permissions.Read);
        contexts.MapGet("/{code}/run-length", ContextAsync)
            .WithSummary("A chart's alarm budget: time between false alarms and time to catch a 1σ and a 2σ shift, at its recent point rate");
        contexts.MapPost("/run-length", TryAsync)
            .WithSummary("The alarm budget of a chart type and rule set not saved yet, at a context's point rate or a given one");
        app.MapGet("/api/run-length", FloorAsync).WithTags("SPC").RequireAuthorization(Permissions.Read)
            .WithSummary("Every chart's alarm budget and the floor's expected false alarms per day and per shift");
    }

    private static async Task<Results<Ok<RunLengthResponse>, ProblemHttpResult>> ContextAsync(
        string code, FinWatchDbContext db, TimeProvider clock, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return Problems.NotFound("Not found.", $"There is no chart context '{code}'.");
        }

        var rates = await AlarmBudget.RatesAsync(db, clock.GetUtcNow(), context.Id, cancellationToken);
        return TypedResults.Ok(AlarmBudget.ForContext(context, await MonitoringAsync(db, context.Id, cancellationToken), rates.GetValueOrDefault(context.Id)));
    }

    private static async Task<Results<Ok<RunLengthResponse>, ValidationProblem>> TryAsync(
        RunLengthRequest request, FinWatchDbContext db, TimeProvider clock, CancellationToken cancellationToken)
    {
        if (request.Context is not { } code)
        {
            return TypedResults.Ok(AlarmBudget.ForRequest(request, null, false, null));
        }

        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return Problems.Invalid("context", $"'{code}' is not a chart context");
        }

        var rates = await AlarmBudget.RatesAsync(db, clock.GetUtcNow(), context.Id, cancellationToken);
        return TypedResults.Ok(AlarmBudget.ForRequest(request, context, await MonitoringAsync(db, context.Id, cancellationToken), rates.GetValueOrDefault(context.Id)));
    }

    private static async Task<Ok<FloorRunLengthResponse>> FloorAsync(
        FinWatchDbContext db, TimeProvider clock, IOptions<ShiftOptions> shifts, CancellationToken cancellationToken)
    {
        var now = clock.GetUtcNow();
        var contexts = await db.ChartContexts.AsNoTracking().OrderBy(c => c.Code).ToListAsync(cancellationToken);
        var monitoring = (await db.LimitVersions.AsNoTracking().Where(l => l.Status == "approved").Select(l => l.ContextId).Distinct().ToListAsync(cancellationToken)).ToHashSet();
        var rates = await AlarmBudget.RatesAsync(db, now, null, cancellationToken);
        var charts = contexts.Select(c => AlarmBudget.ForContext(c, monitoring.Contains(c.Id), rates.GetValueOrDefault(c.Id))).ToList();
        return TypedResults.Ok(AlarmBudget.Floor(now, charts, shifts.Value.EffectivePattern));
    }

    private static Task<bool> MonitoringAsync(FinWatchDbContext db, int contextId, CancellationToken cancellationToken) =>
        db.LimitVersions.AsNoTracking().AnyAsync(l => l.ContextId == contextId && l.Status == "approved", cancellationToken);
}
