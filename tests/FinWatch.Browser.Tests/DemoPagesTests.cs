using System.Globalization;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;
using Microsoft.Playwright;

namespace FinWatch.Browser.Tests;

/// <summary>
/// Every page in the invented demo fab's state renders its main content without a script error or a failed request,
/// and is photographed. The screenshots go to FINWATCH_SCREENSHOTS (the README's pictures: seed-demo/screenshots,
/// taken with FINWATCH_SCREENSHOT_DAYS=90) or else to the test's temporary folder. The suite loads 30 days to stay quick.
/// </summary>
public sealed class DemoPagesTests(BrowserFixture browser) : BrowserTest(browser)
{
    private static readonly int Days = int.TryParse(Environment.GetEnvironmentVariable("FINWATCH_SCREENSHOT_DAYS"), CultureInfo.InvariantCulture, out var d) ? d : 30;

    private string shots = "";

    protected override bool SignIn => false; // the demo signs everyone in as its invented engineer

    protected override void Configure(FinWatchAppFactory factory)
    {
        factory.With("FinWatch:Demo:Enabled", "true").With("FinWatch:Demo:Days", Days.ToString(CultureInfo.InvariantCulture));
    }

    public override async Task InitializeAsync()
    {
        await base.InitializeAsync();
        shots = Environment.GetEnvironmentVariable("FINWATCH_SCREENSHOTS") is { Length: > 0 } dir ? Path.GetFullPath(dir) : Path.Combine(Factory.Folder, "screenshots");
        Directory.CreateDirectory(shots);
        var deadline = DateTime.UtcNow.AddMinutes(3);
        while ((await Client.GetFromJsonAsync<JsonElement>("/api/about")).GetProperty("demo_data").GetString() != "loaded")
        {
            Assert.True(DateTime.UtcNow < deadline, "the demo did not finish loading within 3 minutes");
            await Task.Delay(250);
        }
    }

