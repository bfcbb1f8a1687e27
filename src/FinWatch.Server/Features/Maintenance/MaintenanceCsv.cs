using System.Globalization;
using FinWatch.Physics;
using FinWatch.Server.Infrastructure;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Server.Features.Maintenance;

/// <summary>
/// Reads a maintenance import file: a header row, then one event per row with the columns <c>chamber</c>,
/// <c>kind</c>, <c>occurred_at</c>, <c>performed_by</c> and optionally <c>note</c> (any order). Each row is checked
/// as the API checks one event; every bad cell is reported with its row (the header is row 1), column and value.
/// </summary>
public static class MaintenanceCsv
{
    public static readonly string[] Columns = ["chamber", "kind", "occurred_at", "performed_by", "note"];

    private static readonly string[] Optional = ["note"];

    /// <summary>The file's rows read, its events in file order, and its problems (the events count only without problems).</summary>
    public sealed record Outcome(int RowsRead, List<(int Row, CheckedMaintenance Event)> Events, List<RowError> Errors);

    public static async Task<Outcome> ReadAsync(Stream stream, DateTimeOffset now, CancellationToken cancellationToken)
    {
        var events = new List<(int Row, CheckedMaintenance Event)>();
        var errors = new List<RowError>();
        var seen = new Dictionary<CheckedMaintenance, int>();
        var rows = await CsvTable.ReadAsync(stream, Columns, Optional, (row, cell) =>
        {
            var request = new MaintenanceRequest
            {
                Chamber = cell("chamber"), Kind = cell("kind"), OccurredAt = cell("occurred_at"), PerformedBy = cell("performed_by"), Note = cell("note"),
            };
            if (MaintenanceFields.Check(request, now, (field, value, reason) => errors.Add(RowError.For(row, field, value, reason))) is not { } checkedEvent)
            {
                return;
            }

            if (seen.TryGetValue(checkedEvent, out var first))
            {
                errors.Add(RowError.For(row, "occurred_at", request.OccurredAt, $"the same {MaintenanceKindText.ToText(checkedEvent.Kind)} of {checkedEvent.Chamber} at this time is in row {first} already"));
                return;
            }

            seen[checkedEvent] = row;
            events.Add((row, checkedEvent));
        }, errors, cancellationToken);
        return new Outcome(rows, events, errors);
    }

    /// <summary>The problem of a row whose event is recorded already.</summary>
    public static RowError RecordedAlready(int row, CheckedMaintenance e, long id) => RowError.For(row, "occurred_at",
        DateTimeOffset.FromUnixTimeMilliseconds(e.OccurredAtMs).ToString("yyyy-MM-ddTHH:mm:ssZ", CultureInfo.InvariantCulture),
        $"this {MaintenanceKindText.ToText(e.Kind)} of {e.Chamber} is recorded already (event {id}); leave the row out");
}
