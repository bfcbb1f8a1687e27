using System.Globalization;
using System.Text;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Reports;

/// <summary>
/// The shift report as one RFC 4180 CSV: the sections one after another. Every record has the same number of fields:
/// <c>section</c>, <c>row</c> (<c>header</c> for the row naming the section's columns, else 1, 2, …) and the section's
/// columns, padded with empty fields to the widest section. Units are in the column names or a <c>unit</c> column.
/// </summary>
public static class ShiftReportCsv
{
    public static string FileName(ShiftReportResponse r) => $"finwatch-shift-{r.Date:yyyy-MM-dd}-{r.Shift}.csv";

    public static string Write(ShiftReportResponse r)
    {
        var sections = new List<(string Name, string[] Columns, List<string?[]> Rows)>
        {
            ("shift", ["shift", "date", "time_zone", "start", "end", "length_h", "status", "generated_at", "prediction_caution"],
                [[r.Shift, r.Date.ToString("yyyy-MM-dd", CultureInfo.InvariantCulture), r.TimeZone, T(r.Start), T(r.End), N(r.LengthHours), r.Status, T(r.GeneratedAt), r.PredictionCaution]]),
            ("needs_action", ["alerts_not_closed", "alerts_not_acknowledged", "alerts_escalated", "charts_out_of_control"],
                [[I(r.NeedsAction.AlertsNotClosed), I(r.NeedsAction.AlertsNotAcknowledged), I(r.NeedsAction.AlertsEscalated), I(r.NeedsAction.ChartsOutOfControl)]]),
            ("handover", ["notes", "notes_by", "notes_at", "outgoing_by", "outgoing_at", "incoming_by", "incoming_at"],
                [[r.Handover.Notes, r.Handover.NotesBy, T(r.Handover.NotesAt), r.Handover.Outgoing?.By, T(r.Handover.Outgoing?.At), r.Handover.Incoming?.By, T(r.Handover.Incoming?.At)]]),
            ("lots_measured", ["lot_id", "product", "step", "wafer_count", "site_count", "chambers", "first_measured_at", "last_measured_at"],
                [.. r.LotsMeasured.Select(l => new[] { l.LotId, l.Product, l.Step, I(l.WaferCount), I(l.SiteCount), string.Join("; ", l.Chambers), T(l.FirstMeasuredAt), T(l.LastMeasuredAt) })]),
            ("alerts_raised", AlertColumns, [.. r.AlertsRaised.Select(AlertRow)]),
            ("signals_measured", ["alert_id", "context", "context_title", "rules", "signal_points", "lots", "first_measured_at", "last_measured_at", "raised_at", "raised_in_shift"],
                [.. r.SignalsMeasured.Select(m => new[] { I(m.AlertId), m.Context, m.ContextTitle, string.Join("; ", m.Rules), I(m.SignalPoints), I(m.Lots),
                    T(m.FirstMeasuredAt), T(m.LastMeasuredAt), m.RaisedAt is { } t ? T(t) : null, m.RaisedInShift ? "true" : "false" })]),
            ("alert_actions", ["alert_id", "context", "context_title", "rule", "severity", "lot_id", "action", "at", "by", "comment", "steps"],
                [.. r.AlertActions.Select(a => new[] { I(a.AlertId), a.Context, a.ContextTitle, a.Rule, a.Severity, a.LotId, a.Action, T(a.At), a.By, a.Comment,
                    a.Steps is null ? null : string.Join(" | ", a.Steps.Select(s => $"{s.Step}: {(s.Done ? "done" : "not done")}{(string.IsNullOrWhiteSpace(s.Note) ? "" : $" ({s.Note})")}")) })]),
            ("maintenance_performed", ["maintenance_id", "chamber", "kind", "occurred_at", "performed_by", "note", "recorded_by", "contexts", "context_titles"],
                [.. r.MaintenancePerformed.Select(m => new[] { I(m.Id), m.Chamber, m.Kind, T(m.OccurredAt), m.PerformedBy, m.Note, m.RecordedBy,
                    string.Join("; ", m.Contexts.Select(c => c.Context)), string.Join("; ", m.Contexts.Select(c => c.ContextTitle)) })]),
            ("alerts_open_at_end", AlertColumns, [.. r.AlertsOpenAtEnd.Select(AlertRow)]),
            ("contexts_out_of_control", ["context", "title", "product", "step", "parameter", "chamber", "alerts_not_closed", "worst_severity", "rules"],
                [.. r.ContextsOutOfControl.Select(c => new[] { c.Context, c.Title, c.Product, c.Step, c.Parameter, c.Chamber, I(c.AlertsNotClosed), c.WorstSeverity, string.Join("; ", c.Rules) })]),
            ("dvt_risks", ["lot_id", "wafer_slot", "chamber", "measured_at", "predicted_dvt_sat_mv", "context", "context_title", "electrical_concern_mv", "also_in_contexts", "also_in_context_titles"],
                [.. r.DvtRisks.Select(d => new[] { d.LotId, I(d.WaferSlot), d.Chamber, T(d.MeasuredAt), N(d.PredictedDvtSatMv), d.Context, d.ContextTitle, N(d.ElectricalConcernMv), string.Join("; ", d.AlsoInContexts), string.Join("; ", d.AlsoInContextTitles) })]),
            ("capability_changes", ["context", "context_title", "state_at_shift_end", "parameter", "unit", "lsl", "usl",
                "last_seven_days_points", "last_seven_days_mean", "last_seven_days_sigma_within", "last_seven_days_cpk", "last_seven_days_reason", "shift_points", "shift_mean", "shift_sigma_within", "shift_cpk", "shift_reason",
                "previous_seven_days_points", "previous_seven_days_mean", "previous_seven_days_sigma_within", "previous_seven_days_cpk", "previous_seven_days_reason", "cpk_change"],
                [.. r.CapabilityChanges.Select(c => new[] { c.Context, c.ContextTitle, c.StateAtShiftEnd, c.Parameter, c.Unit, N(c.Lsl), N(c.Usl),
                    I(c.LastSevenDays.Points), N(c.LastSevenDays.Mean), N(c.LastSevenDays.SigmaWithin), N(c.LastSevenDays.Cpk), c.LastSevenDays.Reason,
                    I(c.Shift.Points), N(c.Shift.Mean), N(c.Shift.SigmaWithin), N(c.Shift.Cpk), c.Shift.Reason,
                    I(c.PreviousSevenDays.Points), N(c.PreviousSevenDays.Mean), N(c.PreviousSevenDays.SigmaWithin), N(c.PreviousSevenDays.Cpk), c.PreviousSevenDays.Reason, N(c.CpkChange) })]),
        };

        var width = 2 + sections.Max(s => s.Columns.Length);
        var csv = new StringBuilder();
        foreach (var (name, columns, rows) in sections)
        {
            Record(csv, width, [name, "header", .. columns]);
            foreach (var (row, i) in rows.Select((row, i) => (row, i)))
            {
                Record(csv, width, [name, I(i + 1), .. row]);
            }
        }

        return csv.ToString();
    }

