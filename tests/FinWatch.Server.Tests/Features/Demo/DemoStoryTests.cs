using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Server.Features.Demo;
using FinWatch.Server.Features.Monitor;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Features.Demo;

/// <summary>
/// The whole invented demo (90 days, default seed) as a new user meets it at start: which charts are out of control,
/// with what alerts, and what the invented floor did. seed-demo/README.md tells each of these stories; this test pins
/// them, so a change to the generator, the monitor or the demo's choices that changes a story fails here first.
/// It loads the full history (about three minutes).
/// </summary>
public sealed class DemoStoryTests
{
    [Fact]
    public async Task FullDemo_AtStart_AFewChartsOutOfControl_EachWithItsPlantedStory()
    {
        using var factory = new FinWatchAppFactory().With("FinWatch:Demo:Enabled", "true").With("FinWatch:Demo:LiveLotSeconds", "0");
        using var client = factory.CreateClient();
        var loader = factory.Services.GetRequiredService<DemoLoader>();
        for (var i = 0; i < 6000 && loader.State is "idle" or "loading"; i++)
        {
            await Task.Delay(100);
        }

        Assert.Equal("loaded", loader.State);
        var contexts = (await client.GetFromJsonAsync<JsonElement>("/api/contexts")).EnumerateArray().ToList();
        var alerts = (await client.GetFromJsonAsync<JsonElement>("/api/alerts")).EnumerateArray().ToList();
        var limits = await factory.QueryAsync(db => db.LimitVersions.Where(l => l.Status == "approved")
            .Join(db.ChartContexts, l => l.ContextId, c => c.Id, (l, c) => new { c.Code, l.Version, l.Reason }).ToListAsync());
        var budget = await client.GetFromJsonAsync<JsonElement>("/api/run-length");

        static string S(JsonElement e, string name) => e.GetProperty(name).GetString()!;
        static string Rules(JsonElement a) => string.Join('+', a.GetProperty("rules").EnumerateArray().Select(r => r.GetString()).Order());

        // Six of the 24 charts are out of control at start (seed-demo/README.md, "Out of control at start").
        Assert.Equal(24, contexts.Count);
        Assert.Equal(
            ["BRM7-liner-LD03-2", "BRM7-taper-FX07-R", "TRN7-liner-LD03-2", "TRN7-radius-FX08-R", "TRN7-taper-FX07-R", "TRN7-taper-FX08-L"],
            contexts.Where(c => S(c, "state") == "out_of_control").Select(c => S(c, "code")).Order());

        // One excursion alert each, acknowledged by the invented floor and still signalling; every other excursion of the
        // history came back in control and was closed.
        Assert.Equal(113, alerts.Count);
        var open = alerts.Where(a => S(a, "state") != AlertStates.Closed).ToDictionary(a => S(a, "context"));
        Assert.All(open.Values, a => Assert.Equal((AlertStates.Acknowledged, "signalling"), (S(a, "state"), S(a, "condition"))));
        Assert.Equal(
            new Dictionary<string, (string, int)>
            {
                ["TRN7-liner-LD03-2"] = ("WE1+WE2+WE3", 445), // the liner thinning since the start of the window
                ["BRM7-liner-LD03-2"] = ("WE1+WE2+WE3+WE4", 340),
                ["TRN7-taper-FX07-R"] = ("WE1+WE3+WE4", 191), // the taper creeping again since the last wet clean
                ["BRM7-taper-FX07-R"] = ("WE1+WE2+WE3+WE4", 136),
                ["TRN7-radius-FX08-R"] = ("WE1", 10), // two lots above the limit: the radius is skewed, nothing planted
                ["TRN7-taper-FX08-L"] = ("WE2", 6), // a false alarm of the kind the alarm budget counts
            },
            open.ToDictionary(a => a.Key, a => (Rules(a.Value), a.Value.GetProperty("point_count").GetInt32())));

        // The chamber log holds the seven planted maintenances; after the two wet cleans of FX07-R and the edge-ring change
        // of FX08-L the chart suggested a new baseline and the invented engineer approved one (versions 3 and 2).
        Assert.Equal(7, await factory.QueryAsync(db => db.MaintenanceEvents.CountAsync()));
        Assert.Equal(
            ["BRM7-radius-FX08-L v2", "BRM7-taper-FX07-R v3", "TRN7-radius-FX08-L v2", "TRN7-taper-FX07-R v3"],
            limits.GroupBy(l => l.Code).Where(g => g.Count() > 1).Select(g => $"{g.Key} v{g.Max(l => l.Version)}").Order());
        Assert.All(limits.Where(l => l.Version > 1), l => Assert.Contains("new baseline after the", l.Reason, StringComparison.Ordinal));
        var lastClean = await factory.QueryAsync(db => db.MaintenanceEvents.Where(e => e.Chamber == "FX07-R").MaxAsync(e => e.OccurredAtMs));
        Assert.All(new[] { "TRN7-taper-FX07-R", "BRM7-taper-FX07-R" }, code =>
            Assert.True(open[code].GetProperty("first_signal_measured_at").GetDateTimeOffset().ToUnixTimeMilliseconds() > lastClean, code));

        // Every chart's rules keep to the floor's budget of one false alarm in 14 days at its baseline's lot rate, so the
        // floor expects fewer than 24 / 14 a day (at the last 14 days' rates, which differ a little).
        Assert.InRange(budget.GetProperty("expected_false_alarms_per_day").GetDouble(), 0.5, 24 / DemoMonitor.FalseAlarmBudgetDays);
    }
}
