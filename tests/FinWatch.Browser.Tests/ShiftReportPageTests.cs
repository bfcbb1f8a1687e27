using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.ShiftFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// The shift report page for the late shift of 2026-12-01 (ShiftFixture, default pattern, UTC): lot L0001 measured at
/// 14:30 with wafer means 6.02, 5.98, 6.02, 5.98 and 7.5 nm raises one WE1 alert at 15:00, acknowledged at 16:00
/// (ShiftReportTests works out the Cpk values shown here by hand); a wet clean of ETA-1 finished at 15:30. The chart's
/// title (not its code TRI-TOP) is "TP-TRI FIN-PROFILE top_width_nm", made from product, step and parameter. The browser
/// signs in as an engineer (Person); the page is photographed to FINWATCH_SCREENSHOTS when it is set.
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

    private const string Title = "TP-TRI FIN-PROFILE top_width_nm";

    [BrowserFact]
    public async Task ShiftPage_LeadsWithWhatNeedsAction_ThenTheShiftsSections_AndPrintsWithoutControls()
    {
        await OpenAsync("shift.html?date=2026-12-01&shift=late");
        await Assertions.Expect(Page.Locator("#report-title")).ToHaveTextAsync("Shift report: late shift");
        await Assertions.Expect(Page.Locator("nav a[aria-current='page']")).ToHaveTextAsync("Shift report");
        await Assertions.Expect(Page.Locator("#f-shift")).ToHaveValueAsync("late");
        await Assertions.Expect(Page.Locator("#f-date")).ToHaveValueAsync("2026-12-01");
        // One date format (when(): the browser runs in en-GB, UTC) and the zone said once.
        await Assertions.Expect(Page.Locator("#report-summary")).ToContainTextAsync("01 Dec 2026, 14:00 – 01 Dec 2026, 22:00 (8.0 h), finished");
        await Assertions.Expect(Page.Locator(".zone-note")).ToContainTextAsync("Times are in UTC"); // the frame's footer
        var text = await Page.Locator("body").InnerTextAsync();
        Assert.True(Regex.Count(text, "UTC") == 1, $"the zone should be said once: {text}");
        Assert.DoesNotContain("2026-12-01", text, StringComparison.Ordinal); // no second date format (the date picker's value is not text)
        Assert.DoesNotContain("FinWatch:", text, StringComparison.Ordinal); // no configuration key
        Assert.DoesNotContain("TRI-TOP", text, StringComparison.Ordinal); // the chart's title, never its code

        // Needs action: the acknowledged alert is not closed and its chart is out of control, with links.
        var action = Page.Locator("#action-list");
        await Assertions.Expect(Page.Locator("#ooc-charts")).ToContainTextAsync("1 chart out of control:");
        await Assertions.Expect(Page.Locator("#ooc-charts li")).ToHaveTextAsync($"{Title} (1 alert not closed, worst high)");
        await Assertions.Expect(Page.Locator("#ooc-charts a")).ToHaveAttributeAsync("href", "chart.html?context=TRI-TOP");
        await Assertions.Expect(action).ToContainTextAsync("1 alert not closed in all");
        await Assertions.Expect(action.Locator("a[href='alerts.html?state=active']")).ToHaveCountAsync(1);
        await Assertions.Expect(action).Not.ToContainTextAsync("not yet acknowledged"); // it was acknowledged at 16:00

        // Signals by their measured time: wafer 5 of L0001 at 14:34, raised at 15:00 when it was uploaded.
        var signals = Page.Locator("#signals-measured-table tbody tr");
        await Assertions.Expect(signals).ToHaveCountAsync(1);
        await Assertions.Expect(signals.First.Locator("td").First).ToHaveTextAsync("01 Dec 2026, 14:34");
        await Assertions.Expect(signals.First).ToContainTextAsync("one point beyond a 3σ limit");
        await Assertions.Expect(signals.First).ToContainTextAsync(Title);
        await Assertions.Expect(signals.First.Locator("td").Last).ToHaveTextAsync("01 Dec 2026, 15:00");

        var open = Page.Locator("#open-alerts-table tbody tr");
        await Assertions.Expect(open).ToHaveCountAsync(1);
        await Assertions.Expect(open.First).ToHaveAttributeAsync("data-state", "acknowledged");
        await Assertions.Expect(open.First).ToContainTextAsync("L0001 · wafer 5");
        await Assertions.Expect(open.First.Locator("td").Last).ToContainTextAsync(" mV"); // predicted ΔVT sat with its unit

        await Assertions.Expect(Page.Locator("#actions-table tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#actions-table")).ToContainTextAsync("seen at the tool <b>held</b>"); // text, not markup
        var maintenance = Page.Locator("#maintenance-table tbody tr");
        await Assertions.Expect(maintenance).ToHaveCountAsync(1);
        await Assertions.Expect(maintenance).ToContainTextAsync("wet clean"); // in words, not the API's wet_clean
        await Assertions.Expect(maintenance).ToContainTextAsync("01 Dec 2026, 15:30");
        await Assertions.Expect(maintenance).ToContainTextAsync("Crew Amber");
        await Assertions.Expect(maintenance).ToContainTextAsync("test administrator"); // who recorded it through the API

        var lots = Page.Locator("#lots-table tbody tr");
        await Assertions.Expect(lots).ToHaveCountAsync(1);
        await Assertions.Expect(lots.First).ToContainTextAsync("5 wafers");
        await Assertions.Expect(lots.First).ToContainTextAsync("25 sites");

        // Capability leads with stability: the chart is out of control, so the indices do not predict. Cpk over the 7
        // days to 22:00 (P0001 and L0001, μ 6.15 nm): 0.35/(3 · 0.0841) = 1.39; the shift alone μ 6.3 nm → 0.79, the 7
        // days before μ 6.0 nm → 1.98 (ShiftReportTests, by hand).
        var capability = Page.Locator("#capability-table tbody tr");
        await Assertions.Expect(capability).ToHaveAttributeAsync("data-state", "out_of_control");
        await Assertions.Expect(capability).ToContainTextAsync("not stable: indices do not predict");
        await Assertions.Expect(capability).ToContainTextAsync("6.150 nm");
        await Assertions.Expect(capability).ToContainTextAsync("Cpk 1.39 (10 points)");
        await Assertions.Expect(capability).ToContainTextAsync("Cpk 0.79; −1.19 against the 7 days before");
        await Assertions.Expect(Page.Locator("#risks-table tbody tr")).ToHaveCountAsync(5);
        await Assertions.Expect(Page.Locator("#risks-table tbody tr").First).ToContainTextAsync("L0001 · wafer 5");
        await Assertions.Expect(Page.Locator("#report-caution")).ToContainTextAsync("not measured thresholds");

        await AssertNoHorizontalOverflowAtAsync(FloorScreens);
        await Page.SetViewportSizeAsync(1366, 768);
        await ScreenshotIfAskedAsync("shift-report-1366");

        var href = await Page.Locator("#csv-link").GetAttributeAsync("href");
        Assert.Equal("/api/reports/shift.csv?date=2026-12-01&shift=late", href);
        var csv = await Client.GetAsync(href);
        Assert.Equal("text/csv", csv.Content.Headers.ContentType?.MediaType);

        // Print: no controls, no section without content (the handover of this shift has no notes, but says so).
        await Page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Print });
        await Assertions.Expect(Page.Locator("#shift-form")).ToBeHiddenAsync();
        await Assertions.Expect(Page.Locator(".strip nav")).ToBeHiddenAsync();
        await Assertions.Expect(Page.Locator("#save-notes")).ToBeHiddenAsync();
        await Assertions.Expect(Page.Locator("#s-handover .print-only")).ToBeVisibleAsync();
        await Page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Screen });

        // Another shift by the pickers: the early shift had nothing, and its empty sections are left out of print.
        await Page.Locator("#f-shift").SelectOptionAsync("early");
        await Page.Locator("#show-shift").ClickAsync();
        await Assertions.Expect(Page.Locator("#report-title")).ToHaveTextAsync("Shift report: early shift");
        await Assertions.Expect(Page.Locator("#signals-measured-none")).ToHaveTextAsync("No point measured in this shift fired a rule.");
        await Assertions.Expect(Page.Locator("#maintenance-none")).ToHaveTextAsync("No chamber maintenance finished in this shift.");
        await Assertions.Expect(Page.Locator("#csv-link")).ToHaveAttributeAsync("href", "/api/reports/shift.csv?date=2026-12-01&shift=early");
        await Page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Print });
        await Assertions.Expect(Page.Locator("#s-maintenance")).ToBeHiddenAsync();
        await Assertions.Expect(Page.Locator("#s-capability")).ToBeVisibleAsync();
        await Page.EmulateMediaAsync(new PageEmulateMediaOptions { Media = Media.Screen });
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task Handover_OutgoingWritesAndSigns_IncomingSignsAsAnotherPerson()
    {
        const string notes = "ETA-1 back after the wet clean.\nRe-measure lot L0001 wafer 5 before release.";
        await OpenAsync("shift.html?date=2026-12-01&shift=late");
        await Assertions.Expect(Page.Locator("#signed-outgoing")).ToContainTextAsync("not signed");
        await Assertions.Expect(Page.Locator("#sign-outgoing")).ToHaveCountAsync(0); // nothing written yet, nothing to sign

        await Page.Locator("#handover-notes").FillAsync(notes);
        await Page.Locator("#save-notes").ClickAsync();
        await Assertions.Expect(Page.Locator("#notes-form")).ToContainTextAsync($"last saved by {Person}, 01 Dec 2026, 23:00");
        await Assertions.Expect(Page.Locator("#handover-notes")).ToHaveValueAsync(notes);

        await Page.Locator("#sign-outgoing").ClickAsync();
        await Assertions.Expect(Page.Locator("#signed-outgoing")).ToContainTextAsync($"signed by {Person}, 01 Dec 2026, 23:00");
        await Assertions.Expect(Page.Locator("#notes-form")).ToHaveCountAsync(0); // locked: shown as text now
        await Assertions.Expect(Page.Locator("#handover-text")).ToHaveTextAsync(notes);
        await Assertions.Expect(Page.Locator("#sign-incoming")).ToHaveCountAsync(0); // not for the same person
        await Assertions.Expect(Page.Locator("#signed-incoming")).ToContainTextAsync("another person than the outgoing supervisor signs");

        // The incoming supervisor signs in as themselves.
        const string incoming = "shift supervisor 3"; // invented
        var added = await Client.PostAsJsonAsync("/api/people", new { name = incoming, role = "supervisor", password = PersonPassword });
        Assert.True(added.IsSuccessStatusCode, await added.Content.ReadAsStringAsync());
        await Page.Locator("#sign-out").ClickAsync();
        await Page.WaitForURLAsync("**/signin.html");
        await Page.Locator("#name").FillAsync(incoming);
        await Page.Locator("#password").FillAsync(PersonPassword);
        await Page.Locator("#password").PressAsync("Enter");
        await Assertions.Expect(Page.Locator(".strip .who")).ToContainTextAsync(incoming);
        Factory.Clock.SetUtcNow(Day.AddHours(23.25));
        await OpenAsync("shift.html?date=2026-12-01&shift=late");
        await Page.Locator("#sign-incoming").ClickAsync();
        await Assertions.Expect(Page.Locator("#signed-incoming")).ToContainTextAsync($"signed by {incoming}, 01 Dec 2026, 23:15");
        await Assertions.Expect(Page.Locator("#signed-outgoing")).ToContainTextAsync($"signed by {Person}");

        var audit = await Client.GetFromJsonAsync<JsonElement>("/api/audit?entity=handover");
        Assert.Equal(["signed_incoming", "signed_outgoing", "notes_written"], audit.EnumerateArray().Select(a => a.GetProperty("action").GetString()));
        Assert.Equal([incoming, Person, Person], audit.EnumerateArray().Select(a => a.GetProperty("by").GetString()));

        await AssertNoHorizontalOverflowAtAsync(FloorScreens);
        await Page.SetViewportSizeAsync(1366, 768);
        await ScreenshotIfAskedAsync("shift-handover-1366");
        AssertNoPageProblems();
    }
}
