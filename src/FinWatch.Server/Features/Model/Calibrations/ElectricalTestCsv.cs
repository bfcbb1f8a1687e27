using System.Globalization;
using FinWatch.Server.Infrastructure;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Server.Features.Model.Calibrations;

/// <summary>
/// Reads an electrical-test CSV for calibration: one row per wafer, columns <c>lot_id</c>, <c>wafer_slot</c>,
/// <c>product</c>, <c>vt_lin_v</c>, <c>vt_sat_v</c>, <c>tested_at</c> (any order, header required). Every bad cell is
/// reported with its row, column and value; rows are numbered as in the file, the header being row 1.
/// </summary>
public static class ElectricalTestCsv
{
    public static readonly string[] Columns = ["lot_id", "wafer_slot", "product", "vt_lin_v", "vt_sat_v", "tested_at"];

    /// <summary>Plausible threshold voltages, V: wider than any FinFET, narrow enough to catch mV typed as V.</summary>
    public const double MinVtV = -1.0, MaxVtV = 2.0;

    /// <summary>Reads and validates the whole file; the rows are returned only when there is no error.</summary>
    public static async Task<(List<ElectricalTestRow> Rows, List<RowError> Errors)> ReadAsync(
        Stream stream, DateTimeOffset now, CancellationToken cancellationToken)
    {
        var rows = new List<ElectricalTestRow>();
        var errors = new List<RowError>();
        var seen = new Dictionary<(string, int), int>();
        await CsvTable.ReadAsync(stream, Columns, [], (row, cell) =>
        {
            if (Parse(row, cell, now, errors) is not { } parsed)
            {
                return;
            }

            if (seen.TryGetValue((parsed.LotId, parsed.WaferSlot), out var first))
            {
                errors.Add(RowError.For(row, "wafer_slot", parsed.WaferSlot.ToString(CultureInfo.InvariantCulture),
                    $"lot {parsed.LotId} wafer {parsed.WaferSlot} already appears in row {first}; give one result per wafer (the mean of its test structures)"));
                return;
            }

            seen[(parsed.LotId, parsed.WaferSlot)] = row;
            rows.Add(parsed);
        }, errors, cancellationToken);
        return (rows, errors);
    }

    private static ElectricalTestRow? Parse(int row, Func<string, string?> cell, DateTimeOffset now, List<RowError> errors)
    {
        var before = errors.Count;
        var lot = cell("lot_id");
        if (lot is null)
        {
            errors.Add(RowError.For(row, "lot_id", null, "a value is required"));
        }
        else if (lot.Length > WaferIdentity.MaxTextLength)
        {
            errors.Add(RowError.For(row, "lot_id", lot, $"longer than {WaferIdentity.MaxTextLength} characters"));
        }

        var slotText = cell("wafer_slot");
        if (!int.TryParse(slotText, NumberStyles.None, CultureInfo.InvariantCulture, out var slot) || slot < 1 || slot > WaferIdentity.MaxSlot)
        {
            errors.Add(RowError.For(row, "wafer_slot", slotText, $"a whole number from 1 to {WaferIdentity.MaxSlot} is required"));
        }

        var product = cell("product");
        if (product is null)
        {
            errors.Add(RowError.For(row, "product", null, "a value is required"));
        }

        var lin = Voltage(row, "vt_lin_v", cell("vt_lin_v"), errors);
        var sat = Voltage(row, "vt_sat_v", cell("vt_sat_v"), errors);
        var atText = cell("tested_at");
        DateTimeOffset at = default;
        if (atText is null)
        {
            errors.Add(RowError.For(row, "tested_at", null, "a value is required"));
        }
        else if (ZonedTime.ProblemWithPastTime(atText, now, out at) is { } problem)
        {
            errors.Add(RowError.For(row, "tested_at", atText, problem));
        }

        return errors.Count > before ? null : new ElectricalTestRow(row, lot!, slot, product!, lin!.Value, sat!.Value, at);
    }

    private static double? Voltage(int row, string column, string? text, List<RowError> errors)
    {
        if (!double.TryParse(text, NumberStyles.Float, CultureInfo.InvariantCulture, out var v) || !double.IsFinite(v))
        {
            errors.Add(RowError.For(row, column, text, "a number in V is required (invariant culture, '.' as the decimal point)"));
            return null;
        }

        if (v < MinVtV || v > MaxVtV)
        {
            errors.Add(RowError.For(row, column, text,
                string.Create(CultureInfo.InvariantCulture, $"outside {MinVtV} to {MaxVtV} V; thresholds are given in V, not mV")));
            return null;
        }

        return v;
    }
}
