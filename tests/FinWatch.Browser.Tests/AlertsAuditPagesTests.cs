using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// The alerts page as a floor works from it (the excursion first, then the action, the points folded away, the filters
/// in the address) and the audit trail as short before → after lists, both without sideways scrolling on the usual
/// screens. The alert comes from the fixture's hand-computable data (MonitorFixture): a wafer mean 0.5 nm above the
/// centre fires WE1 (see LivePagesTests).
/// </summary>
public sealed partial class AlertsAuditPagesTests(BrowserFixture browser) : BrowserTest(browser)
{
    // The pages' one date-time format (format.js `when`, en-GB in the test browser): "26 Nov 2026, 06:00".
    [GeneratedRegex(@"\d\d [A-Z][a-z]{2} \d{4}, \d\d:\d\d")]
    private static partial Regex PageTime();

    public override async Task InitializeAsync()
    {
        await base.InitializeAsync();
        await TestProducts.CreateBothAsync(Client);
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
    }

    private async Task<long> RaiseAlertAsync()
    {
        await IngestAsync(Client, Wafers("M0009", MonitorDay, 0.5)); // measured 26 Nov 2026 06:00 UTC
        var alerts = await Client.GetFromJsonAsync<JsonElement>("/api/alerts?state=active");
        return alerts.EnumerateArray().Single().GetProperty("id").GetInt64();
    }

