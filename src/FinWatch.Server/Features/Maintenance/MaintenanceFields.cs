using FinWatch.Physics;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Maintenance;

/// <summary>One maintenance event's fields, checked: the chamber and people trimmed, the time in UTC epoch ms.</summary>
public sealed record CheckedMaintenance(string Chamber, MaintenanceKind Kind, long OccurredAtMs, string PerformedBy, string Note);

/// <summary>
/// The checks of a maintenance event's fields, the same for the form, the API and each row of an import file: every
/// problem is reported with its field (the JSON name, which is also the file's column) and the value given.
/// </summary>
public static class MaintenanceFields
{
    public const int MaxChamberLength = 64, MaxPersonLength = 200, MaxNoteLength = 2000;

    /// <summary>Reports a problem: the field, the value given (null when absent) and why it is refused.</summary>
    public delegate void Report(string field, string? value, string reason);

    /// <summary>A <see cref="Report"/> into a request's problems; the message quotes the value given.</summary>
    public static Report Into(ValidationErrors errors) =>
        (field, value, reason) => errors[field] = value is null ? reason : $"{reason} (given: '{value}')";

    /// <summary>
    /// Checks the fields; returns them checked, or null after reporting every problem. With <paramref name="now"/>
    /// the time must also lie between 2000 and five minutes past it; without, only its form is checked.
    /// </summary>
    public static CheckedMaintenance? Check(MaintenanceRequest r, DateTimeOffset? now, Report report)
    {
        var problems = 0;
        void Refuse(string field, string? value, string reason)
        {
            problems++;
            report(field, value, reason);
        }

        var chamber = r.Chamber?.Trim();
        if (string.IsNullOrEmpty(chamber) || chamber.Length > MaxChamberLength || chamber.Any(char.IsControl))
        {
            Refuse("chamber", r.Chamber, $"chamber is required: the chamber or tool as the measurements name it, 1 to {MaxChamberLength} characters");
        }

        if (!MaintenanceKindText.Spelling.TryParse(r.Kind, out var kind))
        {
            Refuse("kind", r.Kind, $"kind is {MaintenanceKindText.Spelling.Described}");
        }

        var at = default(DateTimeOffset);
        if (r.OccurredAt is null)
        {
            Refuse("occurred_at", null, "occurred_at is required: when the maintenance was done, an ISO 8601 time with a zone, such as 2026-11-20T09:30:00Z");
        }
        else if (TimeProblem(r.OccurredAt, now, out at) is { } problem)
        {
            Refuse("occurred_at", r.OccurredAt, problem);
        }

        var by = r.PerformedBy?.Trim();
        if (string.IsNullOrEmpty(by) || by.Length > MaxPersonLength)
        {
            Refuse("performed_by", r.PerformedBy, $"performed_by is required: who did the work (a person or a crew), 1 to {MaxPersonLength} characters");
        }

        var note = r.Note?.Trim() ?? "";
        if (note.Length > MaxNoteLength)
        {
            Refuse("note", r.Note![..40] + "…", $"note is at most {MaxNoteLength} characters");
        }

        return problems > 0 ? null : new CheckedMaintenance(chamber!, kind, at.ToUnixTimeMilliseconds(), by!, note);
    }

    private static string? TimeProblem(string text, DateTimeOffset? now, out DateTimeOffset at) =>
        now is { } clock ? ZonedTime.ProblemWithPastTime(text, clock, out at)
        : ZonedTime.TryParse(text, out at) ? null : ZonedTime.NotZoned;
}
