using FinWatch.Testing;

namespace FinWatch.Server.Tests.Faults;

/// <summary>
/// A large inbox file under ingest when the server stops, by SIGKILL or by a graceful stop (SIGTERM). Expected values:
/// the inbox contract (README, Inbox folder: a file is moved to processed/ once ingested; a batch is all or nothing;
/// a re-sent row is "already present", never stored twice) gives "every row of the file stored exactly once, the file
/// in processed/"; PRAGMA integrity_check = "ok" is SQLite's documented answer for a sound file.
/// </summary>
[Collection(ServerProcessCollection.Name)]
public sealed class InboxRestartTests : IDisposable
{
    private const string FileName = "lots-2026-11.csv";
    private readonly string work = FaultSupport.WorkFolder();

    public void Dispose() => FaultSupport.DeleteWorkFolder(work);

    [Fact]
    public Task Inbox_SigkillMidFile_EveryRowStoredOnceAfterRestartAndFileProcessed() =>
        StopMidFileThenRestartAsync(async server =>
        {
            await server.KillAsync();
        });

    [Fact]
    public Task Inbox_GracefulStopMidFile_EveryRowStoredOnceAfterRestartAndFileProcessed() =>
        StopMidFileThenRestartAsync(async server =>
        {
            Assert.Equal(0, await server.StopAsync(TimeSpan.FromSeconds(60)));
        });

    private async Task StopMidFileThenRestartAsync(Func<ServerProcess, Task> stop)
    {
        var database = Path.Combine(work, "finwatch.db");
        var inbox = Path.Combine(work, "inbox");
        var staged = Path.Combine(work, "staged.csv");
        var lots = DemoProducts.WriteCsv(staged, days: 15);
        var rows = lots.Values.Sum();
        string[] settings = ["--FinWatch:Ingest:InboxPath", inbox, "--FinWatch:Ingest:InboxPollSeconds", "1"];
        var inInbox = Path.Combine(inbox, FileName);
        var processed = Path.Combine(inbox, "processed", FileName);

        await using (var server = await ServerProcess.StartAsync(database, settings))
        {
            using (var http = server.CreateClient())
            {
                using (var admin = await server.CreateAdminClientAsync()) // products need an engineer; the tool key only ingests
                {
                    await DemoProducts.CreateAsync(admin);
                }
            }

            var walBefore = FaultSupport.WalBytes(database);
            File.Move(staged, inInbox); // complete under its final name, as the README asks
            await FaultSupport.WaitForWalGrowthAsync(database, walBefore, 4 << 20, () => File.Exists(processed), () => server.Output);
            await stop(server);
        }

        Assert.True(File.Exists(inInbox), "the file under ingest must stay in the inbox when the server stops");
        Assert.False(File.Exists(processed));
        Assert.Empty(Directory.EnumerateFiles(Path.Combine(inbox, "rejected")));

        await using (var restarted = await ServerProcess.StartAsync(database, settings))
        {
            await FaultSupport.WaitUntilAsync(() => File.Exists(processed) || Directory.EnumerateFiles(Path.Combine(inbox, "rejected")).Any(),
                TimeSpan.FromSeconds(120), () => restarted.Output);
            Assert.True(File.Exists(processed), restarted.Output);
            Assert.False(File.Exists(inInbox));
            Assert.Empty(Directory.EnumerateFiles(Path.Combine(inbox, "rejected")));

            Assert.Equal("ok", FaultSupport.IntegrityCheck(database));
            Assert.Equal(lots, FaultSupport.LotCounts(database));
            Assert.Equal(rows, FaultSupport.Scalar(database, "SELECT COUNT(*) FROM measurements"));

            // One committed batch for the file (the interrupted one left no record), which stored every row.
            Assert.Equal(1, FaultSupport.Scalar(database, "SELECT COUNT(*) FROM ingest_batches"));
            Assert.Equal(rows, FaultSupport.Scalar(database, "SELECT inserted FROM ingest_batches WHERE source = 'inbox'"));
        }
    }
}
