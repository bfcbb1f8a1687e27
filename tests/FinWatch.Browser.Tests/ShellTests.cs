using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>The frame every page shares: one row at a laptop's width, and the count of alerts nobody has acknowledged.</summary>
public sealed class ShellTests(BrowserFixture browser) : BrowserTest(browser)
{
    private static readonly string[] Pages =
        ["index.html", "chart.html", "alerts.html", "limits.html", "lot.html", "whatif.html", "entry.html", "shift.html", "maintenance.html", "audit.html", "notify.html", "roster.html", "deliveries.html", "people.html"];

    protected override bool SignIn => false;

    [BrowserFact]
    public async Task Header_StaysOnOneRow_At1366And1920_OnEveryPage_ForAnAdministrator()
    {
        // An administrator sees every link (the longest navigation), with a long invented name.
        const string admin = "area administrator 12";
        await SignInAsync(admin, "administrator");

        foreach (var (width, height) in new[] { (1366, 768), (1920, 1080) })
        {
            await Page.SetViewportSizeAsync(width, height);
            foreach (var page in Pages)
            {
                await OpenAsync(page);
                // The three notification pages share one link (Notify), and link to each other at the top of each.
                await Assertions.Expect(Page.Locator(".strip nav a")).ToHaveCountAsync(Pages.Length - 2);
                await Assertions.Expect(Page.Locator(".strip .who")).ToContainTextAsync(admin);
                // Every part of the strip starts on the same row, and the strip itself does not scroll sideways.
                var layout = await Page.EvaluateAsync<double[]>(
                    "() => { const s = document.querySelector('.strip'); const tops = [...s.children].filter(c => c.offsetParent).map(c => c.getBoundingClientRect().top); "
                    + "return [Math.max(...tops) - Math.min(...tops), s.scrollWidth - s.clientWidth, document.querySelector('.strip nav').getBoundingClientRect().height]; }");
                Assert.True(layout[0] < 8, $"{page} at {width} px: the header wraps ({layout[0]:0} px between rows)");
                Assert.True(layout[1] <= 0, $"{page} at {width} px: the header is {layout[1]:0} px too wide");
                Assert.True(layout[2] < 50, $"{page} at {width} px: the navigation takes {layout[2]:0} px, more than one row");
                if (page == "maintenance.html")
                {
                    await ScreenshotIfAskedAsync($"header-{width}");
                }
            }
        }
    }

    [BrowserFact]
    public async Task AlertsLink_CountsTheAlertsNotAcknowledged_AndFollowsTheFeed()
    {
        await SignInAsync();
        await FinWatch.Testing.TestProducts.CreateBothAsync(Client);
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        await OpenAsync("index.html");
        await WaitLiveAsync();
        var badge = Page.Locator(".strip nav a[href='alerts.html'] .count");
        await Assertions.Expect(badge).ToBeHiddenAsync(); // no alert yet: no badge

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5)); // WE1: one excursion, raised open
        await Assertions.Expect(badge).ToHaveTextAsync("1");
        await Assertions.Expect(badge).ToHaveAttributeAsync("aria-label", "1 alert not acknowledged, 1 not closed");
        await ScreenshotIfAskedAsync("header-badge");

        var id = (await Client.GetFromJsonAsync<JsonElement>("/api/alerts")).EnumerateArray().Single().GetProperty("id").GetInt64();
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment = "seen" })).EnsureSuccessStatusCode();
        await Assertions.Expect(badge).ToBeHiddenAsync(); // the acknowledgement reaches the page through the feed
        AssertNoPageProblems();
    }
}
