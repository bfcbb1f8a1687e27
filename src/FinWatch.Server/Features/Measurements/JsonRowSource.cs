using System.Globalization;
using System.Runtime.CompilerServices;
using System.Text.Json;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// Reads a JSON ingest batch: a top-level array of objects whose property names are the CSV column names.
/// Elements are deserialised one at a time, so the batch is never held in memory whole.
/// </summary>
public static class JsonRowSource
{
    /// <exception cref="IngestFormatException">The body is not a JSON array of objects.</exception>
    public static async IAsyncEnumerable<RawRow> ReadAsync(Stream stream, [EnumeratorCancellation] CancellationToken cancellationToken)
    {
        var row = 0;
        await using var e = Elements(stream, cancellationToken).GetAsyncEnumerator(cancellationToken);
        while (true)
        {
            JsonElement element;
            try
            {
                if (!await e.MoveNextAsync())
                {
                    break;
                }

                element = e.Current;
            }
            catch (JsonException ex)
            {
                var where = ex.LineNumber is { } l ? $" (line {l + 1}, byte {ex.BytePositionInLine + 1})" : "";
                throw new IngestFormatException(RowError.For(row + 1, null, null,
                    $"the body is not valid JSON{where}; expected an array of measurement objects"));
            }

            row++;
            yield return SafeToRow(row, element);
        }

        if (row == 0)
        {
            throw new IngestFormatException(RowError.For(1, null, null, "the batch contains no measurements"));
        }
    }

    private static async IAsyncEnumerable<JsonElement> Elements(Stream stream, [EnumeratorCancellation] CancellationToken cancellationToken)
    {
        await foreach (var element in JsonSerializer.DeserializeAsyncEnumerable<JsonElement>(stream, cancellationToken: cancellationToken))
        {
            yield return element;
        }
    }

    private static RawRow SafeToRow(int row, JsonElement element)
    {
        try
        {
            return ToRow(row, element);
        }
        catch (InvalidOperationException)
        {
            // A property name that is not valid UTF-8 fails when it is transcoded.
            return new RawRow(row, 0, new string?[IngestColumns.Count], [RowError.For(row, null, null, "the object contains text that is not valid UTF-8")]);
        }
    }

    private static RawRow ToRow(int row, JsonElement element)
    {
        var cells = new string?[IngestColumns.Count];
        if (element.ValueKind != JsonValueKind.Object)
        {
            return new RawRow(row, 0, cells, [RowError.For(row, null, element.GetRawText(), "each element must be a JSON object")]);
        }

        List<RowError>? problems = null;
        var seen = new bool[IngestColumns.Count];
        foreach (var property in element.EnumerateObject())
        {
            if (!IngestColumns.TryParse(property.Name, out var column))
            {
                (problems ??= []).Add(RowError.For(row, property.Name, property.Value.GetRawText(),
                    "unknown field; expected one of " + string.Join(", ", IngestColumns.Names)));
                continue;
            }

            if (seen[(int)column])
            {
                (problems ??= []).Add(RowError.For(row, property.Name, null, "the field appears twice"));
            }

            seen[(int)column] = true;
            var value = property.Value;
            switch (value.ValueKind)
            {
                case JsonValueKind.String when TryGetString(value) is { } text:
                    cells[(int)column] = text.Length == 0 ? null : text;
                    break;
                case JsonValueKind.String:
                    (problems ??= []).Add(RowError.For(row, property.Name, null, "the text is not valid UTF-8"));
                    break;
                case JsonValueKind.Number:
                    cells[(int)column] = value.GetRawText();
                    break;
                case JsonValueKind.Null:
                    break;
                default:
                    (problems ??= []).Add(RowError.For(row, property.Name, value.GetRawText(),
                        string.Create(CultureInfo.InvariantCulture, $"expected a number or text, found {value.ValueKind.ToString().ToLowerInvariant()}")));
                    break;
            }
        }

        foreach (var required in IngestColumns.Required)
        {
            if (!seen[(int)required])
            {
                (problems ??= []).Add(RowError.For(row, IngestColumns.NameOf(required), null, "a required field is missing"));
            }
        }

        return new RawRow(row, 0, cells, problems);
    }

    // The reader checks UTF-8 of string values only when they are transcoded.
    private static string? TryGetString(JsonElement value)
    {
        try
        {
            return value.GetString()!.Trim();
        }
        catch (InvalidOperationException)
        {
            return null;
        }
    }
}
