using System.Net;
using System.Net.Http.Headers;
using System.Text;
using FinWatch.Testing;
using Microsoft.Data.Sqlite;

namespace FinWatch.Server.Tests.Faults;

/// <summary>Helpers of the process fault tests: a work folder, direct reads of the SQLite file, uploads that can be watched and held.</summary>
internal static class FaultSupport
{
    public static string WorkFolder() => Directory.CreateTempSubdirectory("finwatch-faults-").FullName;

    public static void DeleteWorkFolder(string folder)
    {
        SqliteConnection.ClearAllPools();
        try
        {
            Directory.Delete(folder, recursive: true);
        }
        catch (IOException)
        {
            // A file of a process that is still exiting; the temp folder is cleaned by the OS later.
        }
    }

    /// <summary>SQLite's own verdict on the file: "ok" when it is sound (SQLite documentation, PRAGMA integrity_check).</summary>
    public static string IntegrityCheck(string database)
    {
        using var connection = Open(database);
        using var cmd = connection.CreateCommand();
        cmd.CommandText = "PRAGMA integrity_check";
        using var reader = cmd.ExecuteReader();
        var lines = new List<string>();
        while (reader.Read())
        {
            lines.Add(reader.GetString(0));
        }

        return string.Join('\n', lines);
    }

    /// <summary>Stored measurement rows per lot.</summary>
    public static Dictionary<string, int> LotCounts(string database)
    {
        using var connection = Open(database);
        using var cmd = connection.CreateCommand();
        cmd.CommandText = "SELECT lot_id, COUNT(*) FROM measurements GROUP BY lot_id";
        using var reader = cmd.ExecuteReader();
        var counts = new Dictionary<string, int>(StringComparer.Ordinal);
        while (reader.Read())
        {
            counts[reader.GetString(0)] = reader.GetInt32(1);
        }

        return counts;
    }

    public static long Scalar(string database, string sql)
    {
        using var connection = Open(database);
        using var cmd = connection.CreateCommand();
        cmd.CommandText = sql;
        return (long)cmd.ExecuteScalar()!;
    }

    private static SqliteConnection Open(string database)
    {
        var connection = new SqliteConnection(new SqliteConnectionStringBuilder
        {
            DataSource = database, Mode = SqliteOpenMode.ReadWrite, Pooling = false, DefaultTimeout = 30,
        }.ToString());
        connection.Open();
        return connection;
    }

    public static long WalBytes(string database) => File.Exists(database + "-wal") ? new FileInfo(database + "-wal").Length : 0;

    /// <summary>Waits until the write-ahead log has grown by <paramref name="bytes"/> over <paramref name="before"/>: rows of an open ingest transaction are being written.</summary>
    public static async Task WaitForWalGrowthAsync(string database, long before, long bytes, Func<bool> giveUp, Func<string> diagnostics)
    {
        var deadline = DateTime.UtcNow.AddSeconds(90);
        while (WalBytes(database) < before + bytes)
        {
            if (giveUp() || DateTime.UtcNow > deadline)
            {
                Assert.Fail($"the ingest did not reach the point of the fault (WAL {WalBytes(database)} bytes, before {before}):\n{diagnostics()}");
            }

            await Task.Delay(20);
        }
    }

    public static async Task WaitUntilAsync(Func<bool> condition, TimeSpan timeout, Func<string> diagnostics)
    {
        var deadline = DateTime.UtcNow + timeout;
        while (!condition())
        {
            if (DateTime.UtcNow > deadline)
            {
                Assert.Fail("timed out:\n" + diagnostics());
            }

            await Task.Delay(50);
        }
    }

    /// <summary>Posts a small CSV batch; returns the stored row count if it was accepted (200), else null.</summary>
    public static async Task<int?> PostSmallBatchAsync(HttpClient http, string csv)
    {
        using var content = new StringContent(csv, Encoding.UTF8);
        content.Headers.ContentType = new MediaTypeHeaderValue("text/csv");
        using var response = await http.PostAsync(new Uri("/api/measurements/csv", UriKind.Relative), content);
        if (response.StatusCode != HttpStatusCode.OK)
        {
            return null;
        }

        using var body = System.Text.Json.JsonDocument.Parse(await response.Content.ReadAsStringAsync());
        return body.RootElement.GetProperty("inserted").GetInt32();
    }

    /// <summary>One small valid batch: every site of a few wafers of one invented lot.</summary>
    public static string SmallBatch(string lot, int wafers) =>
        SiteRow.Csv(SiteRow.Wafers(lot, wafers, sites: 9, new DateTimeOffset(2026, 11, 25, 6, 0, 0, TimeSpan.Zero)));

    public static Task<HttpResponseMessage> UploadAsync(HttpClient http, HeldFileContent content) =>
        http.PostAsync(new Uri("/api/measurements/csv", UriKind.Relative), content);
}

/// <summary>
/// A file sent as a text/csv request body in 64 KiB pieces; with a hold position, it stops sending there until
/// <see cref="Release"/> is called, so the server is left inside the batch with its transaction open.
/// </summary>
internal sealed class HeldFileContent : HttpContent
{
    private readonly string path;
    private readonly long holdAt;
    private readonly TaskCompletionSource release = new(TaskCreationOptions.RunContinuationsAsynchronously);
    private long sent;

    public HeldFileContent(string path, long holdAt = long.MaxValue)
    {
        this.path = path;
        this.holdAt = holdAt;
        Headers.ContentType = new MediaTypeHeaderValue("text/csv");
    }

    public long Sent => Interlocked.Read(ref sent);

    public void Release() => release.TrySetResult();

    protected override async Task SerializeToStreamAsync(Stream stream, TransportContext? context)
    {
        await using var file = File.OpenRead(path);
        var buffer = new byte[64 * 1024];
        int n;
        while ((n = await file.ReadAsync(buffer)) > 0)
        {
            if (Sent >= holdAt)
            {
                await stream.FlushAsync();
                await release.Task;
            }

            await stream.WriteAsync(buffer.AsMemory(0, n));
            Interlocked.Add(ref sent, n);
        }
    }

    protected override bool TryComputeLength(out long length)
    {
        length = new FileInfo(path).Length;
        return true;
    }
}
