using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// The floor pages against the real server: live updates without reload, the alert lifecycle by mouse and keyboard.
/// The expected states follow from the fixture's hand-computable data (MonitorFixture): a wafer mean 0.5 nm above the
/// centre is about 6 σ of the mean away (σ of the mean 0.0791/√5·… see MonitorEndpointsTests) and fires WE1.
/// </summary>
public sealed class LivePagesTests(BrowserFixture browser) : MonitoredChartTest(browser)
{
    [BrowserFact]
    public async Task ChartPage_PostingALot_AddsItsPointsAndSignalsWithoutReload()
    {
        await OpenAsync("chart.html?context=TRI-TOP&range=all");
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator("#legend")).ToContainTextAsync("20 points shown");
        await Assertions.Expect(Page.Locator("#signals tbody")).ToContainTextAsync("No rule fired");
        await Assertions.Expect(Page.Locator("#key")).ToContainTextAsync("No rule fired in this range.");
        var navigations = 0;
        Page.FrameNavigated += (_, _) => navigations++;
        // The charts are created once: a live point updates the same Chart.js instances in place.
        await Page.EvaluateAsync("() => { window.before = ['#control', '#dvt'].map((s) => Chart.getChart(document.querySelector(s))); }");

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.0, 0.5));

        await Assertions.Expect(Page.Locator("#legend")).ToContainTextAsync("22 points shown");
        await Assertions.Expect(Page.Locator("#signals tbody tr")).ToHaveCountAsync(1);
        await Assertions.Expect(Page.Locator("#signals tbody tr").First).ToContainTextAsync("WE1");
        await Assertions.Expect(Page.Locator("#signals tbody tr").First).ToContainTextAsync("M0001");
        await Assertions.Expect(Page.Locator("#summary")).ToContainTextAsync("out of control");
        // The rule is a shape on the plot and a line of the key with its meaning, not text on the data.
        await Assertions.Expect(Page.Locator("#key .rule-key dt")).ToHaveTextAsync("WE1 · 1 point");
        await Assertions.Expect(Page.Locator("#key .rule-key dd")).ToContainTextAsync("3σ");
        Assert.True(await Page.EvaluateAsync<bool>(
            "() => ['#control', '#dvt'].every((s, i) => Chart.getChart(document.querySelector(s)) === window.before[i])"));
        Assert.Equal(0, navigations);
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task FloorOverview_TileTurnsOutOfControl_WhenARuleFires()
    {
        await OpenAsync("index.html");
        await WaitLiveAsync();
        var tile = Page.Locator(".tile[data-context='TRI-TOP']");
        await Assertions.Expect(tile).ToHaveAttributeAsync("data-state", "in_control");
        await Assertions.Expect(tile.Locator(".state")).ToHaveTextAsync("in control");

        await IngestAsync(Client, Wafers("M0002", MonitorDay, 0.5));

        await Assertions.Expect(tile).ToHaveAttributeAsync("data-state", "out_of_control");
        await Assertions.Expect(tile.Locator(".state")).ToHaveTextAsync("out of control"); // in words, not colour alone
        await Assertions.Expect(tile).ToContainTextAsync("1 active alert");
        await Assertions.Expect(Page.Locator("#tally")).ToContainTextAsync("1 out of control");
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task AlertsPage_AnAlertIsAcknowledgedDispositionedAndClosed()
    {
        await IngestAsync(Client, Wafers("M0003", MonitorDay, 0.5));
        var alerts = await Client.GetFromJsonAsync<JsonElement>("/api/alerts?state=active");
        var id = alerts.EnumerateArray().Single().GetProperty("id").GetInt64();

        await OpenAsync("alerts.html");
        await WaitLiveAsync();
        var item = Page.Locator($".alert-item[data-alert='{id}']");
        await Assertions.Expect(item).ToHaveAttributeAsync("data-state", "open");
        await item.GetByRole(AriaRole.Button).ClickAsync();
        await Assertions.Expect(Page.Locator("#detail h2")).ToContainTextAsync($"Alert {id}: excursion on");
        await Assertions.Expect(Page.Locator("#detail")).ToContainTextAsync("WE1: one point beyond a 3σ limit");
        await Assertions.Expect(Page.Locator("#detail .state")).ToHaveTextAsync("signalling"); // the condition in words

        await Page.Locator("#action-comment").FillAsync("seen at the tool <b>held</b>");
        await Page.Locator("#action-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#detail")).ToContainTextAsync("acknowledged by");
        await Assertions.Expect(Page.Locator("#detail .history")).ToContainTextAsync("seen at the tool <b>held</b>"); // comment shown as text

        await Page.GetByRole(AriaRole.Checkbox, new() { Name = "Hold the lot" }).CheckAsync();
        await Page.GetByLabel("note for: Check the etch chamber log").FillAsync("log clean");
        await Page.Locator("#action-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#detail .history")).ToContainTextAsync("✔ done: Hold the lot");
        await Assertions.Expect(Page.Locator("#detail .history")).ToContainTextAsync("✘ not done: Check the etch chamber log (log clean)");

        // Wait for the close form (the dispositioned alert re-renders), then say why.
        await Assertions.Expect(Page.Locator("label[for='action-comment']")).ToHaveTextAsync("Why can it be closed? (required)");
        await Page.Locator("#action-comment").FillAsync("re-measured: within limits");
        await Page.Locator("#action-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#detail")).ToContainTextAsync("closed by");

        var detail = await Client.GetFromJsonAsync<JsonElement>($"/api/alerts/{id}");
        Assert.Equal("closed", detail.GetProperty("alert").GetProperty("state").GetString());
        Assert.Equal(["raised", "acknowledged", "dispositioned", "closed"], detail.GetProperty("history").EnumerateArray().Select(h => h.GetProperty("kind").GetString()!).ToArray());
        await Page.Locator("#f-state").SelectOptionAsync("active");
        await Assertions.Expect(Page.Locator("#queue")).ToContainTextAsync("No alert matches");
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task LimitsPage_ComputesADraftWithItsBaselineCheck_AndASecondEngineerApprovesAnotherWithAJustification()
    {
        await OpenAsync("limits.html?context=TRI-TOP");
        await Assertions.Expect(Page.Locator("#versions tbody tr")).ToHaveCountAsync(1);
        await Page.Locator("#from-seq").FillAsync("1");
        await Page.Locator("#to-seq").FillAsync("20");
        await Page.Locator("#reason").FillAsync("re-baseline after chamber clean");
        await Page.Locator("#compute-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#compute-result")).ToContainTextAsync("Draft v2: centre 6.000 nm");
        await Assertions.Expect(Page.Locator("#compute-result")).ToContainTextAsync("baseline check: not stable");
        var draft = Page.Locator("#versions tr[data-version='2']");
        await Assertions.Expect(draft).ToHaveAttributeAsync("data-status", "draft");
        await Assertions.Expect(draft.Locator(".state")).ToHaveTextAsync("not stable"); // in words, with its shape
        await Assertions.Expect(draft).ToContainTextAsync("only 20 subgroups");

        // Another engineer (the test's administrator) computed v3; the person in the browser approves it, with the
        // justification an unstable baseline needs.
        (await Client.PostAsJsonAsync("/api/contexts/TRI-TOP/limits", new { from_seq = 1, to_seq = 20, reason = "second look" })).EnsureSuccessStatusCode();
        await Page.ReloadAsync();
        var v3 = Page.Locator("#versions tr[data-version='3']");
        await v3.GetByLabel("justification for approving v3").FillAsync("20 identical wafers: accepted for this qualification run");
        await v3.GetByRole(AriaRole.Button, new() { Name = "Approve v3" }).ClickAsync();
        await Assertions.Expect(Page.Locator("#versions tr[data-version='3']")).ToHaveAttributeAsync("data-status", "approved");
        await Assertions.Expect(Page.Locator("#versions tr[data-version='3']")).ToContainTextAsync("approved although not stable: 20 identical wafers");
        AssertNoPageProblems();
    }
}
