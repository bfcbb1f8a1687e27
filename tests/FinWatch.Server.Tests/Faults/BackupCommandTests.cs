using System.Net;
using FinWatch.Server.Infrastructure;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Faults;

/// <summary>
/// <c>FinWatch.Server backup &lt;file&gt;</c>: an online copy through the SQLite backup API. Expected values: the SQLite
/// backup API documentation (the copy is a consistent snapshot of the source, taken while other connections write),
/// PRAGMA integrity_check = "ok" (SQLite documentation), the all-or-nothing batch contract (README), and the
/// command's own refusals (DEVELOPERS.md, server commands).
/// </summary>
[Collection(ServerProcessCollection.Name)]
public sealed class BackupCommandTests : IDisposable
{
    private readonly string work = FaultSupport.WorkFolder();

    public void Dispose() => FaultSupport.DeleteWorkFolder(work);

    [Fact]
    public async Task Backup_WhileServerIngestsLargeCsv_CopyIsSoundAndHoldsEveryEarlierBatch()
    {
        var database = Path.Combine(work, "finwatch.db");
        var csv = Path.Combine(work, "large.csv");
        var largeLots = DemoProducts.WriteCsv(csv, days: 20);
        var target = Path.Combine(work, "finwatch-2026-12-02.db");
        var dbSetting = "--FinWatch:Database:SqlitePath=" + database;

        await using var server = await ServerProcess.StartAsync(database, "--FinWatch:Ingest:InboxEnabled", "false");
        using var http = server.CreateClient();
        using (var admin = await server.CreateAdminClientAsync()) // products need an engineer; the tool key only ingests
        {
            await DemoProducts.CreateAsync(admin);
            await TestProducts.CreateBothAsync(admin);
        }

        var accepted = new Dictionary<string, int>(StringComparer.Ordinal);
        for (var i = 1; i <= 3; i++)
        {
            var lot = $"B{i:0000}";
            accepted[lot] = await FaultSupport.PostSmallBatchAsync(http, FaultSupport.SmallBatch(lot, wafers: i + 1)) ?? 0;
            Assert.Equal((i + 1) * 9, accepted[lot]);
        }

        // The large upload stops sending at 40 % of its body: the server is inside the batch, its write transaction open.
        var walBefore = FaultSupport.WalBytes(database);
        var content = new HeldFileContent(csv, holdAt: new FileInfo(csv).Length * 2 / 5);
        var upload = FaultSupport.UploadAsync(http, content);
        await FaultSupport.WaitForWalGrowthAsync(database, walBefore, 4 << 20, () => upload.IsCompleted, () => server.Output);

        var (code, stdout, stderr) = await ServerProcess.RunCommandAsync(work, "backup", target, dbSetting);
        Assert.False(upload.IsCompleted, "the ingest must still be open while the backup runs");
        content.Release();
        using (var response = await upload)
        {
            Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        }

        Assert.True(code == 0, $"backup exited with {code}: {stdout}{stderr}");
        Assert.Contains(target, stdout, StringComparison.Ordinal);
        Assert.Contains($"{new FileInfo(target).Length} bytes", stdout, StringComparison.Ordinal);
        var pages = FaultSupport.Scalar(target, "PRAGMA page_count");
        Assert.Contains($"{pages} pages", stdout, StringComparison.Ordinal);
        Assert.Equal("ok", FaultSupport.IntegrityCheck(target));
        var copied = FaultSupport.LotCounts(target);
        Assert.Equal(accepted, copied); // every batch accepted before, none of the one still open (a snapshot)

        var early = Path.Combine(work, "finwatch-early.db");
        File.Copy(target, early);

        // The target exists now: refused without --force and left as it was; replaced with it, now with the large batch.
        var (again, _, refusal) = await ServerProcess.RunCommandAsync(work, "backup", target, dbSetting);
        Assert.Equal(ServerCommands.Refused, again);
        Assert.Contains("--force", refusal, StringComparison.Ordinal);
        Assert.Equal(accepted, FaultSupport.LotCounts(target));
        var (forced, forcedOut, forcedErr) = await ServerProcess.RunCommandAsync(work, "backup", target, "--force", dbSetting);
        Assert.True(forced == 0, forcedOut + forcedErr);
        Assert.Equal("ok", FaultSupport.IntegrityCheck(target));
        var replaced = FaultSupport.LotCounts(target);
        Assert.Equal(accepted.Values.Sum() + largeLots.Values.Sum(), replaced.Values.Sum());
        Assert.DoesNotContain(Directory.EnumerateFiles(work), f => f.EndsWith(".partial", StringComparison.Ordinal));

        // Restore as the README says: stop the server, replace the file, remove its -wal and -shm, start.
        Assert.Equal(0, await server.StopAsync(TimeSpan.FromSeconds(60)));
        File.Copy(early, database, overwrite: true);
        File.Delete(database + "-wal");
        File.Delete(database + "-shm");
        await using var restored = await ServerProcess.StartAsync(database, "--FinWatch:Ingest:InboxEnabled", "false");
        using var restoredHttp = restored.CreateClient();
        using var health = await restoredHttp.GetAsync(new Uri("/health", UriKind.Relative));
        Assert.Equal(HttpStatusCode.OK, health.StatusCode);
        Assert.Equal(accepted, FaultSupport.LotCounts(database));
        Assert.Equal("ok", FaultSupport.IntegrityCheck(database));
    }

