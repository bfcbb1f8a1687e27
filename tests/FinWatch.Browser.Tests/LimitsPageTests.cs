using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using Microsoft.Playwright;

namespace FinWatch.Browser.Tests;

/// <summary>
/// The limits page: run rules as boxes with their words and the alarm budget of the ticked set, a draft drawn over its
/// baseline points with its verdict, and a page that fits the window. The fixture (MonitorFixture) has 20 baseline wafers
/// and an approved v1 on the Western Electric rules.
/// </summary>
public sealed class LimitsPageTests(BrowserFixture browser) : MonitoredChartTest(browser)
{
    private ILocator Box(string rule) => Page.Locator($"#rules input[name='rule'][value='{rule}']");

    // In-control run lengths: 91.75 points for WE1–WE4 (Champ & Woodall 1987, from memory [M]) and 370.4 for WE1 alone,
    // 43.89 and 6.30 points at 1σ and 2σ (Montgomery; the Shewhart column of docs/statistics.md §4.3). N3 is outside the
    // exact chain, so a set with it is simulated.
    [BrowserFact]
    public async Task LimitsPage_TickingAndUntickingRuleBoxes_ChangesTheBudget_AndSavingStoresTheRules()
    {
        await OpenAsync("limits.html?context=TRI-TOP");
        var budget = Page.Locator("#budget");
        await Assertions.Expect(budget).ToContainTextAsync(new Regex(@"every \d+ h \(91\.8 points\) while the process is in control"));
        await Assertions.Expect(budget).ToContainTextAsync("Worked out exactly");
        await Assertions.Expect(Page.Locator("#rules input[name='rule']")).ToHaveCountAsync(12);
        await Assertions.Expect(Page.Locator("#rules input[name='rule']:checked")).ToHaveCountAsync(4);
        await Assertions.Expect(Page.Locator("#rules")).ToContainTextAsync("Western Electric");
        await Assertions.Expect(Page.Locator("#rules")).ToContainTextAsync("Nelson");
        await Assertions.Expect(Page.Locator("#rules label", new() { HasText = "N3" })).ToContainTextAsync("six points in a row steadily rising or falling");

        foreach (var rule in new[] { "WE2", "WE3", "WE4" })
        {
            await Box(rule).UncheckAsync();
        }

        await Assertions.Expect(budget).ToContainTextAsync("(370 points)");
        await Assertions.Expect(budget).ToContainTextAsync(new Regex(@"A 1σ shift is caught in about 43\.9 points \(\d+ h\)"));
        await Assertions.Expect(budget).ToContainTextAsync(new Regex(@"A 2σ shift is caught in about 6\.3 points \(\d+ h\)"));

        await Box("N3").CheckAsync();
        await Assertions.Expect(budget).ToContainTextAsync(new Regex(@"Estimated by simulation: \d+ runs, standard error [\d.]+ points"));
        await Assertions.Expect(budget).Not.ToContainTextAsync("(370 points)");

        await Box("WE1").UncheckAsync();
        await Box("N3").UncheckAsync();
        await Assertions.Expect(budget).ToContainTextAsync("No rule chosen");
        await Page.Locator("#plan-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#plan-result")).ToContainTextAsync("Tick at least one run rule");

