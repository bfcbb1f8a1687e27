using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;
using Sylvan.Data.Csv;
using static FinWatch.Server.Infrastructure.Csv.CsvRecordReader;
using CsvFormatException = FinWatch.Server.Infrastructure.Csv.CsvFormatException;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Benchmarks;

/// <summary>
/// <see cref="CsvRecordReader"/>'s contract on Sylvan.Data.Csv, for the CSV benchmark's comparison (docs/performance.md,
/// CSV reading): the library splits the records (standard style, a buffer that never grows) and this class adds what
/// it leaves open: line numbers, skipped blank lines, the record limit, a quote inside an unquoted field and invalid
/// UTF-8 as errors. It passed the server's test suite in place of the hand-written reader, yet reports some malformed
/// files differently, so FinWatch keeps its own reader.
/// </summary>
public sealed class SylvanCsvRecordReader : IDisposable
{
    // The same decoding as CsvRecordReader's: invalid byte sequences become U+FFFF (InvalidUtf8), reported where they are.
    private readonly StreamReader text;
    private readonly LeadingBlankLines input;

    // The library's buffer, ours so that an error's line can be found in the record it stopped in: room for the longest
    // record, its CR LF and the character after a CR. It never grows.
    private readonly char[] buffer = new char[MaxRecordChars + 3];
    private CsvDataReader? csv;
    private long line = 1;

    // Where the next record starts in the buffer, as long as the library has not read more text since (a refill moves
    // the unfinished record to the buffer's start).
    private int nextStart;
    private int reads;

    public SylvanCsvRecordReader(Stream stream)
    {
        text = new StreamReader(stream, MarkingUtf8, detectEncodingFromByteOrderMarks: true, bufferSize: 64 * 1024, leaveOpen: true);
        input = new LeadingBlankLines(text);
    }

    /// <summary>Number of records returned so far (the header is record 1).</summary>
    public int Records { get; private set; }

    /// <summary>Line on which the record most recently returned starts.</summary>
    public long RecordLine { get; private set; }

    /// <summary>Reads the next record's fields into <paramref name="fields"/>; false at end of input. Blank lines are skipped.</summary>
    /// <exception cref="CsvFormatException">The input is not valid CSV or not valid UTF-8.</exception>
    public async ValueTask<bool> ReadRecordAsync(List<string> fields, CancellationToken cancellationToken)
    {
        fields.Clear();
        input.Token = cancellationToken;
        try
        {
            reads = input.Reads;
            if (csv is null)
            {
                csv = await CsvDataReader.CreateAsync(input, buffer, Options(), cancellationToken);
                line += input.Lines;
            }

            while (await csv.ReadAsync(cancellationToken))
            {
                var raw = csv.GetRawRecordSpan();
                nextStart = EndInBuffer(raw);
                reads = input.Reads;
                var content = raw[..^LineEndLength(raw)];
                if (content.IsEmpty)
                {
                    // A blank line: the library gives it as a record of one empty field.
                    line++;
                    continue;
                }

                Records++;
                RecordLine = line;
                Check(content);
                line += LineBreaks(raw);
                for (var i = 0; i < csv.RowFieldCount; i++)
                {
                    fields.Add(csv.GetString(i));
                }

                return true;
            }

            if (input.SawInvalidUtf8)
            {
                // Only a last line that starts with it and has no line end gets here: the library drops such a
                // "comment" without calling the handler.
                throw new CsvFormatException(Records + 1, line, NotUtf8);
            }

            return false;
        }
        catch (CsvRecordTooLargeException)
        {
            throw new CsvFormatException(Records + 1, LineInUnfinishedRecord(MaxRecordChars), TooLong);
        }
        catch (CsvInvalidCharacterException e) when (e.InvalidCharacter == '"')
        {
            throw new CsvFormatException(Records + 1, LineInUnfinishedRecord(e.RecordOffset), Unclosed);
        }
        catch (CsvInvalidCharacterException e)
        {
            throw new CsvFormatException(Records + 1, LineInUnfinishedRecord(e.RecordOffset), AfterClosingQuote(e.InvalidCharacter));
        }
    }

    // The line of the character at an offset into the record the library stopped in.
    private long LineInUnfinishedRecord(int offset)
    {
        var start = input.Reads == reads ? nextStart : 0;
        return line + LineBreaks(buffer.AsSpan(start, Math.Clamp(offset, 0, buffer.Length - start)));
    }

    private int EndInBuffer(ReadOnlySpan<char> raw) =>
        (int)(Unsafe.ByteOffset(ref buffer[0], ref MemoryMarshal.GetReference(raw)) / sizeof(char)) + raw.Length;

    private CsvDataReaderOptions Options() => new()
    {
        HasHeaders = false,
        Delimiter = ',',
        CsvStyle = CsvStyle.Standard,
        BufferSize = buffer.Length,
        MaxBufferSize = buffer.Length,
        OwnsReader = false,
        // The library takes a line starting with its comment character as a comment and cannot be told there is none;
        // the invalid-UTF-8 mark is that character, and such a line is the error it is.
        Comment = InvalidUtf8,
        CommentHandler = new InvalidUtf8AtLineStart(this),
    };