    [Fact]
    public async Task Backup_TargetFolderMissing_RefusedWithMessageAndNothingWritten()
    {
        var database = await MakeDatabaseAsync();
        var target = Path.Combine(work, "no-such-folder", "copy.db");

        var (code, _, error) = await RunAsync("backup", target, "--FinWatch:Database:SqlitePath=" + database);

        Assert.Equal(ServerCommands.Refused, code);
        Assert.Contains("does not exist", error, StringComparison.Ordinal);
        Assert.False(Directory.Exists(Path.GetDirectoryName(target)));
    }

    [Fact]
    public async Task Backup_TargetExistsWithoutForce_RefusedAndTargetUnchanged()
    {
        var database = await MakeDatabaseAsync();
        var target = Path.Combine(work, "copy.db");
        await File.WriteAllTextAsync(target, "an older file");

        var (code, output, error) = await RunAsync("backup", target, "--FinWatch:Database:SqlitePath=" + database);

        Assert.Equal(ServerCommands.Refused, code);
        Assert.Equal("", output);
        Assert.Contains("exists already; give --force to replace it", error, StringComparison.Ordinal);
        Assert.Equal("an older file", await File.ReadAllTextAsync(target));
    }

    [Fact]
    public async Task Backup_NoDatabaseAtPath_RefusedWithoutCreatingOne()
    {
        var missing = Path.Combine(work, "missing.db");

        var (code, _, error) = await RunAsync("backup", Path.Combine(work, "copy.db"), "--FinWatch:Database:SqlitePath=" + missing);

        Assert.Equal(ServerCommands.Refused, code);
        Assert.Contains("there is no database at " + missing, error, StringComparison.Ordinal);
        Assert.False(File.Exists(missing));
        Assert.False(File.Exists(Path.Combine(work, "copy.db")));
    }

    [Fact]
    public async Task Backup_NoTarget_RefusedWithUsage()
    {
        var (code, _, error) = await RunAsync("backup");

        Assert.Equal(ServerCommands.Refused, code);
        Assert.Contains("the target file is missing", error, StringComparison.Ordinal);
        Assert.Contains("backup <target-file> [--force] [settings]", error, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData]
    [InlineData("--urls", "http://127.0.0.1:0")]
    [InlineData("FinWatch:Demo:Enabled=true")]
    public async Task TryRun_ArgumentsNameNoCommand_ReturnsNullSoTheServerRuns(params string[] args)
    {
        Assert.Null(await ServerCommands.TryRunAsync(args, TextWriter.Null, TextWriter.Null));
    }

    // Any SQLite file: the refusals come before the copy.
    private Task<string> MakeDatabaseAsync()
    {
        var database = Path.Combine(work, "source.db");
        using (var connection = new Microsoft.Data.Sqlite.SqliteConnection($"Data Source={database};Pooling=False"))
        {
            connection.Open();
            using var cmd = connection.CreateCommand();
            cmd.CommandText = "CREATE TABLE t (x INTEGER)";
            cmd.ExecuteNonQuery();
        }

        return Task.FromResult(database);
    }

    private static async Task<(int? Code, string Output, string Error)> RunAsync(params string[] args)
    {
        using var output = new StringWriter();
        using var error = new StringWriter();
        var code = await ServerCommands.TryRunAsync(args, output, error);
        return (code, output.ToString(), error.ToString());
    }
}
