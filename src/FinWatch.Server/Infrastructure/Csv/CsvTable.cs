namespace FinWatch.Server.Infrastructure.Csv;

/// <summary>
/// A small uploaded CSV table with a header row (columns in any order, names matched without regard to case): the
/// header is checked against the known columns, then each data row is handed over with a lookup of its trimmed cells.
/// Every problem is a <see cref="RowError"/> with its row (the header is row 1), column and value, so the caller can
/// refuse the whole file at once. Electrical tests for calibration and maintenance imports are read this way.
/// </summary>
public static class CsvTable
{
    /// <summary>A data row: its row number and its cells by column name (null for an empty or absent cell).</summary>
    public delegate void RowHandler(int row, Func<string, string?> cell);

    /// <summary>
    /// Reads the whole table. <paramref name="columns"/> are every known column; those not in
    /// <paramref name="optional"/> must be in the header. Returns the number of data rows read; problems of the header,
    /// of row shapes and of the CSV itself are added to <paramref name="errors"/>, and the rows' own checks are left to
    /// <paramref name="onRow"/>.
    /// </summary>
    public static async Task<int> ReadAsync(Stream stream, IReadOnlyList<string> columns, IReadOnlyList<string> optional,
        RowHandler onRow, List<RowError> errors, CancellationToken cancellationToken)
    {
        using var csv = new CsvRecordReader(stream);
        var fields = new List<string>(columns.Count);
        var rows = 0;
        try
        {
            if (!await csv.ReadRecordAsync(fields, cancellationToken))
            {
                errors.Add(RowError.For(1, null, null, $"the file is empty; expected a header row: {string.Join(',', columns.Except(optional))}"));
                return 0;
            }

            var before = errors.Count;
            var map = MapHeader(fields, columns, optional, errors);
            if (errors.Count > before)
            {
                return 0;
            }

            while (await csv.ReadRecordAsync(fields, cancellationToken))
            {
                rows++;
                if (fields.Count != map.Length)
                {
                    errors.Add(RowError.For(csv.Records, null, null, $"the row has {fields.Count} fields but the header has {map.Length}"));
                    continue;
                }

                string? Cell(string column)
                {
                    var i = Array.IndexOf(map, column);
                    var v = i >= 0 ? fields[i].Trim() : "";
                    return v.Length == 0 ? null : v;
                }

                onRow(csv.Records, Cell);
            }
        }
        catch (CsvFormatException e)
        {
            errors.Add(RowError.For(e.Row, null, null, $"{e.Message} (line {e.Line})"));
        }

        if (errors.Count == 0 && rows == 0)
        {
            errors.Add(RowError.For(1, null, null, "the file has a header row but no data rows"));
        }

        return rows;
    }

    private static string[] MapHeader(List<string> header, IReadOnlyList<string> columns, IReadOnlyList<string> optional, List<RowError> errors)
    {
        var map = header.Select(h => h.Trim().ToLowerInvariant()).ToArray();
        for (var i = 0; i < map.Length; i++)
        {
            if (!columns.Contains(map[i]))
            {
                errors.Add(RowError.For(1, header[i], header[i], $"unknown column; the columns are {string.Join(", ", columns)}"));
            }
            else if (Array.IndexOf(map, map[i]) != i)
            {
                errors.Add(RowError.For(1, header[i], header[i], "the column appears twice"));
            }
        }

        foreach (var c in columns.Where(c => !map.Contains(c) && !optional.Contains(c)))
        {
            errors.Add(RowError.For(1, c, null, "the header lacks this required column"));
        }

        return map;
    }
}
