using System.Net.Http.Json;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>The floor's tiles rank charts at a glance: urgency in large type, a sparkline, ΔVT marked as an estimate.</summary>
public sealed class FloorPageTests(BrowserFixture browser) : MonitoredChartTest(browser)
{
    [BrowserFact]
    public async Task Tile_AfterASignal_SaysSinceWhenAndWhoMustAct_WithASparklineAndTheEstimate()
    {
        await Page.SetViewportSizeAsync(1366, 768);
        await OpenAsync("index.html");
        await WaitLiveAsync();
        var tile = Page.Locator(".tile[data-context='TRI-TOP']");
        // In control: 20 baseline points drawn, judged by no limits yet, so no limit lines and no triangles.
        await Assertions.Expect(tile.Locator(".spark polyline.value")).ToHaveCountAsync(1);
        await Assertions.Expect(tile.Locator(".spark polygon.signal")).ToHaveCountAsync(0);
        await Assertions.Expect(tile.Locator(".since")).ToHaveCountAsync(0);
        // 1 chart with approved limits: its expected false alarms per shift (the alarm budget) are on the floor.
        await Assertions.Expect(Page.Locator("#budget")).ToContainTextAsync(new System.Text.RegularExpressions.Regex(@"about \d+\.\d\d false alarms expected per 8 h shift from the 1 charts"));

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5)); // one point beyond 3σ

        await Assertions.Expect(tile).ToHaveAttributeAsync("data-state", "out_of_control");
        await Assertions.Expect(tile.Locator(".urgent")).ToContainTextAsync("1 not acknowledged");
        await Assertions.Expect(tile.Locator(".urgent .sev")).ToBeVisibleAsync();
        await Assertions.Expect(tile.Locator(".since")).ToContainTextAsync("out of control since 26 Nov 2026");
        await Assertions.Expect(tile.Locator(".spark polygon.signal")).ToHaveCountAsync(1); // the signal as a shape
        await Assertions.Expect(tile.Locator(".spark polyline.limit")).ToHaveCountAsync(2);
        await Assertions.Expect(tile.Locator(".dvt")).ToContainTextAsync("est. ΔVT");
        await Assertions.Expect(tile.Locator(".dvt")).ToHaveAttributeAsync("title", new System.Text.RegularExpressions.Regex("engineering estimate"));
        await ScreenshotIfAskedAsync("floor-tile");
        await AssertNoSidewaysScrollAsync();
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task GroupedWallScreen_KeepsItsChoiceInTheAddress_AndShowsCalmChartsAsOneLine()
    {
        // A second chart on chamber ETA-1, which the fixture's rows name as a chamber of etch tool ETA.
        (await Client.PostAsJsonAsync("/api/contexts", new
        {
            code = "TRI-TOP-ETA1", product = TestProducts.TriGate, step = "FIN-PROFILE", parameter = "top_width_nm", chamber = "ETA-1",
            chart_type = "xbar", subgroup = "wafer", rules = "westernElectric", reaction_plan = new[] { "Hold the lot" }, electrical_concern_mv = 10,
        })).EnsureSuccessStatusCode();
        await Page.SetViewportSizeAsync(1920, 1080);
        await OpenAsync("index.html");
        await WaitLiveAsync();
        await Page.Locator("#view").SelectOptionAsync("chambers");
        await Assertions.Expect(Page.Locator("section.group h2").First).ToContainTextAsync("tool ETA · chamber ETA-1 · 1 chart");
        await Page.Locator("#layout").SelectOptionAsync("wall");
        Assert.Contains("view=chambers", Page.Url);
        Assert.Contains("layout=wall", Page.Url);
        await Assertions.Expect(Page.Locator("body")).ToHaveClassAsync(new System.Text.RegularExpressions.Regex(@"\bwall\b"));
        // The fixture's chart has no chamber: it belongs to the whole step's group; in control, it is one line.
        await Assertions.Expect(Page.Locator("section.group")).ToHaveCountAsync(2);
        var group = Page.Locator("section.group").Last;
        await Assertions.Expect(group.Locator("h2")).ToContainTextAsync("whole step, every chamber · 1 chart, 0 out of control");
        await Assertions.Expect(group.Locator(".calm .chip[data-context='TRI-TOP']")).ToBeVisibleAsync();
        await Assertions.Expect(group.Locator(".tile")).ToHaveCountAsync(0);

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5)); // one point beyond 3σ: the chart needs someone

        await Assertions.Expect(group.Locator(".tile[data-context='TRI-TOP']")).ToHaveAttributeAsync("data-state", "out_of_control");
        await Assertions.Expect(group.Locator("h2")).ToContainTextAsync("1 chart, 1 out of control");
        // Read from five metres: the state's type on a wall screen is at least 30 px high.
        var size = await group.Locator(".tile .state").EvaluateAsync<double>("e => parseFloat(getComputedStyle(e).fontSize)");
        Assert.True(size >= 30, $"state type {size} px");
        await Page.ReloadAsync();
        await Assertions.Expect(Page.Locator("#view")).ToHaveValueAsync("chambers");
        await Assertions.Expect(Page.Locator("#layout")).ToHaveValueAsync("wall");
        await AssertNoSidewaysScrollAsync();
        AssertNoPageProblems();
    }
}
