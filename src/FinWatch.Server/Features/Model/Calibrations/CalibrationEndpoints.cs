using FinWatch.Server.Infrastructure;
using FinWatch.Server.Features.Access;
using System.Globalization;
using FinWatch.Data;
using FinWatch.Server.Infrastructure.Csv;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Mvc;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Model.Calibrations;

public static class CalibrationEndpoints
{
    /// <summary>Largest electrical-test file accepted, bytes (about 100,000 wafers).</summary>
    public const long MaxBodyBytes = 8 * 1024 * 1024;

    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/model/calibrations").WithTags("Model");
        group.MapPost("/", CalibrateAsync).RequireAuthorization(Permissions.Engineer)
            .Accepts<IFormFile>("text/csv", "multipart/form-data")
            .WithSummary("Fit the product's calibration to an electrical-test CSV; stores the next parameter-set version unless preview=true");
        group.MapGet("/", HistoryAsync).WithSummary("A product's calibrations, newest (current) first");
    }

    private static async Task<Results<Ok<CalibrationResponse>, Created<CalibrationResponse>, ProblemHttpResult>> CalibrateAsync(
        HttpContext http, CalibrateModel calibrate, string? reason, bool? preview, [FromQuery(Name = "measurement_sd_mv")] double? measurementSdMv, CancellationToken cancellationToken)
    {
        if (measurementSdMv is { } sd && !(sd >= 0.1 && sd <= 100))
        {
            return RejectedBatch.Refused(
                RowError.For(0, "measurement_sd_mv", sd.ToString(CultureInfo.InvariantCulture), "the threshold's test uncertainty is 0.1 to 100 mV")).ToResult();
        }

        var upload = await CsvUpload.OpenAsync(http, MaxBodyBytes, cancellationToken);
        if (upload.Refusal is { } refusal)
        {
            return RejectedBatch.Refused(refusal).ToResult();
        }

        var who = http.User.Who();
        var outcome = await calibrate.RunAsync(upload.Stream!, new CalibrateModel.Request(reason, who, upload.Name, preview ?? false,
            measurementSdMv ?? CalibrateModel.DefaultMeasurementSdMv), cancellationToken);
        if (outcome.Rejected is { } rejected)
        {
            return rejected.ToResult();
        }

        var result = outcome.Result!;
        return result.Stored
            ? TypedResults.Created($"/api/model/calibrations?product={Uri.EscapeDataString(result.Product)}", result)
            : TypedResults.Ok(result);
    }

    private static async Task<Results<Ok<CalibrationHistoryResponse>, ValidationProblem>> HistoryAsync(
        string? product, FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var p = product is null ? null : await db.Products.AsNoTracking().SingleOrDefaultAsync(x => x.Code == product, cancellationToken);
        if (p is null)
        {
            return Problems.Invalid("product", Problems.NotAProduct(product));
        }

        var sets = await db.ModelParameterSets.AsNoTracking().Where(s => s.ProductId == p.Id).OrderByDescending(s => s.Version).ToListAsync(cancellationToken);
        var prior = ProductModels.ParametersOf(p);
        var list = sets.Select(s => CalibrateModel.Describe(p, s, prior, ProductModels.ParametersOf(p, s), s.Version, null,
            DateTimeOffset.FromUnixTimeMilliseconds(s.CreatedAtMs))).ToList();
        return TypedResults.Ok(new CalibrationHistoryResponse(p.Code, list, EvaluateModel.PredictionCaution));
    }
}
