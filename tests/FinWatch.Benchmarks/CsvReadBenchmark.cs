using System.Diagnostics;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Benchmarks;

/// <summary>
/// Parse-only throughput of the two CSV readers on the ingest benchmark's invented file: FinWatch's hand-written
/// <see cref="CsvRecordReader"/> and <see cref="SylvanCsvRecordReader"/> on Sylvan.Data.Csv. Each round reads the
/// whole file through one reader, then the other, so that the load of a shared machine falls on both alike; an untimed
/// first pass checks that both give the same records, field by field.
/// </summary>
public static class CsvReadBenchmark
{
    private sealed record Reader(string Name, Func<Stream, CancellationToken, IAsyncEnumerable<List<string>>> Records);

    public static async Task<int> RunAsync(int rows, int rounds)
    {
        var work = Directory.CreateTempSubdirectory("finwatch-bench-").FullName;
        try
        {
            Console.WriteLine($"Generating {rows:N0} invented demo rows…");
            var path = Path.Combine(work, "rows.csv");
            IngestBenchmark.WriteDemoCsv(path, rows);
            Console.WriteLine($"CSV: {new FileInfo(path).Length / 1e6:0.0} MB; {rounds} rounds, the readers alternating");
            Reader[] readers =
            [
                new("hand-written", HandWritten),
                new("Sylvan.Data.Csv", Library),
            ];

            var checksums = new List<long>();
            foreach (var reader in readers)
            {
                var (records, checksum) = await ReadAsync(path, reader, hash: true);
                if (records != rows + 1)
                {
                    throw new InvalidOperationException($"{reader.Name} read {records} records, expected {rows + 1}");
                }

                checksums.Add(checksum);
            }

            if (checksums.Distinct().Count() != 1)
            {
                throw new InvalidOperationException("the readers disagree about the file's fields");
            }

            Console.WriteLine("Both readers give the same records, field by field.");
            var seconds = readers.ToDictionary(r => r.Name, _ => new List<double>());
            for (var round = 1; round <= rounds; round++)
            {
                foreach (var reader in round % 2 == 1 ? readers : readers.Reverse())
                {
                    var sw = Stopwatch.StartNew();
                    await ReadAsync(path, reader, hash: false);
                    seconds[reader.Name].Add(sw.Elapsed.TotalSeconds);
                    Console.WriteLine($"  round {round}, {reader.Name}: {rows / sw.Elapsed.TotalSeconds:N0} rows/s");
                }
            }

            var median = new Dictionary<string, double>();
            foreach (var reader in readers)
            {
                var s = seconds[reader.Name].Order().ToList();
                median[reader.Name] = rows / Median(s);
                Console.WriteLine($"{reader.Name}: median {median[reader.Name]:N0} rows/s, best {rows / s[0]:N0} rows/s, slowest {rows / s[^1]:N0} rows/s");
            }

            Console.WriteLine($"Ratio of medians, Sylvan.Data.Csv / hand-written: {median["Sylvan.Data.Csv"] / median["hand-written"]:0.00}");
            return 0;
        }
        finally
        {
            Directory.Delete(work, recursive: true);
        }
    }

    private static double Median(List<double> sorted) =>
        sorted.Count % 2 == 1 ? sorted[sorted.Count / 2] : (sorted[(sorted.Count / 2) - 1] + sorted[sorted.Count / 2]) / 2;

    // Records and a checksum of every field (only when asked: hashing is no part of parsing).
    private static async Task<(long Records, long Checksum)> ReadAsync(string path, Reader reader, bool hash)
    {
        await using var file = new FileStream(path, FileMode.Open, FileAccess.Read, FileShare.Read, 1 << 16, FileOptions.Asynchronous | FileOptions.SequentialScan);
        long records = 0, checksum = 0;
        await foreach (var fields in reader.Records(file, CancellationToken.None))
        {
            records++;
            checksum = (checksum * 31) + fields.Count;
            if (hash)
            {
                foreach (var field in fields)
                {
                    checksum = (checksum * 31) + string.GetHashCode(field, StringComparison.Ordinal);
                }
            }
        }

        return (records, checksum);
    }

    private static async IAsyncEnumerable<List<string>> HandWritten(Stream stream, [System.Runtime.CompilerServices.EnumeratorCancellation] CancellationToken cancellationToken)
    {
        using var csv = new CsvRecordReader(stream);
        var fields = new List<string>();
        while (await csv.ReadRecordAsync(fields, cancellationToken))
        {
            yield return fields;
        }
    }

    private static async IAsyncEnumerable<List<string>> Library(Stream stream, [System.Runtime.CompilerServices.EnumeratorCancellation] CancellationToken cancellationToken)
    {
        using var csv = new SylvanCsvRecordReader(stream);
        var fields = new List<string>();
        while (await csv.ReadRecordAsync(fields, cancellationToken))
        {
            yield return fields;
        }
    }
}
