using System.Text;
using FinWatch.Testing;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Benchmarks;

/// <summary>
/// Reads random malformed and well-formed inputs through <see cref="CsvRecordReader"/> and
/// <see cref="SylvanCsvRecordReader"/> and counts where the outcomes differ: the records (row, line, fields) and the
/// error (row, line, message). The inputs are made of commas, quotes, doubled quotes, CR, LF, CR LF, invalid UTF-8
/// bytes, a BOM and now and then a record near the length limit; a third of them arrive a few bytes per read.
/// </summary>
public static class CsvAgreement
{
    private static readonly string[] Pieces =
        ["a", "bc", "1.5", ",", ",", ",", "\"", "\"\"", "\r", "\n", "\r\n", "\n", " ", "é", "\uFFFF", "x\"y", "\"q,\r\n\"", "#"];

    public static async Task<int> RunAsync(int cases, int seed)
    {
        var random = new Random(seed);
        var differ = 0;
        var kinds = new Dictionary<string, int>();
        for (var n = 0; n < cases; n++)
        {
            var input = Input(random);
            var chunk = random.Next(3) == 0 ? random.Next(1, 8) : int.MaxValue;
            var ours = await OutcomeAsync(input, chunk, s => new CsvRecordReader(s), (r, f) => r.ReadRecordAsync(f, default), r => (r.Records, r.RecordLine));
            var theirs = await OutcomeAsync(input, chunk, s => new SylvanCsvRecordReader(s), (r, f) => r.ReadRecordAsync(f, default), r => (r.Records, r.RecordLine));
            if (ours != theirs)
            {
                differ++;
                var kind = $"{Last(ours)}  |  {Last(theirs)}";
                kinds[kind] = kinds.GetValueOrDefault(kind) + 1;
                if (differ <= 5)
                {
                    Console.WriteLine($"input {Show(Encoding.UTF8.GetString(input))}, {(chunk < int.MaxValue ? $"{chunk} bytes per read" : "one read")}");
                    Console.WriteLine($"  hand-written:    {Show(ours)}");
                    Console.WriteLine($"  Sylvan.Data.Csv: {Show(theirs)}");
                }
            }
        }

        Console.WriteLine($"{differ:N0} of {cases:N0} inputs read differently (seed {seed}); by outcome, hand-written | Sylvan.Data.Csv:");
        foreach (var (kind, count) in kinds.OrderByDescending(k => k.Value).Take(15))
        {
            Console.WriteLine($"  {count,5}  {Show(kind)}");
        }

        return 0;
    }

    private static byte[] Input(Random random)
    {
        var text = new StringBuilder();
        for (var i = random.Next(0, 40); i > 0; i--)
        {
            text.Append(Pieces[random.Next(Pieces.Length)]);
        }

        if (random.Next(20) == 0)
        {
            text.Append('z', CsvRecordReader.MaxRecordChars - 5 + random.Next(10));
            for (var i = random.Next(0, 20); i > 0; i--)
            {
                text.Append(Pieces[random.Next(Pieces.Length)]);
            }
        }

        var bytes = new List<byte>();
        if (random.Next(4) == 0)
        {
            bytes.AddRange(Encoding.UTF8.GetPreamble());
        }

        foreach (var rune in text.ToString().EnumerateRunes())
        {
            // U+FFFF stands for an invalid byte: a lone 0xFF or a truncated two-byte sequence.
            bytes.AddRange(rune.Value == CsvRecordReader.InvalidUtf8 ? [random.Next(2) == 0 ? (byte)0xFF : (byte)0xC3] : Encoding.UTF8.GetBytes(rune.ToString()));
        }

        return [.. bytes];
    }

    private static async Task<string> OutcomeAsync<T>(byte[] input, int chunk, Func<Stream, T> open, Func<T, List<string>, ValueTask<bool>> next, Func<T, (int Row, long Line)> at)
        where T : IDisposable
    {
        var outcome = new StringBuilder();
        try
        {
            using var reader = open(new TrickleStream(input, chunk));
            var fields = new List<string>();
            while (await next(reader, fields))
            {
                var (row, line) = at(reader);
                outcome.Append($"row {row} line {line} [{string.Join('|', fields)}]\n");
            }

            outcome.Append("end");
        }
        catch (CsvFormatException e)
        {
            outcome.Append($"row {e.Row} line {e.Line}: {e.Message}");
        }

        return outcome.ToString();
    }

    private static string Last(string outcome) => outcome[(outcome.LastIndexOf('\n') + 1)..];

    private static string Show(string text)
    {
        var shown = text.Replace("\r", "\\r", StringComparison.Ordinal).Replace("\n", "\\n", StringComparison.Ordinal)
            .Replace("\uFFFF", "<invalid>", StringComparison.Ordinal).Replace("\uFFFD", "<invalid>", StringComparison.Ordinal);
        return shown.Length > 200 ? shown[..200] + "…" : shown;
    }
}