    [BrowserFact]
    public async Task AlertsPage_Detail_ShowsTheExcursionBeforeTheAction_PointsFolded_AndAcknowledges()
    {
        var id = await RaiseAlertAsync();
        await OpenAsync("alerts.html");
        await WaitLiveAsync();
        var item = Page.Locator($".alert-item[data-alert='{id}']");
        await Assertions.Expect(item.Locator(".measured")).ToHaveTextAsync("Signals measured 26 Nov 2026, 06:00"); // the measured time, not the record time
        await Assertions.Expect(item.Locator(".alert-state")).ToHaveTextAsync("open, not yet acknowledged");
        Assert.Equal(0, await Page.GetByRole(AriaRole.Button, new() { Name = "open", Exact = true }).CountAsync()); // no button named like a state
        await item.GetByRole(AriaRole.Button, new() { Name = "Show", Exact = true }).ClickAsync();

        var excursion = Page.Locator("#detail #excursion");
        await Assertions.Expect(excursion).ToContainTextAsync("WE1: one point beyond a 3σ limit");
        ILocator Fact(string label) => excursion.Locator("tr", new() { Has = Page.Locator("th", new() { HasTextString = label }) }).Locator("td");
        await Assertions.Expect(Fact("First signal measured")).ToHaveTextAsync("26 Nov 2026, 06:00");
        await Assertions.Expect(Fact("Back in control")).ToHaveTextAsync("not yet");
        await Assertions.Expect(Fact("Involves")).ToHaveTextAsync("1 point · 1 signal point · 1 lot · 1 wafer");
        await Assertions.Expect(Fact("Raised")).ToHaveTextAsync(PageTime());
        await Assertions.Expect(excursion.Locator(".state")).ToHaveTextAsync("signalling");
        await Assertions.Expect(excursion.Locator(".alert-state")).ToHaveTextAsync("open, not yet acknowledged");
        // The excursion comes first, then the action, the reaction plan and the (folded) points.
        var order = await Page.EvaluateAsync<string[]>(
            "() => [...document.querySelectorAll('#detail > *')].map((e) => e.id || e.getAttribute('aria-label') || e.tagName.toLowerCase())");
        Assert.Equal(["h2", "excursion", "action", "reaction plan"], order.Take(4).ToArray());
        Assert.True(Array.IndexOf(order, "points") > Array.IndexOf(order, "action"), string.Join(", ", order));
        await Assertions.Expect(Page.Locator("#points")).Not.ToHaveAttributeAsync("open", "");
        await Assertions.Expect(Page.Locator("#points table")).ToBeHiddenAsync();
        await Assertions.Expect(Page.Locator("#detail .plan")).ToContainTextAsync("Hold the lot");
        await AssertNoHorizontalOverflowAtAsync(FloorScreens);
        await ScreenshotIfAskedAsync("alerts-detail-1920");
        await Page.SetViewportSizeAsync(1366, 768);
        await ScreenshotIfAskedAsync("alerts-detail-1366");

        await Page.Locator("#action-comment").FillAsync("seen at the tool, lot held");
        await Page.Locator("#action-button").ClickAsync();
        await Assertions.Expect(excursion.Locator(".alert-state")).ToHaveTextAsync("acknowledged");
        await Assertions.Expect(Fact("Acknowledged")).ToContainTextAsync($"by {Person}");
        await Assertions.Expect(item.Locator(".alert-state")).ToHaveTextAsync("acknowledged");
        await Assertions.Expect(Page.Locator("#action h3")).ToHaveTextAsync("Record the steps taken");
        await Assertions.Expect(Page.Locator("#action .checklist")).ToContainTextAsync("Check the etch chamber log");
        var detail = await Client.GetFromJsonAsync<JsonElement>($"/api/alerts/{id}");
        Assert.Equal("acknowledged", detail.GetProperty("alert").GetProperty("state").GetString());

        await Page.Locator("#points summary").ClickAsync();
        await Assertions.Expect(Page.Locator("#points table tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#points table tbody")).ToContainTextAsync("M0009");
        await AssertNoHorizontalOverflowAtAsync(FloorScreens);
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task AlertsPage_Filters_AreKeptInTheAddress_AndSurviveAReload()
    {
        var id = await RaiseAlertAsync();
        await OpenAsync("alerts.html");
        await WaitLiveAsync();
        var item = Page.Locator($".alert-item[data-alert='{id}']");
        await Assertions.Expect(item).ToBeVisibleAsync();

        await Page.Locator("#f-context").SelectOptionAsync("TRI-TOP");
        await Page.Locator("#f-state").SelectOptionAsync("closed");
        await Assertions.Expect(Page.Locator("#queue")).ToContainTextAsync("No alert matches");
        await Assertions.Expect(Page).ToHaveURLAsync(new Regex(@"\?state=closed&context=TRI-TOP$"));

        await Page.ReloadAsync();
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator("#f-state")).ToHaveValueAsync("closed");
        await Assertions.Expect(Page.Locator("#f-context")).ToHaveValueAsync("TRI-TOP");
        await Assertions.Expect(Page.Locator("#queue")).ToContainTextAsync("No alert matches"); // the open alert stays filtered out

        // "all states" is spelled out in the address: without it a reload would fall back to the active alerts.
        await Page.Locator("#f-state").SelectOptionAsync("");
        await Assertions.Expect(item).ToBeVisibleAsync();
        await Assertions.Expect(Page).ToHaveURLAsync(new Regex(@"\?context=TRI-TOP&state=all$"));
        await item.GetByRole(AriaRole.Button, new() { Name = "Show", Exact = true }).ClickAsync();
        await Assertions.Expect(Page).ToHaveURLAsync(new Regex($@"state=all&alert={id}$"));
        await Page.ReloadAsync();
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator("#f-state")).ToHaveValueAsync("");
        await Assertions.Expect(Page.Locator("#detail h2")).ToContainTextAsync($"Alert {id}");
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task AuditPage_AChangedProduct_ShowsBeforeAndAfterRounded_WithTheRecordFolded()
    {
        // The test product with a new top width and taper limit, given to more digits than anyone reads.
        var changed = await Client.PutAsJsonAsync($"/api/products/{TestProducts.TriGate}", new
        {
            code = TestProducts.TriGate, name = "Test product " + TestProducts.TriGate, description = "invented for tests", gate_faces = "tri-gate",
            nominal = new { top_width_nm = 6.123456, bottom_width_nm = 10.0, fin_height_nm = 42.0, corner_radius_nm = 2.0, liner_thickness_nm = 2.5 },
            specs = new[] { new { parameter = "taper_deg", lower = (double?)null, target = (double?)2.7, upper = (double?)3.987654 } },
        });
        changed.EnsureSuccessStatusCode();

        await OpenAsync("audit.html");
        var entry = Page.Locator("#audit tbody tr", new() { HasText = "changed" }).Filter(new() { HasText = TestProducts.TriGate });
        var list = entry.Locator("ul.changes");
        // 4 significant digits (6.123456 → 6.123, 3.987654 → 3.988), integers as they are, each with its unit.
        await Assertions.Expect(list).ToContainTextAsync("nominal · Fin top width: 6 nm → 6.123 nm");
        await Assertions.Expect(list).ToContainTextAsync("specs · Sidewall taper · upper spec: 4° → 3.988°");
        await Assertions.Expect(list).Not.ToContainTextAsync("top_width_nm"); // the field in words, not its stored name
        await Assertions.Expect(list).Not.ToContainTextAsync("6.123456");
        var stored = entry.Locator("details.stored");
        await Assertions.Expect(stored).Not.ToHaveAttributeAsync("open", "");
        await Assertions.Expect(stored.Locator(".audit-json").First).ToBeHiddenAsync();
        await stored.Locator("summary").ClickAsync();
        await Assertions.Expect(stored.Locator(".audit-json").Last).ToContainTextAsync("\"top_width_nm\": 6.123456");

        // A creation lists every field; the list stops after a few with the count of the rest.
        // (the product's own entry: the chart created on it names the product too)
        var created = Page.Locator("#audit tbody tr", new() { HasText = "created" })
            .Filter(new() { Has = Page.Locator("td", new() { HasTextRegex = new Regex("^product$") }) }).Filter(new() { HasText = TestProducts.TriGate });
        var createdList = created.Filter(new() { Has = Page.Locator("li.more") }).Locator("ul.changes");
        await Assertions.Expect(createdList.Locator("li")).ToHaveCountAsync(7);
        await Assertions.Expect(createdList.Locator("li.more")).ToHaveTextAsync(new Regex(@"^and \d+ more$"));
        // The limits approved by the fixture: its status and approval, not the whole record.
        var approved = Page.Locator("#audit tbody tr", new() { HasText = "approved" }).First;
        await Assertions.Expect(approved.Locator("ul.changes")).ToContainTextAsync("status: draft → approved");
        await Assertions.Expect(approved.Locator("ul.changes")).ToContainTextAsync(new Regex("approved at: none → " + PageTime()));

        await AssertNoHorizontalOverflowAtAsync(FloorScreens);
        foreach (var row in await Page.Locator("#audit tbody tr").AllAsync())
        {
            var box = await row.BoundingBoxAsync();
            Assert.True(box is { Height: < 768 * 0.6f }, $"an entry is {box?.Height} px high on a 768 px screen");
        }

        await ScreenshotIfAskedAsync("audit-1366");
        await Page.SetViewportSizeAsync(1920, 1080);
        await ScreenshotIfAskedAsync("audit-1920");
        AssertNoPageProblems();
    }
}