    // The limit, invalid UTF-8 and a quote in an unquoted field, whichever comes first in the record, as the file is read.
    private void Check(ReadOnlySpan<char> content)
    {
        var tooLong = content.Length > MaxRecordChars ? MaxRecordChars : -1;
        var invalid = content.IndexOf(InvalidUtf8);
        var quote = content.Contains('"') ? StrayQuote(content) : -1;
        var first = int.MaxValue;
        string? message = null;
        foreach (var (at, reason) in new[] { (tooLong, TooLong), (invalid, NotUtf8), (quote, QuoteInUnquoted) })
        {
            if (at >= 0 && at < first)
            {
                (first, message) = (at, reason);
            }
        }

        if (message is not null)
        {
            throw new CsvFormatException(Records, line + LineBreaks(content[..first]), message);
        }
    }

    // The position of a quote inside an unquoted field, or -1. Quoted fields are well formed here: the library refuses
    // anything else after a closing quote.
    private static int StrayQuote(ReadOnlySpan<char> content)
    {
        var i = 0;
        while (i < content.Length)
        {
            if (content[i] == '"')
            {
                i++;
                while (i < content.Length)
                {
                    var close = content[i..].IndexOf('"');
                    if (close < 0)
                    {
                        return -1;
                    }

                    i += close + 1;
                    if (i < content.Length && content[i] == '"')
                    {
                        i++;
                        continue;
                    }

                    break;
                }
            }
            else
            {
                var end = content[i..].IndexOf(',');
                var field = end < 0 ? content[i..] : content[i..(i + end)];
                var stray = field.IndexOf('"');
                if (stray >= 0)
                {
                    return i + stray;
                }

                i += field.Length;
            }

            i++; // the comma
        }

        return -1;
    }

    private static int LineEndLength(ReadOnlySpan<char> raw) =>
        raw.EndsWith("\r\n") ? 2 : raw.Length > 0 && raw[^1] is '\r' or '\n' ? 1 : 0;

    // Line breaks in the text: CR LF, LF or CR each count once.
    private static long LineBreaks(ReadOnlySpan<char> text)
    {
        long n = 0;
        int i;
        while ((i = text.IndexOfAny('\r', '\n')) >= 0)
        {
            n++;
            text = text[(i + (text[i] == '\r' && i + 1 < text.Length && text[i + 1] == '\n' ? 2 : 1))..];
        }

        return n;
    }

    public void Dispose()
    {
        csv?.Dispose();
        text.Dispose();
    }

    private sealed class InvalidUtf8AtLineStart(SylvanCsvRecordReader owner) : CommentHandler
    {
        public override void HandleComment(CsvDataReader reader, string comment) =>
            // While the library starts, the blank lines before the first record are not yet counted in.
            throw new CsvFormatException(owner.Records + 1, owner.line + (owner.csv is null ? owner.input.Lines : 0), NotUtf8);
    }

    /// <summary>
    /// Passes the text on without the blank lines at its start, counting them: the library drops them unseen, and the
    /// lines of the rest must still be numbered as in the file.
    /// </summary>
    private sealed class LeadingBlankLines(TextReader inner) : TextReader
    {
        private bool started;
        private bool afterCr;

        /// <summary>Blank lines removed from the start.</summary>
        public long Lines { get; private set; }

        /// <summary>Reads from the text so far.</summary>
        public int Reads { get; private set; }

        /// <summary>Whether an invalid-UTF-8 mark has been handed on.</summary>
        public bool SawInvalidUtf8 { get; private set; }

        /// <summary>Cancels reads the library starts without a token.</summary>
        public CancellationToken Token { get; set; }

        public override async ValueTask<int> ReadAsync(Memory<char> buffer, CancellationToken cancellationToken = default)
        {
            while (true)
            {
                var n = await inner.ReadAsync(buffer, cancellationToken.CanBeCanceled ? cancellationToken : Token);
                Reads++;
                Watch(buffer.Span[..n]);
                if (started || n == 0)
                {
                    return n;
                }

                n = Strip(buffer.Span[..n]);
                if (n > 0)
                {
                    return n;
                }
            }
        }

        public override Task<int> ReadAsync(char[] buffer, int index, int count) => ReadAsync(buffer.AsMemory(index, count)).AsTask();

        public override int Read(Span<char> buffer)
        {
            while (true)
            {
                var n = inner.Read(buffer);
                Reads++;
                Watch(buffer[..n]);
                if (started || n == 0)
                {
                    return n;
                }

                n = Strip(buffer[..n]);
                if (n > 0)
                {
                    return n;
                }
            }
        }

        public override int Read(char[] buffer, int index, int count) => Read(buffer.AsSpan(index, count));

        private void Watch(ReadOnlySpan<char> chunk) => SawInvalidUtf8 |= chunk.Contains(InvalidUtf8);

        // Counts and removes leading line ends (CR LF once, even across two reads); returns what is left.
        private int Strip(Span<char> chunk)
        {
            var i = 0;
            for (; i < chunk.Length && chunk[i] is '\r' or '\n'; i++)
            {
                if (chunk[i] == '\r' || !afterCr)
                {
                    Lines++;
                }

                afterCr = chunk[i] == '\r';
            }

            if (i == chunk.Length)
            {
                return 0;
            }

            started = true;
            chunk[i..].CopyTo(chunk);
            return chunk.Length - i;
        }
    }
}
