using FinWatch.Data;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Infrastructure;
using FinWatch.Server.Infrastructure.Csv;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Maintenance;

/// <summary>
/// The maintenance log: record one event, import a file of them, list them; and the events a chart context's points
/// follow, for drawing markers.
/// </summary>
public static class MaintenanceEndpoints
{
    /// <summary>Largest import file, bytes (tens of thousands of events).</summary>
    public const long MaxImportBytes = 4 * 1024 * 1024;

    /// <summary>Problems listed in a rejected import (all are counted).</summary>
    public const int MaxListedErrors = 200;

    public static void Map(IEndpointRouteBuilder app)
    {
        // Explicit segments: the routes are exactly /api/maintenance and /api/maintenance/import.
        var group = app.MapGroup("/api").WithTags("Maintenance").ValidateRequests();
        group.MapPost("/maintenance", RecordAsync).RequireAuthorization(Permissions.Disposition)
            .WithSummary("Record one maintenance of a chamber or tool (supervisors and engineers)");
        group.MapGet("/maintenance", ListAsync).RequireAuthorization(Permissions.Read)
            .WithSummary("The maintenance log, newest first; filter by chamber and time");
        group.MapPost("/maintenance/import", ImportAsync).RequireAuthorization(Permissions.Disposition)
            .Accepts<IFormFile>("text/csv", "multipart/form-data")
            .WithSummary("Record every maintenance of a CSV file, or none when any row is bad");
        group.MapGet("/contexts/{code}/maintenance", ContextAsync).RequireAuthorization(Permissions.Floor)
            .WithSummary("The maintenance events a chart context's points follow, with the first point after each");
    }

    private static async Task<Results<Created<MaintenanceResponse>, ValidationProblem>> RecordAsync(
        MaintenanceRequest request, FinWatchDbContext db, TimeProvider clock, HttpContext http, CancellationToken cancellationToken)
    {
        var errors = new ValidationErrors();
        var checkedEvent = MaintenanceFields.Check(request, clock.GetUtcNow(), MaintenanceFields.Into(errors));
        if (checkedEvent is not null && (await MaintenanceLog.RecordedAlreadyAsync(db, [checkedEvent], cancellationToken)).TryGetValue(checkedEvent, out var id))
        {
            errors["occurred_at"] = $"this {request.Kind} of {checkedEvent.Chamber} at {request.OccurredAt} is recorded already (event {id})";
        }

        if (errors.Count > 0)
        {
            return Problems.Invalid(errors);
        }

        var saved = (await MaintenanceLog.RecordAsync(db, [checkedEvent!], http.User.Who(), "api", clock, cancellationToken))[0];
        return TypedResults.Created($"/api/maintenance?chamber={Uri.EscapeDataString(saved.Chamber)}", saved);
    }

    private static async Task<Ok<List<MaintenanceResponse>>> ListAsync([AsParameters] MaintenanceQuery query, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var q = db.MaintenanceEvents.AsNoTracking();
        if (!string.IsNullOrWhiteSpace(query.Chamber))
        {
            var chamber = query.Chamber.Trim();
            q = q.Where(e => e.Chamber == chamber);
        }

        if (query.From is { } f)
        {
            var ms = Time.ToMs(f);
            q = q.Where(e => e.OccurredAtMs >= ms);
        }

        if (query.To is { } t)
        {
            var ms = Time.ToMs(t);
            q = q.Where(e => e.OccurredAtMs <= ms);
        }

        var rows = await q.OrderByDescending(e => e.OccurredAtMs).ThenByDescending(e => e.Id).Take(query.Limit ?? MaintenanceQuery.DefaultLimit)
            .ToListAsync(cancellationToken);
        return TypedResults.Ok(rows.Select(MaintenanceLog.Describe).ToList());
    }

    private static async Task<Results<Created<MaintenanceImportResponse>, ProblemHttpResult>> ImportAsync(
        HttpContext http, FinWatchDbContext db, TimeProvider clock, CancellationToken cancellationToken)
    {
        var upload = await CsvUpload.OpenAsync(http, MaxImportBytes, cancellationToken);
        if (upload.Refusal is { } refusal)
        {
            return RejectedBatch.Refused(refusal).ToResult();
        }

        MaintenanceCsv.Outcome read;
        try
        {
            read = await MaintenanceCsv.ReadAsync(upload.Stream!, clock.GetUtcNow(), cancellationToken);
        }
        catch (InvalidDataException e)
        {
            return RejectedBatch.Refused(RowError.For(1, null, null, "the multipart form is broken: " + e.Message)).ToResult();
        }

        var errors = read.Errors;
        if (errors.Count == 0)
        {
            var recorded = await MaintenanceLog.RecordedAlreadyAsync(db, [.. read.Events.Select(e => e.Event)], cancellationToken);
            errors.AddRange(read.Events.Where(e => recorded.ContainsKey(e.Event)).Select(e => MaintenanceCsv.RecordedAlready(e.Row, e.Event, recorded[e.Event])));
        }

        if (errors.Count > 0)
        {
            return new RejectedBatch(read.RowsRead, errors.Count, [.. errors.Take(MaxListedErrors)]).ToResult();
        }

        var source = upload.Name ?? "import";
        var saved = await MaintenanceLog.RecordAsync(db, [.. read.Events.Select(e => e.Event)], http.User.Who(), source, clock, cancellationToken);
        return TypedResults.Created("/api/maintenance", new MaintenanceImportResponse(upload.Name, saved.Count, saved));
    }

    private static async Task<Results<Ok<ContextMaintenanceResponse>, ProblemHttpResult>> ContextAsync(
        string code, DateTimeOffset? from, DateTimeOffset? to, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var context = await db.ChartContexts.AsNoTracking().SingleOrDefaultAsync(c => c.Code == code, cancellationToken);
        if (context is null)
        {
            return Problems.NotFound("Not found.", $"There is no chart context '{code}'.");
        }

        long fromMs = from is { } f ? Time.ToMs(f) : long.MinValue, toMs = to is { } t ? Time.ToMs(t) : long.MaxValue;
        var points = await db.ChartPoints.AsNoTracking().Where(p => p.ContextId == context.Id && p.MeasuredAtMs >= fromMs && p.MeasuredAtMs <= toMs)
            .OrderBy(p => p.Seq).Select(p => new { p.Seq, p.MeasuredAtMs, p.Chamber }).ToListAsync(cancellationToken);
        List<string> chambers = context.Chamber is { } own ? [own] : [.. points.Select(p => p.Chamber).OfType<string>().Distinct()];
        var events = await ChamberMaintenance.AroundAsync(db, chambers, points.Count > 0 ? points[0].MeasuredAtMs : fromMs, toMs, cancellationToken);
        var markers = ChamberMaintenance.Markers(events, points, p => p.MeasuredAtMs, (p, chamber) => context.Chamber is not null || p.Chamber == chamber, (p, _) => p.Seq);
        return TypedResults.Ok(new ContextMaintenanceResponse(context.Code, context.Chamber, markers));
    }
}