    private static readonly string[] AlertColumns =
        ["alert_id", "context", "context_title", "rule", "rule_text", "rules", "severity", "state_at_shift_end", "raised_at", "first_signal_measured_at",
            "last_signal_measured_at", "signal_points", "points", "lot_id", "wafer_slot", "chamber", "predicted_dvt_sat_mv", "escalated_by_shift_end"];

    private static string?[] AlertRow(ShiftAlertRow a) =>
        [I(a.Id), a.Context, a.ContextTitle, a.Rule, a.RuleText, string.Join("; ", a.Rules), a.Severity, a.StateAtShiftEnd, T(a.RaisedAt),
            T(a.FirstSignalMeasuredAt), T(a.LastSignalMeasuredAt), I(a.SignalCount), I(a.PointCount), a.LotId, I(a.WaferSlot), a.Chamber,
            N(a.PredictedDvtSatMv), a.EscalatedByShiftEnd ? "true" : "false"];

    private static void Record(StringBuilder csv, int width, string?[] fields)
    {
        for (var i = 0; i < width; i++)
        {
            if (i > 0)
            {
                csv.Append(',');
            }

            csv.Append(CsvField.Of(i < fields.Length ? fields[i] : null));
        }

        csv.Append("\r\n");
    }

    private static string? T(DateTimeOffset? t) => t?.UtcDateTime.ToString("yyyy-MM-dd'T'HH:mm:ss.fff'Z'", CultureInfo.InvariantCulture);

    private static string? N(double? v) => v?.ToString("R", CultureInfo.InvariantCulture);

    private static string? I(long? v) => v?.ToString(CultureInfo.InvariantCulture);
}
