using FinWatch.Server.Infrastructure;
using System.Globalization;
using System.Text;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Reports;

/// <summary>The shift report: JSON, or the same content as CSV.</summary>
public static class ReportEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/reports").WithTags("Reports");
        group.MapGet("/shift", JsonAsync)
            .WithSummary("Shift report: lots measured, alerts raised, handled and open, chamber maintenance, contexts out of control, predicted ΔVT risks, Cpk changes (format=csv for CSV)");
        group.MapGet("/shift.csv", CsvAsync).WithSummary("The shift report as CSV, one section after another");
    }

    private static async Task<Results<Ok<ShiftReportResponse>, FileContentHttpResult, ValidationProblem>> JsonAsync(
        string? date, string? shift, string? format, ShiftReport report, IOptions<ShiftOptions> options, TimeProvider clock, CancellationToken cancellationToken)
    {
        if (format is not null && format != "json" && format != "csv")
        {
            return Invalid(new() { ["format"] = $"format '{format}' is not known; use json (the default) or csv" });
        }

        var (r, problem) = await ReportAsync(date, shift, report, options.Value, clock, cancellationToken);
        return problem is not null ? problem : format == "csv" ? Csv(r!) : TypedResults.Ok(r!);
    }

    private static async Task<Results<FileContentHttpResult, ValidationProblem>> CsvAsync(
        string? date, string? shift, ShiftReport report, IOptions<ShiftOptions> options, TimeProvider clock, CancellationToken cancellationToken)
    {
        var (r, problem) = await ReportAsync(date, shift, report, options.Value, clock, cancellationToken);
        return problem is not null ? problem : Csv(r!);
    }

    private static FileContentHttpResult Csv(ShiftReportResponse r) =>
        TypedResults.File(Encoding.UTF8.GetBytes(ShiftReportCsv.Write(r)), "text/csv; charset=utf-8", ShiftReportCsv.FileName(r));

    private static async Task<(ShiftReportResponse? Report, ValidationProblem? Problem)> ReportAsync(
        string? date, string? shift, ShiftReport report, ShiftOptions options, TimeProvider clock, CancellationToken cancellationToken)
    {
        var (w, errors) = Resolve(date, shift, options, clock);
        return w is null ? (null, Invalid(errors!)) : (await report.BuildAsync(w, cancellationToken), null);
    }

    /// <summary>
    /// The shift asked for: <c>date</c> (YYYY-MM-DD, the date the shift starts on in the configured zone) and
    /// <c>shift</c> (a name of the pattern) together; neither gives the last shift that has finished.
    /// </summary>
    internal static (ShiftWindow? Window, ValidationErrors? Errors) Resolve(string? date, string? shift, ShiftOptions options, TimeProvider clock)
    {
        var pattern = options.EffectivePattern;
        var zone = ShiftCalendar.TryZone(options.TimeZone, out var z) ? z : TimeZoneInfo.Utc;
        if (date is null && shift is null)
        {
            return (ShiftCalendar.LastFinished(pattern, zone, clock.GetUtcNow()), null);
        }

        var errors = new ValidationErrors();
        var names = string.Join(", ", pattern.Select(s => s.Name));
        DateOnly day = default;
        if (date is null)
        {
            errors["date"] = "date is required with shift: the date (YYYY-MM-DD) the shift starts on";
        }
        else if (!DateOnly.TryParseExact(date, "yyyy-MM-dd", CultureInfo.InvariantCulture, DateTimeStyles.None, out day))
        {
            errors["date"] = $"date '{date}' is not a date; use YYYY-MM-DD, e.g. 2026-11-29";
        }

        var definition = shift is null ? null : pattern.FirstOrDefault(s => string.Equals(s.Name, shift, StringComparison.OrdinalIgnoreCase));
        if (shift is null)
        {
            errors["shift"] = $"shift is required with date: one of {names}";
        }
        else if (definition is null)
        {
            errors["shift"] = $"shift '{shift}' is not a shift of the pattern; the shifts are {names}";
        }

        return errors.Count > 0 ? (null, errors) : (ShiftCalendar.Window(definition!, day, zone), null);
    }

    internal static ValidationProblem Invalid(ValidationErrors errors) =>
        Problems.Invalid(errors, type: "/problems/invalid-shift", detailFromMessages: true);
}
