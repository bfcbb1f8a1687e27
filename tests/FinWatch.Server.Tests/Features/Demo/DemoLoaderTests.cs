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
    public async Task Demo_StoresEachProductsSitePlans_WithTheSitesItsRowsAreMeasuredAt()
    {
        using var factory = DemoFactory();
        using var client = factory.CreateClient();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));

        foreach (var product in SeedDemo.DemoFab.Products)
        {
            var answer = await client.GetAsync($"/api/products/{product.Code}/site-plans");
            Assert.Equal(HttpStatusCode.OK, answer.StatusCode);
            var plans = System.Text.Json.JsonDocument.Parse(await answer.Content.ReadAsStringAsync()).RootElement.GetProperty("plans")
                .EnumerateArray().ToDictionary(p => p.GetProperty("step").GetString()!,
                    p => p.GetProperty("sites").EnumerateArray().Select(s => (s.GetProperty("site_id").GetString()!, s.GetProperty("site_x_mm").GetDouble(), s.GetProperty("site_y_mm").GetDouble())).ToList());
            Assert.Equal(["FIN-PROFILE", "POST-ETCH-CD"], plans.Keys.Order(StringComparer.Ordinal));

            // The stored rows were measured at exactly the plan's sites (ids and positions), step by step.
            var measured = await factory.QueryAsync(db => db.Measurements
                .Where(m => db.Products.Any(p => p.Id == m.ProductId && p.Code == product.Code))
                .Select(m => new { m.Step, m.SiteId, m.SiteXMm, m.SiteYMm }).Distinct().ToListAsync());
            foreach (var (step, sites) in plans)
            {
                var rows = measured.Where(m => m.Step == step).Select(m => (m.SiteId, m.SiteXMm, m.SiteYMm)).Order().ToList();
                Assert.Equal(sites.Order().ToList(), rows);
            }
        }

        Assert.Equal(4, await factory.QueryAsync(db => db.AuditEntries.CountAsync(a => a.Entity == "site-plan" && a.By == DemoLoader.Recorder)));
    }

    [Fact]
    public async Task Demo_HasItsInventedCrewOnTheRoster_ASupervisorOnEachShift()
    {
        using var factory = DemoFactory();
        using var client = factory.CreateClient();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));

        // The fake clock's 08:00 UTC is in the default pattern's early shift (06:00–14:00).
        var now = System.Text.Json.JsonDocument.Parse(await client.GetStringAsync("/api/roster/on-shift")).RootElement;
        Assert.Equal("early", now.GetProperty("shift").GetString());
        Assert.Equal(["early-supervisor"], now.GetProperty("supervisors").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal(["early-supervisor", "early-technician"],
            now.GetProperty("people").EnumerateArray().Select(e => e.GetProperty("name").GetString()));
        foreach (var at in new[] { "2026-12-01T15:00:00Z", "2026-12-01T23:00:00Z" })
        {
            var other = System.Text.Json.JsonDocument.Parse(await client.GetStringAsync($"/api/roster/on-shift?at={at}")).RootElement;
            Assert.Single(other.GetProperty("supervisors").EnumerateArray());
        }

        Assert.Equal(DemoLoader.Crew.Length, await factory.QueryAsync(db => db.Users.CountAsync(u => u.Email != null && u.Email.EndsWith("@fab.example"))));
    }

    [Fact]
    public async Task Demo_RecordsThePlantedMaintenancesInTheChamberLog_MovedWithTheHistory()
    {
        using var factory = DemoFactory();
        using var client = factory.CreateClient();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));

        var log = await factory.QueryAsync(db => db.MaintenanceEvents.OrderBy(e => e.OccurredAtMs).ToListAsync());
        var planted = SeedDemo.DemoFab.Events.Where(e => e.IsMaintenance).ToList();
        Assert.Equal(planted.Count, log.Count);
        // The history ends when the demo starts: the generator's end is the clock (to the minute), and each event keeps
        // its distance to it, logged when the chamber went back to production.
        var shift = FinWatchAppFactory.Now.UtcDateTime - SeedDemo.DemoFab.EndUtc;
        Assert.All(planted.Zip(log), pair =>
        {
            var (e, stored) = pair;
            Assert.Equal(e.Chamber, stored.Chamber);
            Assert.Equal(e.LoggedAs, stored.Kind);
            Assert.InRange(stored.OccurredAtMs - new DateTimeOffset(e.AtUtc + SeedDemo.DemoFab.MaintenanceDowntime + shift).ToUnixTimeMilliseconds(), -60_000, 0);
            Assert.Equal(DemoLoader.Recorder, stored.RecordedBy);
        });
        Assert.Equal(log.Count, await factory.QueryAsync(db => db.AuditEntries.CountAsync(a => a.Entity == "maintenance")));
    }

    [Fact]
    public async Task Demo_RuleSets_AreChosenWithTheAlarmBudget()
    {
        // At 3 lots a day every Western Electric combination keeps within one false alarm in 14 days, so the fullest set
        // (the one that catches a 1σ shift soonest) is chosen; at 24 points a day only the 3σ rule with one more does.
        // Run lengths: Champ & Woodall (1987), Table 1 (WE1-WE4 91.75 points in control; from memory), which the
        // run-length engine's own tests check.
        Assert.Equal("WE1, WE2, WE3, WE4", string.Join(", ", DemoMonitor.ChooseRules(3).Rules));
        var busy = DemoMonitor.ChooseRules(24);
        Assert.True(busy.FalseAlarmDays >= DemoMonitor.FalseAlarmBudgetDays, busy.Describe());
        Assert.True(busy.Rules.Length < 4);
        Assert.Equal(["WE1"], DemoMonitor.ChooseRules(10_000).Rules.Select(r => r.ToString()));

        using var factory = DemoFactory();
        using var client = factory.CreateClient();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));
        var limits = await factory.QueryAsync(db => db.LimitVersions.Where(l => l.Status == "approved").ToListAsync());
        Assert.NotEmpty(limits);
        Assert.All(limits, l => Assert.Contains("chosen with the alarm budget", l.ApprovalComment, StringComparison.Ordinal));
    }

    [Fact]
    public async Task Demo_SimulatedTool_SendsALotThroughTheIngestWithItsOwnKey_EveryInterval()
    {
        using var factory = DemoFactory().With("FinWatch:Demo:LiveLotSeconds", "60");
        factory.DefaultIdentity = "none"; // the product's own schemes: the tool's key, as on a real floor
        factory.UseKestrel(0);
        factory.StartServer();
        Assert.Equal("loaded", await WaitForDemoAsync(factory));
        for (var i = 0; i < 100 && await factory.QueryAsync(db => db.ApiKeys.CountAsync(k => k.Name == DemoTool.KeyName)) == 0; i++)
        {
            await Task.Delay(100);
        }

        var key = await factory.QueryAsync(db => db.ApiKeys.SingleAsync(k => k.Name == DemoTool.KeyName));
        Assert.Equal(FinWatch.Server.Features.Access.ApiKeys.IngestScope, key.Scope);
        var before = await factory.QueryAsync(db => db.IngestBatches.CountAsync());
        var tool = factory.Services.GetRequiredService<DemoTool>();

        for (var lot = 1; lot <= 2; lot++)
        {
            factory.Clock.Advance(TimeSpan.FromSeconds(60));
            for (var i = 0; i < 200 && tool.LotsSent < lot; i++)
            {
                await Task.Delay(100);
            }

            Assert.Equal(lot, tool.LotsSent);
        }

        // Two batches through the HTTP CSV ingest, lots numbered after the history, measured by the live tool up to now.
        var batches = await factory.QueryAsync(db => db.IngestBatches.OrderBy(b => b.Id).Skip(before).ToListAsync());
        Assert.Equal(2, batches.Count);
        Assert.All(batches, b => Assert.Equal("api-csv", b.Source));
        var first = SeedDemo.DemoFab.FirstLotNumberAfter(new SeedDemo.DemoScale(4, 3));
        var live = await factory.QueryAsync(db => db.Measurements.Where(m => m.MetrologyTool == SeedDemo.DemoFab.LiveProfileToolId).ToListAsync());
        Assert.Equal([$"Q{first}", $"Q{first + 1}"], live.Select(m => m.LotId).Distinct().Order());
        Assert.Equal(FinWatchAppFactory.Now.AddSeconds(120).ToUnixTimeMilliseconds(), live.Max(m => m.MeasuredAtMs));
        Assert.Equal($"Q{first + 1}", tool.LastLot);
        // The key was used, and its creation is in the audit trail.
        Assert.NotNull(await factory.QueryAsync(db => db.ApiKeys.Where(k => k.Id == key.Id).Select(k => k.LastUsedAtMs).SingleAsync()));
        Assert.Equal(1, await factory.QueryAsync(db => db.AuditEntries.CountAsync(a => a.Entity == "key" && a.Action == "created" && a.By == DemoLoader.Recorder)));
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