        await Box("WE1").CheckAsync();
        await Box("N3").CheckAsync();
        await Page.Locator("#plan-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#plan-result")).ToContainTextAsync("Saved: a reaction plan of 2 steps, rules WE1, N3");
        var stored = await Client.GetFromJsonAsync<JsonElement>("/api/contexts/TRI-TOP");
        Assert.Equal(["WE1", "N3"], stored.GetProperty("rules").EnumerateArray().Select(r => r.GetString()));

        await Page.ReloadAsync();
        await Assertions.Expect(Page.Locator("#rules input[name='rule']:checked")).ToHaveCountAsync(2);
        await Assertions.Expect(Box("N3")).ToBeCheckedAsync();
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task LimitsPage_ComputedDraft_IsDrawnOverItsPointsWithItsVerdict_AndTheChartIsUpdatedInPlace()
    {
        await OpenAsync("limits.html?context=TRI-TOP");
        await Assertions.Expect(Page.Locator("#draft-check")).ToContainTextAsync("No draft");
        await ComputeAsync(1, 20, "re-baseline after chamber clean");
        await Assertions.Expect(Page.Locator("#draft")).ToHaveValueAsync("2");
        await Assertions.Expect(Page.Locator("#draft-check .state")).ToHaveTextAsync("not stable"); // in words, with its shape
        await Assertions.Expect(Page.Locator("#draft-check .reasons")).ToContainTextAsync("only 20 subgroups");
        await Assertions.Expect(Page.Locator("#draft-check")).ToContainTextAsync("20 points used");
        await Assertions.Expect(Page.Locator("#draft-check")).ToContainTextAsync("centre line 6.000 nm");
        var v2 = await DrawnAsync();
        Assert.Equal(20, v2.Points);
        Assert.Equal(1, v2.First);
        Assert.Equal(20, v2.Last);
        var limits = await Client.GetFromJsonAsync<JsonElement>("/api/contexts/TRI-TOP/limits");
        var draft = limits.EnumerateArray().Single(v => v.GetProperty("version").GetInt32() == 2);
        Assert.Equal(draft.GetProperty("centre").GetDouble(), v2.Centre, 9);
        Assert.Equal(draft.GetProperty("ucl").GetDouble(), v2.Ucl, 9);
        Assert.Equal(draft.GetProperty("lcl").GetDouble(), v2.Lcl, 9);
        await Page.EvaluateAsync("() => { window.firstDraftChart = Chart.getChart(document.querySelector('#draft-chart')); }");

        await ComputeAsync(5, 16, "the middle only");
        await Assertions.Expect(Page.Locator("#draft")).ToHaveValueAsync("3");
        await Assertions.Expect(Page.Locator("#draft-check")).ToContainTextAsync("12 points used");
        var v3 = await DrawnAsync();
        Assert.Equal((12, 5, 16), (v3.Points, v3.First, v3.Last));

        await Page.Locator("#draft").SelectOptionAsync("2");
        await Assertions.Expect(Page.Locator("#draft-check")).ToContainTextAsync("20 points used");
        Assert.Equal(20, (await DrawnAsync()).Points);
        Assert.True(await Page.EvaluateAsync<bool>("() => Chart.getChart(document.querySelector('#draft-chart')) === window.firstDraftChart"), "the draft chart was rebuilt instead of updated");
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task LimitsPage_FitsTheWindow_At1366And1920_WithThePageLinksOnOneLine()
    {
        await OpenAsync("limits.html?context=TRI-TOP");
        await ComputeAsync(1, 20, "re-baseline after chamber clean");
        foreach (var (width, height) in new[] { (1366, 768), (1920, 1080) })
        {
            await Page.SetViewportSizeAsync(width, height);
            await Assertions.Expect(Page.Locator("#draft-check .state")).ToBeVisibleAsync();
            await Page.WaitForTimeoutAsync(300); // Chart.js resizes its canvases on the next frame
            Assert.True(await Page.EvaluateAsync<bool>("() => document.documentElement.scrollWidth <= document.documentElement.clientWidth"), $"the page is wider than the window at {width}×{height}");
            // The page links stay on one line. (The top strip as a whole already puts who is signed in on a second line at
            // 1366 px, with or without a longer label here, so the label stays "Limits & plans".)
            var rows = await Page.EvaluateAsync<int>("() => new Set([...document.querySelectorAll('.strip nav a')].map((a) => Math.round(a.getBoundingClientRect().top))).size");
            Assert.True(rows == 1, $"the page links wrap onto {rows} lines at {width}×{height}");
            await ScreenshotIfAskedAsync($"limits-{width}x{height}");
        }

        AssertNoPageProblems();
    }

    private async Task ComputeAsync(int from, int to, string reason)
    {
        await Page.Locator("#from-seq").FillAsync(from.ToString(System.Globalization.CultureInfo.InvariantCulture));
        await Page.Locator("#to-seq").FillAsync(to.ToString(System.Globalization.CultureInfo.InvariantCulture));
        await Page.Locator("#reason").FillAsync(reason);
        await Page.Locator("#compute-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#compute-result")).ToContainTextAsync("Draft v");
    }

    private sealed record Drawn(int Points, int First, int Last, double Centre, double Ucl, double Lcl);

    /// <summary>What the draft chart shows: its points (count, first and last point number) and its three lines.</summary>
    private async Task<Drawn> DrawnAsync()
    {
        var d = await Page.EvaluateAsync<JsonElement>("""
            () => {
              const sets = Chart.getChart(document.querySelector('#draft-chart')).data.datasets;
              const pts = sets[0].data;
              return { points: pts.length, first: pts[0]?.x ?? 0, last: pts.at(-1)?.x ?? 0,
                centre: sets[1].data[0].y, ucl: sets[2].data[0].y, lcl: sets[3].data[0].y };
            }
            """);
        return new Drawn(d.GetProperty("points").GetInt32(), d.GetProperty("first").GetInt32(), d.GetProperty("last").GetInt32(),
            d.GetProperty("centre").GetDouble(), d.GetProperty("ucl").GetDouble(), d.GetProperty("lcl").GetDouble());
    }
}
