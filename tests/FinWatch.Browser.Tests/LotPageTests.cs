using System.Globalization;
using System.Net.Http.Json;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// The lot page: it opens on the lot's most complete step, shows predicted ΔVT per site and per wafer, the lot's alerts
/// and charts, and sends a site to What-if. Lot M0001 has one wafer at FIN-PROFILE 0.5 nm above the baseline (a WE1
/// alert on TRI-TOP) and one wafer at a step "CD-CHECK" with only the top width measured; CD-CHECK comes first
/// alphabetically, so opening on FIN-PROFILE is the page's choice.
/// </summary>
public sealed class LotPageTests(BrowserFixture browser) : MonitoredChartTest(browser)
{
    [BrowserFact]
    public async Task Lot_OpensOnItsMostCompleteStep_WithEstimatesAlertsChartsAndWhatIf()
    {
        // Top width gets both specification limits, so its map can be coloured from the lower to the upper limit.
        (await Client.PutAsJsonAsync($"/api/products/{TestProducts.TriGate}", TestProducts.Request(TestProducts.TriGate, specs: new[]
        {
            new { parameter = "top_width_nm", lower = (double?)5.5, target = (double?)6.0, upper = (double?)6.5 },
        }))).EnsureSuccessStatusCode();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5));
        await IngestAsync(Client, SiteRow.Csv([new SiteRow
        {
            LotId = "M0001", Step = "CD-CHECK", MeasuredAt = MonitorDay.AddHours(1).ToString("yyyy-MM-ddTHH:mm:ssZ", CultureInfo.InvariantCulture),
            BottomWidthNm = null, FinHeightNm = null, CornerRadiusNm = null, LinerThicknessNm = null,
        }]));

        await Page.SetViewportSizeAsync(1366, 768);
        await OpenAsync("lot.html?lot=M0001");
        await Assertions.Expect(Page.Locator("#step")).ToHaveValueAsync("FIN-PROFILE");
        await Assertions.Expect(Page.Locator("#step option")).ToHaveCountAsync(2);

        // The lot's alert and the chart it feeds, each a link.
        await Assertions.Expect(Page.Locator("#lot-alerts li")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#lot-alerts a")).ToHaveAttributeAsync("href", new System.Text.RegularExpressions.Regex(@"^alerts\.html\?alert=\d+&state=all$"));
        await Assertions.Expect(Page.Locator("#lot-charts a[href='chart.html?context=TRI-TOP']")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#lot-charts li")).ToContainTextAsync("out of control");

        // Predicted ΔVT per site (a column) and per wafer (the wafers table), marked as an estimate.
        await Assertions.Expect(Page.Locator("#sites thead")).ToContainTextAsync("Est. ΔVT sat");
        await Assertions.Expect(Page.Locator("#wafers tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#wafers tbody tr td").Nth(2)).ToHaveTextAsync(new System.Text.RegularExpressions.Regex(@"^\u2212?\d+\.\d$"));
        await Assertions.Expect(Page.Locator(".wafer-map[data-parameter='delta_vt_sat_mv']")).ToHaveCountAsync(1);

        // The colour scale by specification: the scale's ends are the product's limits for the top width.
        await Page.Locator("#scale").SelectOptionAsync("spec");
        await Assertions.Expect(Page.Locator(".wafer-map[data-parameter='top_width_nm'] .scale-ends")).ToContainTextAsync("LSL 5.500 nm");
        Assert.Contains("scale=spec", Page.Url);
        await AssertNoHorizontalOverflowAtAsync(FloorScreens);

        // Site S01 (the first) is 5.9 + 0.5 = 6.4 nm wide at the top: What-if opens on it.
        await Page.Locator("#open-whatif").ClickAsync();
        await Page.WaitForURLAsync("**/whatif.html?*");
        await Assertions.Expect(Page.Locator("#top-width-num")).ToHaveValueAsync("6.4");
        AssertNoPageProblems();
    }
}
