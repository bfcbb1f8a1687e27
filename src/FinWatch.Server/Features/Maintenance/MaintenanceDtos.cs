using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Mvc;

namespace FinWatch.Server.Features.Maintenance;

/// <summary>
/// POST /api/maintenance, and one row of an import file: a maintenance of a chamber or tool. The time is text (ISO 8601
/// with a zone) so that a bad one is answered with its field and value like every other field.
/// </summary>
public sealed record MaintenanceRequest : IValidatedRequest
{
    /// <summary>The chamber or tool, as the measurements name it (etch chamber, liner chamber or tool).</summary>
    public string? Chamber { get; init; }

    /// <summary>One of the spellings of <see cref="Physics.MaintenanceKindText"/>.</summary>
    public string? Kind { get; init; }

    /// <summary>When it was done (its end), ISO 8601 with a zone.</summary>
    public string? OccurredAt { get; init; }

    public string? PerformedBy { get; init; }

    public string? Note { get; init; }

    // The time's place against the server clock and duplicates are checked by the handler (they need the clock and
    // the database).
    public void Validate(ValidationErrors errors) => MaintenanceFields.Check(this, null, MaintenanceFields.Into(errors));
}

/// <summary>GET /api/maintenance: the log, newest first, optionally of one chamber and a time range.</summary>
public sealed record MaintenanceQuery(
    [FromQuery(Name = "chamber")] string? Chamber,
    [FromQuery(Name = "from")] DateTimeOffset? From,
    [FromQuery(Name = "to")] DateTimeOffset? To,
    [FromQuery(Name = "limit")] int? Limit) : IValidatedRequest
{
    public const int DefaultLimit = 200, MaxLimit = 5000;

    public void Validate(ValidationErrors errors)
    {
        if (From > To)
        {
            errors["from"] = $"from ({From:u}) must not be after to ({To:u})";
        }

        if (Limit is < 1 or > MaxLimit)
        {
            errors["limit"] = $"limit is 1 to {MaxLimit} events (given: {Limit})";
        }

        if (Chamber is { Length: > MaintenanceFields.MaxChamberLength })
        {
            errors["chamber"] = $"chamber is at most {MaintenanceFields.MaxChamberLength} characters";
        }
    }
}

/// <summary>A recorded maintenance event; times in UTC.</summary>
public sealed record MaintenanceResponse(
    long Id, string Chamber, string Kind, DateTimeOffset OccurredAt, string PerformedBy, string Note,
    string RecordedBy, DateTimeOffset RecordedAt, string Source);

/// <summary>POST /api/maintenance/import: every event of the file, recorded together.</summary>
public sealed record MaintenanceImportResponse(string? File, int Recorded, IReadOnlyList<MaintenanceResponse> Events);

/// <summary>
/// A maintenance as a chart draws it. <c>first_point</c> is the first point measured after it on its chamber: the point's
/// <c>seq</c> on a chart context, its 0-based position in <c>points</c> of a stored series; null when none follows in
/// the answer.
/// </summary>
public sealed record MaintenanceMarker(long Id, string Chamber, string Kind, DateTimeOffset At, long? FirstPoint);

/// <summary>GET /api/contexts/{code}/maintenance: the maintenance events of the chart's chambers for its points in range.</summary>
public sealed record ContextMaintenanceResponse(string Context, string? Chamber, IReadOnlyList<MaintenanceMarker> Markers);

/// <summary>
/// A chart's last maintenance and what followed it, up to the chart's latest point: <c>lots_since</c> and
/// <c>points_since</c> count the chart's points measured after it, <c>hours_since</c> runs from it to the latest of
/// them (null when none follows yet). <c>baseline</c> compares the points after it with those before it.
/// </summary>
public sealed record MaintenanceSince(
    string Chamber, MaintenanceMarker Last, int LotsSince, int PointsSince, double? HoursSince, BaselineSuggestion Baseline);

/// <summary>
/// Whether the points after a maintenance have a different mean from those before it (Welch's t-test,
/// docs/statistics.md §4.5): means and shift in <c>unit</c>, at most <c>window</c> points each side.
/// </summary>
public sealed record BaselineSuggestion(
    bool SuggestNewBaseline, string Message, int Window, int NBefore, int NAfter, double? MeanBefore, double? MeanAfter,
    double? Shift, string Unit, double? T, double? DegreesOfFreedom, double? PValue, double Alpha);

/// <summary>The drift forecast's chamber and its last maintenance before the forecast's last lot, in lots and hours.</summary>
public sealed record ForecastMaintenance(string Chamber, MaintenanceMarker Last, int LotsSince, double HoursSince, string Message);
