using FinWatch.Server.Features.Access;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.Features;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.AspNetCore.WebUtilities;
using Microsoft.Extensions.Options;
using Microsoft.Net.Http.Headers;

namespace FinWatch.Server.Features.Measurements;

public static class MeasurementsEndpoints
{
    public const string InvalidBatchType = "/problems/invalid-batch";

    public static IServiceCollection AddMeasurements(this IServiceCollection services)
    {
        services.AddOptions<IngestOptions>().BindConfiguration(IngestOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        services.AddSingleton<IngestGate>();
        services.AddScoped<IngestMeasurements>();
        services.AddHostedService<InboxWatcher>();
        return services;
    }

    public static IEndpointRouteBuilder MapMeasurements(this IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/measurements").WithTags("Measurements")
            .RequireAuthorization(Permissions.Ingest).RequireRateLimiting(AccessExtensions.IngestLimiter);
        group.MapPost("/", IngestJsonAsync)
            .Accepts<IngestRowExample[]>("application/json")
            .WithSummary("Ingest a JSON batch: an array of site rows (all or nothing)");
        group.MapPost("/csv", IngestCsvAsync)
            .Accepts<IFormFile>("text/csv", "multipart/form-data")
            .WithSummary("Ingest a CSV file, sent as the body (text/csv) or as a multipart form file (all or nothing)");
        return app;
    }

    private static async Task<Results<Ok<IngestAccepted>, ProblemHttpResult>> IngestJsonAsync(
        HttpContext http, IngestMeasurements ingest, IOptions<IngestOptions> options, CancellationToken cancellationToken)
    {
        AllowLargeBody(http, options.Value.MaxBodyBytes);
        var rows = JsonRowSource.ReadAsync(http.Request.Body, cancellationToken);
        return ToResult(await ingest.RunAsync(rows, "api-json", null, cancellationToken));
    }

    private static async Task<Results<Ok<IngestAccepted>, ProblemHttpResult>> IngestCsvAsync(
        HttpContext http, IngestMeasurements ingest, IOptions<IngestOptions> options, Telemetry telemetry, CancellationToken cancellationToken)
    {
        Stream? stream;
        string? name;
        try
        {
            (stream, name) = await OpenCsvAsync(http, options.Value.MaxBodyBytes, cancellationToken);
        }
        catch (InvalidDataException e)
        {
            return Refused(telemetry, RowError.For(1, null, null, "the multipart form is broken: " + e.Message));
        }

        if (stream is null)
        {
            return Refused(telemetry, RowError.For(1, null, null, "the multipart form has no file part; send the CSV as a form file or as the request body"));
        }

        var rows = CsvRowSource.ReadAsync(stream, cancellationToken);
        return ToResult(await ingest.RunAsync(rows, CsvSource, name, cancellationToken));
    }

    private const string CsvSource = "api-csv";

    // An upload whose form holds no readable file is a rejected batch too, though no row was read.
    private static ProblemHttpResult Refused(Telemetry telemetry, RowError error)
    {
        telemetry.BatchRefused(CsvSource);
        return TypedResults.Problem(Rejection(new IngestRejected(0, 1, [error])));
    }

    /// <summary>The stored length of an uploaded file's name (ingest_batches.label, model_parameter_sets.source_name).</summary>
    public const int MaxFileNameLength = 260;

    /// <summary>The request body, or the first file part of a multipart form, read as it arrives, with the body limit raised to <paramref name="maxBodyBytes"/>.</summary>
    /// <exception cref="InvalidDataException">The multipart form is broken (here or, for the file part, while it is read).</exception>
    public static async Task<(Stream? Stream, string? Name)> OpenCsvAsync(HttpContext http, long maxBodyBytes, CancellationToken cancellationToken)
    {
        AllowLargeBody(http, maxBodyBytes);
        var request = http.Request;
        if (!MediaTypeHeaderValue.TryParse(request.ContentType, out var type)
            || !type.MediaType.Equals("multipart/form-data", StringComparison.OrdinalIgnoreCase))
        {
            return (request.Body, null);
        }

        var boundary = HeaderUtilities.RemoveQuotes(type.Boundary).Value;
        if (string.IsNullOrEmpty(boundary))
        {
            return (null, null);
        }

        var reader = new MultipartReader(boundary, request.Body);
        while (await NextSectionAsync(reader, cancellationToken) is { } section)
        {
            if (ContentDispositionHeaderValue.TryParse(section.ContentDisposition, out var disposition) && disposition.IsFileDisposition())
            {
                // Kept as the batch label or calibration source (260 characters): PostgreSQL refuses longer text, SQLite would not.
                var file = Path.GetFileName(HeaderUtilities.RemoveQuotes(disposition.FileName).Value);
                return (new MultipartFileStream(section.Body), file is { Length: > MaxFileNameLength } ? file[..MaxFileNameLength] : file);
            }
        }

        return (null, null);
    }

    // A broken form (cut short, a header line over the reader's limit) is the sender's fault: InvalidDataException.
    private static async Task<MultipartSection?> NextSectionAsync(MultipartReader reader, CancellationToken cancellationToken)
    {
        try
        {
            return await reader.ReadNextSectionAsync(cancellationToken);
        }
        catch (IOException e) when (e.GetType() == typeof(IOException))
        {
            throw new InvalidDataException(MultipartFileStream.CutShort, e);
        }
    }

    private static void AllowLargeBody(HttpContext http, long maxBodyBytes)
    {
        if (http.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } limit)
        {
            limit.MaxRequestBodySize = maxBodyBytes;
        }
    }

    private static Results<Ok<IngestAccepted>, ProblemHttpResult> ToResult(IngestOutcome outcome) =>
        outcome.Accepted is { } accepted ? TypedResults.Ok(accepted) : TypedResults.Problem(Rejection(outcome.Rejected!));

    /// <summary>The one shape of a rejected batch: problem details listing each bad row, column, value and reason.</summary>
    public static ProblemDetails Rejection(IngestRejected rejected)
    {
        var shown = rejected.Errors.Count < rejected.ErrorCount ? $" The first {rejected.Errors.Count} are listed." : "";
        return new ProblemDetails
        {
            Type = InvalidBatchType,
            Title = "The batch was rejected; nothing was stored.",
            Status = StatusCodes.Status400BadRequest,
            Detail = $"{rejected.ErrorCount} problem{(rejected.ErrorCount == 1 ? "" : "s")} in {rejected.RowsRead} row{(rejected.RowsRead == 1 ? "" : "s")} read.{shown} Correct them and send the whole batch again.",
            Extensions =
            {
                ["error_count"] = rejected.ErrorCount,
                ["rows_read"] = rejected.RowsRead,
                ["errors"] = rejected.Errors,
            },
        };
    }
}

/// <summary>The JSON row shape, for the OpenAPI document only; ingest reads rows field by field to report each bad cell.</summary>
public sealed record IngestRowExample(
    string LotId, int WaferSlot, string SiteId, double SiteXMm, double SiteYMm, string Product, string Step,
    string? EtchTool, string? EtchChamber, string? LinerTool, string? LinerChamber, string? MetrologyTool,
    DateTimeOffset MeasuredAt, string? Operator,
    double? TopWidthNm, double? BottomWidthNm, double? FinHeightNm, double? CornerRadiusNm, double? LinerThicknessNm);
