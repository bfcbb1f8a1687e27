using FinWatch.Server.Features.Access;
using FinWatch.Server.Infrastructure;
using FinWatch.Server.Infrastructure.Csv;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Measurements;

public static class MeasurementsEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/measurements").WithTags("Measurements")
            .RequireAuthorization(Permissions.Ingest).RequireRateLimiting(AccessExtensions.IngestLimiter);
        group.MapPost("/", IngestJsonAsync)
            .Accepts<IngestRowExample[]>("application/json")
            .WithSummary("Ingest a JSON batch: an array of site rows (all or nothing)");
        group.MapPost("/csv", IngestCsvAsync)
            .Accepts<IFormFile>("text/csv", "multipart/form-data")
            .WithSummary("Ingest a CSV file, sent as the body (text/csv) or as a multipart form file (all or nothing)");
    }

    private static async Task<Results<Ok<IngestAccepted>, ProblemHttpResult>> IngestJsonAsync(
        HttpContext http, IngestMeasurements ingest, IOptions<IngestOptions> options, CancellationToken cancellationToken)
    {
        CsvUpload.AllowLargeBody(http, options.Value.MaxBodyBytes);
        var rows = JsonRowSource.ReadAsync(http.Request.Body, cancellationToken);
        return ToResult(await ingest.RunAsync(rows, "api-json", null, cancellationToken));
    }

    private static async Task<Results<Ok<IngestAccepted>, ProblemHttpResult>> IngestCsvAsync(
        HttpContext http, IngestMeasurements ingest, IOptions<IngestOptions> options, Telemetry telemetry, CancellationToken cancellationToken)
    {
        var upload = await CsvUpload.OpenAsync(http, options.Value.MaxBodyBytes, cancellationToken);
        if (upload.Refusal is { } refusal)
        {
            // An upload whose form holds no readable file is a rejected batch too, though no row was read.
            telemetry.BatchRefused(CsvSource);
            return RejectedBatch.Refused(refusal).ToResult();
        }

        var rows = CsvRowSource.ReadAsync(upload.Stream!, cancellationToken);
        return ToResult(await ingest.RunAsync(rows, CsvSource, upload.Name, cancellationToken));
    }

    private const string CsvSource = "api-csv";

    private static Results<Ok<IngestAccepted>, ProblemHttpResult> ToResult(IngestOutcome outcome) =>
        outcome.Accepted is { } accepted ? TypedResults.Ok(accepted) : outcome.Rejected!.ToResult();
}

/// <summary>The JSON row shape, for the OpenAPI document only; ingest reads rows field by field to report each bad cell.</summary>
public sealed record IngestRowExample(
    string LotId, int WaferSlot, string SiteId, double SiteXMm, double SiteYMm, string Product, string Step,
    string? EtchTool, string? EtchChamber, string? LinerTool, string? LinerChamber, string? MetrologyTool,
    DateTimeOffset MeasuredAt, string? Operator,
    double? TopWidthNm, double? BottomWidthNm, double? FinHeightNm, double? CornerRadiusNm, double? LinerThicknessNm);
