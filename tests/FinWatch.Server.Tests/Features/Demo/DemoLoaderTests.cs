using System.Net;
using FinWatch.Server.Features.Demo;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Features.Demo;

public class DemoLoaderTests
{
    private static FinWatchAppFactory DemoFactory(string? databasePath = null)
    {
        var factory = new FinWatchAppFactory()
            .With("FinWatch:Demo:Enabled", "true")
            .With("FinWatch:Demo:Days", "4")
            .With("FinWatch:Demo:LotsPerDay", "3");
        return databasePath is null ? factory : factory.With("FinWatch:Database:SqlitePath", databasePath);
    }

    private static async Task<string> WaitForDemoAsync(FinWatchAppFactory factory)
    {
        var loader = factory.Services.GetRequiredService<DemoLoader>();
        for (var i = 0; i < 300 && loader.State is "idle" or "loading"; i++)
        {
            await Task.Delay(100);
        }

        return loader.State;
    }

    [Fact]
    public async Task Demo_EmptyDatabase_LoadsProductsAndLotsThroughTheIngest()
    {
        using var factory = DemoFactory();
        using var client = factory.CreateClient();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));

        var products = await factory.QueryAsync(db => db.Products.Include(p => p.Specs).ToListAsync());
        Assert.Equal(2, products.Count);
        Assert.All(products, p => Assert.NotEmpty(p.Specs));
        // The baseline first (one batch: the first of the 4 days), then the rest a day at a time after the demo contexts'
        // limits are approved: the 3 other days.
        var batches = await factory.QueryAsync(db => db.IngestBatches.OrderBy(b => b.Id).ToListAsync());
        Assert.Equal(4, batches.Count);
        Assert.EndsWith("baseline", batches[0].Label, StringComparison.Ordinal);
        Assert.All(batches, b => Assert.Equal("demo", b.Source));
        Assert.True(batches.Sum(b => b.Inserted) > 1000);
        Assert.Equal(batches.Sum(b => b.Inserted), (await factory.CountsAsync()).Measurements);
        Assert.True(await factory.QueryAsync(db => db.ChartContexts.CountAsync()) > 10);
        // Every profile row got its taper derived on the way in.
        var missing = await factory.QueryAsync(db => db.Measurements.CountAsync(m => m.Step == "FIN-PROFILE" && m.TaperDeg == null));
        Assert.Equal(0, missing);

        var response = await client.GetAsync($"/api/series?product={products[0].Code}&step=FIN-PROFILE&parameter=taper_deg&level=wafer");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);

        // The invented history ends when the demo starts (whole minutes before the clock), so this shift has data.
        var last = await factory.QueryAsync(db => db.Measurements.MaxAsync(m => m.MeasuredAtMs));
        var now = FinWatchAppFactory.Now.ToUnixTimeMilliseconds();
        Assert.InRange(now - last, 0, 6 * 3_600_000); // the generator's last lot of the window ends within hours of its end
    }

    [Fact]
    public async Task Demo_LongEnoughWindow_CalibratesEachProductOnItsInventedElectricalTests()
    {
        // Lots reach electrical test 18 days after their profile, so a 21-day window has tested lots of both products.
        using var factory = new FinWatchAppFactory()
            .With("FinWatch:Demo:Enabled", "true")
            .With("FinWatch:Demo:Days", "21")
            .With("FinWatch:Demo:LotsPerDay", "2");
        using var client = factory.CreateClient();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));
        var sets = await factory.QueryAsync(db => db.ModelParameterSets.ToListAsync());
        Assert.Equal(2, sets.Count);
        Assert.All(sets, s =>
        {
            Assert.Equal(1, s.Version);
            Assert.Equal("demo loader", s.CreatedBy);
            // The tests are the model under an invented truth plus 4 mV of wafer noise: the fit explains them to about that noise.
            Assert.True(s.RmsResidualAfterMv < 8, $"rms after {s.RmsResidualAfterMv} mV");
            Assert.True(s.RmsResidualBeforeMv > s.RmsResidualAfterMv);
        });
        Assert.Equal(sets.Sum(s => s.Observations), await factory.QueryAsync(db => db.ElectricalTests.CountAsync()));
    }

    [Fact]
    public async Task Demo_DatabaseWithProducts_IsNotLoadedAgain()
    {
        string path;
        int first;
        using (var factory = DemoFactory())
        {
            using var client = factory.CreateClient();
            Assert.Equal("loaded", await WaitForDemoAsync(factory));
            first = (await factory.CountsAsync()).Measurements;
            path = Path.Combine(Path.GetTempPath(), $"finwatch-demo-{Guid.NewGuid():N}.db");
            File.Copy(factory.DatabasePath, path);
            File.Copy(factory.DatabasePath + "-wal", path + "-wal");
        }

        try
        {
            using var again = DemoFactory(path);
            using var client = again.CreateClient();
            Assert.Equal("skipped", await WaitForDemoAsync(again));
            Assert.Equal(first, (await again.CountsAsync()).Measurements);
        }
        finally
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            foreach (var f in new[] { path, path + "-wal", path + "-shm" })
            {
                File.Delete(f);
            }
        }
    }
}