    private Task<byte[]> ShotAsync(string name, bool fullPage = true) =>
        Page.ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(shots, name + ".png"), FullPage = fullPage });

    [BrowserFact]
    public async Task EveryPage_RendersTheDemoState()
    {
        var contexts = (await Client.GetFromJsonAsync<JsonElement>("/api/contexts")).EnumerateArray().ToList();
        // The most severe chart of a measured parameter (the predicted shift has no specification, so no Cpk).
        var worst = contexts.Select(c => c.GetProperty("code").GetString()!).First(code => !code.EndsWith("dvt-sat", StringComparison.Ordinal));

        await OpenAsync("index.html");
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator(".tile")).ToHaveCountAsync(contexts.Count);
        await Assertions.Expect(Page.Locator(".tile").First).ToHaveAttributeAsync("data-state", contexts[0].GetProperty("state").GetString()!);
        await ShotAsync("floor");

        await OpenAsync($"chart.html?context={worst}&range=all");
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator("#legend")).ToContainTextAsync("points shown");
        // The worst chart is out of control: capability leads with that verdict, then the long-term index first.
        await Assertions.Expect(Page.Locator("#stability")).ToContainTextAsync("Not stable");
        await Assertions.Expect(Page.Locator("#capability-numbers .index-name")).ToHaveTextAsync(["Ppk", "Cpk"]);
        await Assertions.Expect(Page.Locator("#capability-numbers .index-value").First).ToHaveTextAsync(new Regex(@"^\d+\.\d\d$"));
        await ShotAsync("chart");

        await OpenAsync("alerts.html");
        await WaitLiveAsync();
        await Page.Locator(".alert-item button").First.ClickAsync();
        await Assertions.Expect(Page.Locator("#detail h2")).ToContainTextAsync("Alert");
        await ShotAsync("alerts", fullPage: false); // the queue is long; the first screen shows the layout

        await OpenAsync($"limits.html?context={worst}");
        await Assertions.Expect(Page.Locator("#versions tr[data-status='approved']")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#budget")).ToContainTextAsync(new Regex(@"A false alarm about every [\d.]+ h"));
        await ShotAsync("limits");

        // The newest lot with a whole profile: the page opens on that step, with the cross-section and the estimates.
        var lot = (await Client.GetFromJsonAsync<JsonElement>("/api/lots?page_size=1&step=FIN-PROFILE")).GetProperty("items")[0].GetProperty("lot_id").GetString()!;
        await OpenAsync($"lot.html?lot={lot}");
        await Assertions.Expect(Page.Locator("#step")).ToHaveValueAsync("FIN-PROFILE");
        await Assertions.Expect(Page.Locator("#maps figure.wafer-map")).Not.ToHaveCountAsync(0);
        await Page.Locator("#sites tbody tr[data-site]").Nth(3).ClickAsync();
        await Assertions.Expect(Page.Locator("#xsection > *")).Not.ToHaveCountAsync(0); // the drawing is built into the svg
        await Assertions.Expect(Page.Locator("#open-whatif")).ToBeVisibleAsync();
        await ShotAsync("lot");

        await OpenAsync("whatif.html");
        await Assertions.Expect(Page.Locator("#dvt-sat")).ToContainTextAsync("mV");
        // A fin 0.8 nm narrower at the top than nominal: a narrower, more tapered fin must move the prediction.
        var top = Page.Locator("#top-width-num");
        var nominalTop = double.Parse(await top.InputValueAsync(), CultureInfo.InvariantCulture);
        await top.FillAsync((nominalTop - 0.8).ToString("0.0", CultureInfo.InvariantCulture));
        await top.PressAsync("Tab");
        await Assertions.Expect(Page.Locator("#dvt-sat")).Not.ToContainTextAsync("±0.0 mV");
        await Assertions.Expect(Page.Locator("#caution")).ToContainTextAsync("estimate");
        await Assertions.Expect(Page.Locator("#model-version")).Not.ToContainTextAsync("undefined");
        await Assertions.Expect(Page.Locator("#contrib")).Not.ToContainTextAsync("—"); // every contribution is a number
        await ShotAsync("whatif");

        await OpenAsync("entry.html");
        await Assertions.Expect(Page.Locator("#manual-form")).ToBeVisibleAsync();
        // The demo's stored site plan fills the grid once a product is chosen, and the first value gets a check.
        await Page.Locator("#m-product").SelectOptionAsync("BRM7");
        await Assertions.Expect(Page.Locator("#m-step")).Not.ToHaveValueAsync("");
        await Assertions.Expect(Page.Locator("#plan-note")).ToContainTextAsync("sites from the site plan");
        var first = Page.Locator("#site-grid tr.site-row").First;
        await first.Locator("[data-field='top_width_nm']").FillAsync("7.02");
        await first.Locator("[data-field='bottom_width_nm']").FillAsync("9.05");
        await first.Locator("[data-field='fin_height_nm']").FillAsync("38.1");
        await first.Locator("[data-field='corner_radius_nm']").FillAsync("1.5");
        await first.Locator("[data-field='liner_thickness_nm']").FillAsync("1.62");
        await first.Locator("[data-field='liner_thickness_nm']").PressAsync("Tab");
        await ShotAsync("entry");

        await OpenAsync("shift.html?date=2026-11-29&shift=late"); // a late shift of the demo's last full day
        await Assertions.Expect(Page.Locator("#lots-table tbody tr")).Not.ToHaveCountAsync(0);
        await ShotAsync("shift");

        await OpenAsync("audit.html");
        await Assertions.Expect(Page.Locator("#audit tbody tr[data-entry]")).Not.ToHaveCountAsync(0);
        await ShotAsync("audit");
        await Assertions.Expect(Page.Locator(".strip .demo-mark")).ToContainTextAsync("Demo");
        await Assertions.Expect(Page.Locator(".strip .demo-mark")).ToHaveAttributeAsync("title", new Regex("^Demo mode: signed in automatically as .*invented"));
        AssertNoPageProblems();
    }
}
