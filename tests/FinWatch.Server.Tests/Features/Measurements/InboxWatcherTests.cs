using System.Text.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Measurements;

public class InboxWatcherTests : IntegrationTest
{
    public InboxWatcherTests()
    {
        Factory.With("FinWatch:Ingest:InboxEnabled", "true");
    }

    private static async Task<bool> EventuallyAsync(Func<bool> condition)
    {
        for (var i = 0; i < 200; i++)
        {
            if (condition())
            {
                return true;
            }

            await Task.Delay(100);
        }

        return false;
    }

    [Fact]
    public async Task DroppedGoodFile_IsIngestedAndMovedToProcessed()
    {
        var csv = SiteRow.Csv(SiteRow.Wafers("IN1", 2, 3, new DateTimeOffset(2026, 11, 21, 0, 0, 0, TimeSpan.Zero)));
        var temp = Path.Combine(Factory.InboxPath, ".lot-IN1.csv");
        await File.WriteAllTextAsync(temp, csv);
        File.Move(temp, Path.Combine(Factory.InboxPath, "lot-IN1.csv"));

        Assert.True(await EventuallyAsync(() => File.Exists(Path.Combine(Factory.InboxPath, "processed", "lot-IN1.csv"))));
        Assert.False(File.Exists(Path.Combine(Factory.InboxPath, "lot-IN1.csv")));
        var (measurements, batches, _, _) = await Factory.CountsAsync();
        Assert.Equal(6, measurements);
        Assert.Equal(1, batches);
    }

    [Fact]
    public async Task DroppedBadFile_IsMovedToRejectedWithAnErrorReport()
    {
        var csv = SiteRow.Csv([new SiteRow(), new SiteRow { SiteId = "S02", WaferSlot = "40" }]);
        await File.WriteAllTextAsync(Path.Combine(Factory.InboxPath, "bad.csv"), csv);

        var report = Path.Combine(Factory.InboxPath, "rejected", "bad.csv.errors.json");
        Assert.True(await EventuallyAsync(() => File.Exists(Path.Combine(Factory.InboxPath, "rejected", "bad.csv")) && File.Exists(report)));
        var problem = JsonDocument.Parse(await File.ReadAllTextAsync(report)).RootElement;
        var error = Assert.Single(problem.GetProperty("errors").EnumerateArray());
        Assert.Equal(3, error.GetProperty("row").GetInt32());
        Assert.Equal("wafer_slot", error.GetProperty("column").GetString());
        await AssertNothingStoredAsync();
    }

    [Fact]
    public async Task DroppedJsonFile_IsIngested()
    {
        var json = SiteRow.Json([new SiteRow { LotId = "INJ" }]);
        await File.WriteAllTextAsync(Path.Combine(Factory.InboxPath, "batch.json"), json);
        Assert.True(await EventuallyAsync(() => File.Exists(Path.Combine(Factory.InboxPath, "processed", "batch.json"))));
        Assert.Equal(1, (await Factory.CountsAsync()).Measurements);
    }

    [Fact]
    public async Task SameFileDroppedTwice_StoresRowsOnceAndKeepsBothFiles()
    {
        var csv = SiteRow.Csv([new SiteRow { LotId = "TWICE" }]);
        await File.WriteAllTextAsync(Path.Combine(Factory.InboxPath, "twice.csv"), csv);
        Assert.True(await EventuallyAsync(() => File.Exists(Path.Combine(Factory.InboxPath, "processed", "twice.csv"))));
        await File.WriteAllTextAsync(Path.Combine(Factory.InboxPath, "twice.csv"), csv);
        Assert.True(await EventuallyAsync(() => Directory.GetFiles(Path.Combine(Factory.InboxPath, "processed")).Length == 2));
        Assert.Equal(1, (await Factory.CountsAsync()).Measurements);
    }
}
