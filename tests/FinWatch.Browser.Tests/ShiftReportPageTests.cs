using System.Net.Http.Json;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.ShiftFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// The shift report page for the late shift of 2026-12-01 (ShiftFixture, default pattern, UTC): lot L0001 measured at
/// 14:30 with wafer means 6.02, 5.98, 6.02, 5.98 and 7.5 nm raises one WE1 alert at 15:00, acknowledged at 16:00
/// (ShiftReportTests works out the Cpk values shown here by hand); a wet clean of ETA-1 finished at 15:30. The page is
/// photographed to FINWATCH_SCREENSHOTS when it is set.
/// </summary>
public sealed class ShiftReportPageTests(BrowserFixture browser) : BrowserTest(browser)
{
    public override async Task InitializeAsync()
    {
        await base.InitializeAsync();
        await TestProducts.CreateBothAsync(Client);
        await ShiftFixture.LateShiftAsync(Client, Factory.Clock, "seen at the tool <b>held</b>");
        Factory.Clock.SetUtcNow(Day.AddHours(23));
        (await Client.PostAsJsonAsync("/api/maintenance", new
        {
            chamber = "ETA-1", kind = "wet_clean", occurred_at = Day.AddHours(15.5), performed_by = "Crew Amber",
            note = "chamber opened after 1200 RF hours; edge ring and focus ring replaced, 25 seasoning wafers run before release to production",
        })).EnsureSuccessStatusCode();
    }

    [BrowserFact]
    public async Task ShiftPage_ShowsTheShiftsAlertInItsTables_AndPrintsWithoutControls()
    {
        await OpenAsync("shift.html?date=2026-12-01&shift=late");
        await Assertions.Expect(Page.Locator("#report-title")).ToHaveTextAsync("Shift report: late, 2026-12-01");
        await Assertions.Expect(Page.Locator("nav a[aria-current='page']")).ToHaveTextAsync("Shift report");
        await Assertions.Expect(Page.Locator("#f-shift")).ToHaveValueAsync("late");
        await Assertions.Expect(Page.Locator("#f-date")).ToHaveValueAsync("2026-12-01");

        var lots = Page.Locator("#lots-table tbody tr");
        await Assertions.Expect(lots).ToHaveCountAsync(1);
        await Assertions.Expect(lots.First).ToContainTextAsync("L0001");
        await Assertions.Expect(lots.First).ToContainTextAsync("5 wafers");
        await Assertions.Expect(lots.First).ToContainTextAsync("25 sites");

        var raised = Page.Locator("#raised-table tbody tr");
        await Assertions.Expect(raised).ToHaveCountAsync(1);
        await Assertions.Expect(raised.First).ToContainTextAsync("WE1: one point beyond a 3σ limit");
        await Assertions.Expect(raised.First).ToContainTextAsync("L0001 · W5");
        await Assertions.Expect(raised.First).ToHaveAttributeAsync("data-state", "acknowledged");
        await Assertions.Expect(raised.First.Locator("td").Last).ToContainTextAsync(" mV"); // predicted ΔVT sat with its unit

        await Assertions.Expect(Page.Locator("#actions-table tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#actions-table")).ToContainTextAsync("seen at the tool <b>held</b>"); // text, not markup
        var maintenance = Page.Locator("#maintenance-table tbody tr");
        await Assertions.Expect(maintenance).ToHaveCountAsync(1);
        await Assertions.Expect(maintenance).ToContainTextAsync("wet clean"); // in words, not the API's wet_clean
        await Assertions.Expect(maintenance).ToContainTextAsync("01 Dec 2026, 15:30"); // the browser runs in UTC
        await Assertions.Expect(maintenance).ToContainTextAsync("ETA-1");
        await Assertions.Expect(maintenance).ToContainTextAsync("Crew Amber");
        await Assertions.Expect(maintenance).ToContainTextAsync("test administrator"); // who recorded it through the API
        await Assertions.Expect(Page.Locator("#open-table tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#ooc-table tbody tr")).ToContainTextAsync("out of control");
        await Assertions.Expect(Page.Locator("#risks-table tbody tr")).ToHaveCountAsync(5);
        await Assertions.Expect(Page.Locator("#risks-table tbody tr").First).ToContainTextAsync("L0001 · W5");

        // Cpk = min(USL − μ, μ − LSL)/(3σ), σ = 0.0791/c4(5) = 0.0841 nm: shift μ 6.3 nm → 0.79; the 7 days before, μ 6.0 nm → 1.98.
        var capability = Page.Locator("#capability-table tbody tr");
        await Assertions.Expect(capability).ToContainTextAsync("Cpk 0.79");
        await Assertions.Expect(capability).ToContainTextAsync("Cpk 1.98");
        await Assertions.Expect(capability).ToContainTextAsync("6.300 nm");
        await Assertions.Expect(capability).ToContainTextAsync("-1.19 (Cpk)");
        await Assertions.Expect(Page.Locator("#report-caution")).ToContainTextAsync("not measured thresholds");

        await AssertNoSidewaysScrollAsync();
        await ScreenshotIfAskedAsync("shift-maintenance");

        var href = await Page.Locator("#csv-link").GetAttributeAsync("href");
        Assert.Equal("/api/reports/shift.csv?date=2026-12-01&shift=late", href);
        var csv = await Client.GetAsync(href);
        Assert.Equal("text/csv", csv.Content.Headers.ContentType?.MediaType);

        await Page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Print });
        await Assertions.Expect(Page.Locator("#shift-form")).ToBeHiddenAsync();
        await Assertions.Expect(Page.Locator(".strip nav")).ToBeHiddenAsync();
        await Page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Screen });

        // Another shift by the pickers: the early shift had nothing.
        await Page.Locator("#f-shift").SelectOptionAsync("early");
        await Page.Locator("#show-shift").ClickAsync();
        await Assertions.Expect(Page.Locator("#report-title")).ToHaveTextAsync("Shift report: early, 2026-12-01");
        await Assertions.Expect(Page.Locator("#raised-none")).ToHaveTextAsync("No alert was raised in this shift.");
        await Assertions.Expect(Page.Locator("#maintenance-none")).ToContainTextAsync("none recorded");
        await Assertions.Expect(Page.Locator("#csv-link")).ToHaveAttributeAsync("href", "/api/reports/shift.csv?date=2026-12-01&shift=early");
        AssertNoPageProblems();
    }
}
