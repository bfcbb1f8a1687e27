using System.Net;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Faults;

/// <summary>
/// SIGKILL of the real server process in the middle of a large CSV ingest. Expected values come from the project's
/// all-or-nothing contract (README, "What ingest answers": an accepted batch is stored whole, any other leaves nothing)
/// and from SQLite's documented answer to a sound file, PRAGMA integrity_check = "ok".
/// </summary>
[Collection(ServerProcessCollection.Name)]
public sealed class ProcessKillTests : IDisposable
{
    private readonly string work = FaultSupport.WorkFolder();

    public void Dispose() => FaultSupport.DeleteWorkFolder(work);

    [Fact]
    public async Task Ingest_SigkillDuringLargeCsv_AcceptedBatchesWholeKilledBatchAbsent()
    {
        var database = Path.Combine(work, "finwatch.db");
        var csv = Path.Combine(work, "large.csv");
        var largeLots = DemoProducts.WriteCsv(csv, days: 30);
        Assert.InRange(largeLots.Values.Sum(), 150_000, 300_000);
        string[] settings = ["--FinWatch:Ingest:InboxEnabled", "false"];

        var accepted = new Dictionary<string, int>(StringComparer.Ordinal);
        var queued = new Dictionary<string, (int Rows, Task<int?> Answer)>(StringComparer.Ordinal);
        await using (var server = await ServerProcess.StartAsync(database, settings))
        {
            using var http = server.CreateClient();
            using (var admin = await server.CreateAdminClientAsync()) // products need an engineer; the tool key only ingests
            {
                await DemoProducts.CreateAsync(admin);
                await TestProducts.CreateBothAsync(admin);
            }

            for (var i = 1; i <= 5; i++)
            {
                var lot = $"K{i:0000}";
                var inserted = await FaultSupport.PostSmallBatchAsync(http, FaultSupport.SmallBatch(lot, wafers: i));
                Assert.True(inserted == i * 9, $"small batch {lot} was not accepted whole");
                accepted[lot] = inserted.Value;
            }

            var walBefore = FaultSupport.WalBytes(database);
            var content = new HeldFileContent(csv);
            var upload = FaultSupport.UploadAsync(http, content);
            await FaultSupport.WaitForWalGrowthAsync(database, walBefore, 8 << 20, () => upload.IsCompleted, () => server.Output);

            // Two more batches arrive while the large one holds the single writer: they wait for their turn.
            for (var i = 6; i <= 7; i++)
            {
                var lot = $"K{i:0000}";
                queued[lot] = (18, FaultSupport.PostSmallBatchAsync(http, FaultSupport.SmallBatch(lot, wafers: 2)));
            }

            await Task.Delay(300);
            Assert.False(upload.IsCompleted, "the large ingest ended before the kill; the test must kill it mid-way");
            Assert.True(content.Sent < new FileInfo(csv).Length, "the whole body was sent before the kill");
            await server.KillAsync();
            await Assert.ThrowsAnyAsync<Exception>(() => upload);
            foreach (var (_, answer) in queued.Values)
            {
                await Assert.ThrowsAnyAsync<Exception>(() => answer);
            }
        }

        await using (var restarted = await ServerProcess.StartAsync(database, settings))
        {
            using var http = restarted.CreateClient();
            using var health = await http.GetAsync(new Uri("/health", UriKind.Relative));
            Assert.Equal(HttpStatusCode.OK, health.StatusCode);

            Assert.Equal("ok", FaultSupport.IntegrityCheck(database));
            var stored = FaultSupport.LotCounts(database);
            foreach (var (lot, rows) in accepted)
            {
                Assert.Equal(rows, stored.GetValueOrDefault(lot));
            }

            // Unanswered batches are all or nothing too.
            foreach (var (lot, (rows, _)) in queued)
            {
                Assert.Contains(stored.GetValueOrDefault(lot), new[] { 0, rows });
            }

            Assert.DoesNotContain(stored.Keys, largeLots.ContainsKey);
            Assert.DoesNotContain(stored.Keys, l => !accepted.ContainsKey(l) && !queued.ContainsKey(l));
            Assert.Equal(0, FaultSupport.Scalar(database, "SELECT COUNT(*) FROM lot_steps WHERE lot_id NOT LIKE 'K%'"));

            // The restarted server takes a new batch.
            Assert.Equal(9, await FaultSupport.PostSmallBatchAsync(http, FaultSupport.SmallBatch("K0100", wafers: 1)));
        }
    }
}
