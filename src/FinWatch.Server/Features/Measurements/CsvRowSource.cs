using System.Runtime.CompilerServices;
using FinWatch.Server.Infrastructure;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Server.Features.Measurements;

/// <summary>Reads an ingest CSV: checks the header against <see cref="IngestColumns"/>, then yields the data rows.</summary>
public static class CsvRowSource
{
    /// <exception cref="IngestFormatException">The header is unusable or the file stops being CSV.</exception>
    public static async IAsyncEnumerable<RawRow> ReadAsync(Stream stream, [EnumeratorCancellation] CancellationToken cancellationToken)
    {
        using var csv = new CsvRecordReader(stream);
        var fields = new List<string>(IngestColumns.Count);
        if (!await ReadAsync(csv, fields, cancellationToken))
        {
            throw new IngestFormatException(RowError.For(1, null, null,
                $"the file is empty; expected a header row: {string.Join(',', IngestColumns.Names)}"));
        }

        var map = MapHeader(fields);
        var any = false;
        while (await ReadAsync(csv, fields, cancellationToken))
        {
            any = true;
            var cells = new string?[IngestColumns.Count];
            List<RowError>? problems = null;
            if (fields.Count != map.Length)
            {
                problems = [RowError.For(csv.Records, null, null,
                    $"the row has {fields.Count} fields but the header has {map.Length} (is a comma missing, or the line cut short?)")];
            }

            for (var i = 0; i < Math.Min(fields.Count, map.Length); i++)
            {
                var text = fields[i].Trim();
                cells[(int)map[i]] = text.Length == 0 ? null : text;
            }

            yield return new RawRow(csv.Records, csv.RecordLine, cells, problems);
        }

        if (!any)
        {
            throw new IngestFormatException(RowError.For(1, null, null, "the file has a header row but no data rows"));
        }
    }

    private static async ValueTask<bool> ReadAsync(CsvRecordReader csv, List<string> fields, CancellationToken cancellationToken)
    {
        try
        {
            return await csv.ReadRecordAsync(fields, cancellationToken);
        }
        catch (CsvFormatException e)
        {
            throw new IngestFormatException(RowError.For(e.Row, null, null, $"{e.Message} (line {e.Line})"));
        }
        catch (InvalidDataException e)
        {
            // The upload around the file is broken (MultipartFileStream): reported at the record being read.
            throw new IngestFormatException(RowError.For(Math.Max(csv.Records, 1), null, null, e.Message));
        }
    }

    private static IngestColumn[] MapHeader(List<string> header)
    {
        var errors = new List<RowError>();
        var map = new IngestColumn[header.Count];
        var seen = new HashSet<IngestColumn>();
        for (var i = 0; i < header.Count; i++)
        {
            var name = header[i].Trim();
            if (!IngestColumns.TryParse(name.ToLowerInvariant(), out var column))
            {
                errors.Add(RowError.For(1, name, name, UnknownColumnReason(name)));
                continue;
            }

            if (!seen.Add(column))
            {
                errors.Add(RowError.For(1, name, name, "the column appears twice in the header"));
            }

            map[i] = column;
        }

        foreach (var required in IngestColumns.Required)
        {
            if (!seen.Contains(required))
            {
                errors.Add(RowError.For(1, IngestColumns.NameOf(required), null, "a required column is missing from the header"));
            }
        }

        if (!IngestColumns.Values.Any(seen.Contains))
        {
            errors.Add(RowError.For(1, null, null,
                "the header has no value column; expected at least one of " + string.Join(", ", IngestColumns.Values.Select(IngestColumns.NameOf))));
        }

        if (errors.Count > 0)
        {
            throw new IngestHeaderException(errors);
        }

        return map;
    }

    private static string UnknownColumnReason(string name)
    {
        foreach (var delimiter in new[] { ';', '\t', '|' })
        {
            if (name.Contains(delimiter, StringComparison.Ordinal))
            {
                var shown = delimiter == '\t' ? "tab" : $"'{delimiter}'";
                return $"unknown column; the file seems to be separated by {shown}, but FinWatch reads comma-separated files";
            }
        }

        return "unknown column; expected one of " + string.Join(", ", IngestColumns.Names);
    }
}
