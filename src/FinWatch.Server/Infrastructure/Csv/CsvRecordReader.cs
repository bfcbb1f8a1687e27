using System.Text;

namespace FinWatch.Server.Infrastructure.Csv;

/// <summary>
/// Streaming RFC 4180 reader: comma separated, optional double-quoted fields ("" is a quote inside one),
/// CRLF, LF or CR line ends, UTF-8 with or without BOM. Invalid UTF-8 is an error, not a replacement
/// character, reported with its row and line. Reads through a fixed buffer, so a file of any size is never held in memory.
/// </summary>
public sealed class CsvRecordReader : IDisposable
{
    /// <summary>A longer record is taken as a sign of a wrong file rather than data.</summary>
    public const int MaxRecordChars = 65_536;

    // Invalid byte sequences decode to U+FFFF, a noncharacter that never appears in interchanged text, so the parser can
    // report the row and line where they occur (a throwing decoder fails a whole buffer ahead of the parser).
    internal const char InvalidUtf8 = '\uFFFF';

    internal const string NotUtf8 = "the file is not valid UTF-8 here (an invalid byte sequence); save it as UTF-8";

    internal const string Unclosed = "a quoted field is not closed before the end of the file (is the file truncated?)";

    internal const string QuoteInUnquoted = "a quote inside an unquoted field (quote the whole field and double the quote)";

    internal static readonly string TooLong = $"the row is longer than {MaxRecordChars} characters; this does not look like a FinWatch CSV file";

    internal static readonly Encoding MarkingUtf8 = Encoding.GetEncoding(
        "utf-8", EncoderFallback.ExceptionFallback, new DecoderReplacementFallback(InvalidUtf8.ToString()));

    private readonly TextReader reader;
    private readonly char[] buffer = new char[64 * 1024];
    private readonly StringBuilder field = new(64);
    private int pos;
    private int len;
    private bool eof;
    private long line = 1;
    private int recordChars;

    public CsvRecordReader(Stream stream) =>
        reader = new StreamReader(stream, MarkingUtf8, detectEncodingFromByteOrderMarks: true, bufferSize: 64 * 1024, leaveOpen: true);

    /// <summary>Number of records returned so far (the header is record 1).</summary>
    public int Records { get; private set; }

    /// <summary>Line on which the record most recently returned starts.</summary>
    public long RecordLine { get; private set; }

    /// <summary>Reads the next record's fields into <paramref name="fields"/>; false at end of input. Blank lines are skipped.</summary>
    /// <exception cref="CsvFormatException">The input is not valid CSV or not valid UTF-8.</exception>
    public async ValueTask<bool> ReadRecordAsync(List<string> fields, CancellationToken cancellationToken)
    {
        fields.Clear();
        while (true)
        {
            if (!await EnsureAsync(cancellationToken))
            {
                return false;
            }

            // Skip blank lines between records.
            var c = buffer[pos];
            if (c is '\n' or '\r')
            {
                await ConsumeLineEndAsync(c, cancellationToken);
                continue;
            }

            break;
        }

        RecordLine = line;
        recordChars = 0;
        Records++;
        while (true)
        {
            var endOfRecord = await ReadFieldAsync(cancellationToken);
            fields.Add(field.ToString());
            if (endOfRecord)
            {
                return true;
            }
        }
    }

    /// <summary>Reads one field; returns true when it ended the record.</summary>
    private async ValueTask<bool> ReadFieldAsync(CancellationToken cancellationToken)
    {
        field.Clear();
        if (!await EnsureAsync(cancellationToken))
        {
            return true;
        }

        if (buffer[pos] == '"')
        {
            Take();
            while (true)
            {
                if (!await EnsureAsync(cancellationToken))
                {
                    throw Error(Unclosed);
                }

                var c = Take();
                if (c == '"')
                {
                    if (!await EnsureAsync(cancellationToken))
                    {
                        return true;
                    }

                    var next = buffer[pos];
                    if (next == '"')
                    {
                        Take();
                        field.Append('"');
                        continue;
                    }

                    if (next == ',')
                    {
                        Take();
                        return false;
                    }

                    if (next is '\n' or '\r')
                    {
                        await ConsumeLineEndAsync(next, cancellationToken);
                        return true;
                    }

                    throw Error(AfterClosingQuote(next));
                }

                if (c == '\n' || (c == '\r' && !await PeekIsAsync('\n', cancellationToken)))
                {
                    line++;
                }

                field.Append(c);
            }
        }

        while (true)
        {
            if (!await EnsureAsync(cancellationToken))
            {
                return true;
            }

            var c = buffer[pos];
            if (c == ',')
            {
                Take();
                return false;
            }

            if (c is '\n' or '\r')
            {
                await ConsumeLineEndAsync(c, cancellationToken);
                return true;
            }

            if (c == '"')
            {
                throw Error(QuoteInUnquoted);
            }

            field.Append(Take());
        }
    }

    private char Take()
    {
        if (++recordChars > MaxRecordChars)
        {
            throw Error(TooLong);
        }

        var c = buffer[pos++];
        if (c == InvalidUtf8)
        {
            throw Error(NotUtf8);
        }

        return c;
    }

    // A CR may be the last character read so far (a CRLF split between two reads of a request body arriving in pieces),
    // so the LF is looked for with an asynchronous read: ASP.NET Core refuses synchronous reads of a request body.
    private async ValueTask ConsumeLineEndAsync(char c, CancellationToken cancellationToken)
    {
        pos++;
        if (c == '\r' && await PeekIsAsync('\n', cancellationToken))
        {
            pos++;
        }

        line++;
    }

    private async ValueTask<bool> PeekIsAsync(char expected, CancellationToken cancellationToken) =>
        await EnsureAsync(cancellationToken) && buffer[pos] == expected;

    private async ValueTask<bool> EnsureAsync(CancellationToken cancellationToken)
    {
        if (pos < len)
        {
            return true;
        }

        if (eof)
        {
            return false;
        }

        len = await reader.ReadAsync(buffer.AsMemory(), cancellationToken);

        pos = 0;
        eof = len == 0;
        return !eof;
    }

    private CsvFormatException Error(string message) => new(Math.Max(Records, 1), line, message);

    internal static string AfterClosingQuote(char c) => $"unexpected character '{(char.IsControl(c) ? $"U+{(int)c:X4}" : c.ToString())}' after a closing quote";

    public void Dispose() => reader.Dispose();
}
