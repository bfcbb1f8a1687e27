using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// Alerts brought to people: the wall screen's banner and tone, desktop notifications, the rules page, the roster and
/// the deliveries page, against the real server and the monitor fixture's chart (a wafer 0.5 nm off fires WE1).
/// </summary>
public sealed class NotificationPagesTests(BrowserFixture browser) : MonitoredChartTest(browser)
{
    private async Task<string> ChartTitleAsync() =>
        (await Client.GetFromJsonAsync<JsonElement>($"/api/contexts/{Chart}")).GetProperty("title").GetString()!;

    private async Task<long> OpenAlertAsync(string lot) =>
        (await Client.GetFromJsonAsync<JsonElement>("/api/alerts?state=open")).EnumerateArray().Single(a => a.GetProperty("lot_id").GetString() == lot)
            .GetProperty("id").GetInt64();

    [BrowserFact]
    public async Task WallScreen_ShowsTheBannerWithATone_UntilTheAlertIsAcknowledged_AlsoAfterAReloadWithADisplayToken()
    {
        var title = await ChartTitleAsync();
        await Page.SetViewportSizeAsync(1920, 1080);
        await OpenAsync("index.html?layout=wall");
        await WaitLiveAsync();
        var banner = Page.Locator("#alarm");
        var sound = Page.Locator("#sound");
        await Assertions.Expect(sound).ToHaveAttributeAsync("data-sound", "off");
        await Page.Locator("#alarm-on").CheckAsync(); // the click is the gesture that lets the browser play sound
        await Assertions.Expect(sound).ToHaveAttributeAsync("data-sound", "quiet");
        await Assertions.Expect(banner).ToBeHiddenAsync(); // nothing waits to be acknowledged

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5));

        await Assertions.Expect(banner).ToBeVisibleAsync();
        await Assertions.Expect(banner.Locator("h2")).ToHaveTextAsync("1 alert waiting to be acknowledged");
        var item = banner.Locator(".alarm-item");
        await Assertions.Expect(item).ToContainTextAsync(title);
        await Assertions.Expect(item).ToContainTextAsync("one point beyond a 3σ limit"); // the rule in words
        await Assertions.Expect(item.Locator(".sev")).ToHaveTextAsync(new Regex("^(low|medium|high|critical)$"));
        await Assertions.Expect(item).ToContainTextAsync("lot M0001 wafer 1");
        await Assertions.Expect(item).ToContainTextAsync("raised 01 Dec 2026");
        await Assertions.Expect(item.Locator(".alert-state")).ToHaveTextAsync("open, not yet acknowledged");
        await Assertions.Expect(sound).ToHaveAttributeAsync("data-sound", "playing");
        await Assertions.Expect(sound).ToContainTextAsync("a tone plays every 15 s until every alert here is acknowledged");
        var size = await banner.Locator(".alarm-item").EvaluateAsync<double>("e => parseFloat(getComputedStyle(e).fontSize)");
        Assert.True(size >= 24, $"banner type {size} px on a wall screen");
        await ScreenshotIfAskedAsync("wall-banner");
        await AssertNoSidewaysScrollAsync();

        // A wall screen opened with a display token, which cannot acknowledge: it remembers the choice and, loaded
        // after the alert was raised, still shows it. Its browser has had no click yet, so sound waits for one.
        var created = await (await Client.PostAsJsonAsync("/api/keys", new { name = "wall screen bay 2", scope = "display" })).Content.ReadFromJsonAsync<JsonElement>();
        await using var screenContext = await Chromium.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1920, Height = 1080 }, Locale = "en-GB", TimezoneId = "UTC" });
        var screen = await screenContext.NewPageAsync();
        var screenProblems = new List<string>();
        screen.PageError += (_, e) => screenProblems.Add(e);
        screen.Response += (_, r) =>
        {
            if (r.Status >= 400)
            {
                screenProblems.Add($"{r.Status} {r.Url}");
            }
        };
        await screen.AddInitScriptAsync("localStorage.setItem('finwatch.notify.wall', 'on')");
        await screen.GotoAsync($"{BaseUrl.TrimEnd('/')}/display/{created.GetProperty("key").GetString()}");
        await Assertions.Expect(screen.Locator(".demo-mark")).ToContainTextAsync("Wall screen");
        await Assertions.Expect(screen.Locator("#alarm .alarm-item")).ToContainTextAsync("lot M0001 wafer 1");
        var screenSound = screen.Locator("#sound");
        if (await screenSound.GetAttributeAsync("data-sound") == "blocked")
        {
            await Assertions.Expect(screenSound).ToContainTextAsync("plays sound only after someone clicks");
            await ScreenshotIfAskedAsync("wall-banner-sound-blocked", screen);
            await screen.Locator("#allow-sound").ClickAsync();
        }

        await Assertions.Expect(screenSound).ToHaveAttributeAsync("data-sound", "playing");
        await Assertions.Expect(screen.Locator("#allow-sound")).ToBeHiddenAsync();

        var id = await OpenAlertAsync("M0001");
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment = "seen at the tool" })).EnsureSuccessStatusCode();

        await Assertions.Expect(banner).ToBeHiddenAsync();
        await Assertions.Expect(sound).ToHaveAttributeAsync("data-sound", "quiet");
        await Assertions.Expect(screen.Locator("#alarm")).ToBeHiddenAsync();
        await Assertions.Expect(screenSound).ToHaveAttributeAsync("data-sound", "quiet");
        Assert.True(screenProblems.Count == 0, string.Join(" | ", screenProblems));
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task RulesPage_AddsABrowserRuleInWords_ShowsUnavailableChannelsWithTheReason_AndRemovesIt()
    {
        await OpenAsync("notify.html");
        await Assertions.Expect(Page.Locator("#ch-email")).ToBeDisabledAsync();
        await Assertions.Expect(Page.Locator("label[for='ch-email']")).ToContainTextAsync("not available: not set up on this FinWatch");
        await Assertions.Expect(Page.Locator("label[for='ch-webhook']")).ToContainTextAsync("not available: none configured");
        await Assertions.Expect(Page.Locator("#escalation li").First).ToContainTextAsync("min without acknowledgement: to the supervisors on shift");
        await Assertions.Expect(Page.Locator("#rules")).ToContainTextAsync("No rule yet");

        await Page.Locator("#r-severity").SelectOptionAsync("medium");
        await Page.Locator("#r-context").SelectOptionAsync(Chart);
        await Page.Locator("#r-add").ClickAsync();

        var row = Page.Locator("#rule-table tbody tr");
        await Assertions.Expect(row).ToHaveCountAsync(1);
        await Assertions.Expect(row).ToContainTextAsync($"Alerts of medium and above, chart {Chart} by browser");
        await Assertions.Expect(Page.Locator("#rule-result")).ToContainTextAsync("Added:");
        var stored = await Client.GetFromJsonAsync<JsonElement>($"/api/notifications/rules?owner={Uri.EscapeDataString(Person)}");
        Assert.Equal("medium", stored.EnumerateArray().Single().GetProperty("min_severity").GetString());
        await ScreenshotIfAskedAsync("notify-me");

        await row.GetByRole(AriaRole.Button, new() { Name = "remove" }).ClickAsync();
        await Assertions.Expect(Page.Locator("#rules")).ToContainTextAsync("No rule yet");
        Assert.Empty((await Client.GetFromJsonAsync<JsonElement>($"/api/notifications/rules?owner={Uri.EscapeDataString(Person)}")).EnumerateArray());
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task DesktopNotification_ForANewAlertThatABrowserRuleTakes_AfterOptingIn()
    {
        // The browser's notifications are recorded: headless Chromium shows none. The permission lives in storage, as a
        // browser keeps it across pages.
        await Page.AddInitScriptAsync("""
            window.told = [];
            window.Notification = class {
              static get permission() { return localStorage.getItem('test.permission') ?? 'default'; }
              static async requestPermission() { localStorage.setItem('test.permission', 'granted'); return 'granted'; }
              constructor(title, options) { window.told.push({ title, body: options.body }); }
              close() {}
            };
            """);
        (await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "browser", min_severity = "low", context = Chart, owner = Person })).EnsureSuccessStatusCode();
        (await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "browser", min_severity = "low", product = TestProducts.DoubleGate, owner = Person }))
            .EnsureSuccessStatusCode();
        await OpenAsync("notify.html");
        await Assertions.Expect(Page.Locator("#desktop-state")).ToContainTextAsync("Off:");
        await Page.Locator("#desktop-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#desktop-state")).ToHaveAttributeAsync("data-on", "true");

        await OpenAsync("alerts.html");
        await WaitLiveAsync();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5));

        await Page.WaitForFunctionAsync("() => window.told.length > 0");
        await Assertions.Expect(Page.Locator(".alert-item")).ToHaveCountAsync(1);
        var told = await Page.EvaluateAsync<JsonElement>("() => window.told");
        var note = told.EnumerateArray().Single(); // once, although the page and the navigation both hear of the alert
        Assert.Contains("out of control", note.GetProperty("title").GetString(), StringComparison.Ordinal);
        var body = note.GetProperty("body").GetString()!;
        Assert.Contains("WE1: one point beyond a 3σ limit", body, StringComparison.Ordinal);
        Assert.Contains("lot M0001 wafer 1", body, StringComparison.Ordinal);
        Assert.Contains($"Your rule: Alerts of low and above, chart {Chart} by browser", body, StringComparison.Ordinal);
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task RosterPage_ShowsTheServersObjectionOnItsLine_ThenSavesAndShowsWhoIsOnShift()
    {
        ExpectedFailures.Add("/api/roster"); // the refused save, on purpose
        await OpenAsync("roster.html");
        // The test server's clock stands at 08:00 UTC: the early shift (06:00 to 14:00) is running, nobody on it yet.
        await Assertions.Expect(Page.Locator("#now-body")).ToContainTextAsync("early shift");
        await Assertions.Expect(Page.Locator("#now-body")).ToContainTextAsync("Nobody on the roster for this shift");

        await Page.Locator("#add-line").ClickAsync();
        await Page.GetByLabel("line 1: person").FillAsync(Person);
        await Page.GetByLabel("line 1: from").FillAsync("2026-11-01");
        await Page.Locator("#add-line").ClickAsync();
        await Page.GetByLabel("line 2: person").FillAsync("nobody of this fab");
        await Page.GetByLabel("line 2: from").FillAsync("2026-11-01");
        await Page.Locator("#save-roster").ClickAsync();

        var second = Page.Locator("#roster tbody tr").Nth(1);
        await Assertions.Expect(second).ToHaveClassAsync(new Regex(@"\bbad\b"));
        await Assertions.Expect(second.Locator("td.why")).ToContainTextAsync("line 2: 'nobody of this fab' is not a person in FinWatch");
        await Assertions.Expect(second.GetByLabel("line 2: person")).ToHaveClassAsync(new Regex(@"\binvalid\b"));
        await Assertions.Expect(Page.Locator("#roster tbody tr").First).Not.ToHaveClassAsync(new Regex(@"\bbad\b"));
        await ScreenshotIfAskedAsync("roster-error");

        await second.GetByRole(AriaRole.Button, new() { Name = "remove line 2" }).ClickAsync();
        await Page.Locator("#save-roster").ClickAsync();
        await Assertions.Expect(Page.Locator("#roster-result")).ToContainTextAsync("Saved: 1 line.");
        await Assertions.Expect(Page.Locator("#now-body")).ToContainTextAsync(Person);
        await Assertions.Expect(Page.Locator("#now-body")).ToContainTextAsync($"Alerts not acknowledged in time go first to {Person}.");
        var roster = await Client.GetFromJsonAsync<JsonElement>("/api/roster");
        var entry = roster.GetProperty("entries").EnumerateArray().Single();
        Assert.Equal(("early", Person, "2026-11-01"), (entry.GetProperty("shift").GetString(), entry.GetProperty("person").GetString(), entry.GetProperty("from").GetString()));
        AssertNoPageProblems();
    }
}

/// <summary>A webhook whose receiver cannot be reached, tried once: its messages fail, and the deliveries page lists them.</summary>
public sealed class DeliveriesPageTests(BrowserFixture browser) : MonitoredChartTest(browser)
{
    protected override void Configure(FinWatchAppFactory factory) =>
        factory.With("FinWatch:Notify:Webhooks:0:Name", "lot-hold").With("FinWatch:Notify:Webhooks:0:Url", "http://127.0.0.1:9/alerts") // nothing listens on port 9
            .With("FinWatch:Notify:Webhooks:0:Secret", "an invented secret of some length").With("FinWatch:Notify:MaxAttempts", "1")
            .With("FinWatch:Notify:PollSeconds", "0.1");

    private async Task<JsonElement[]> FailedAsync() =>
        [.. (await Client.GetFromJsonAsync<JsonElement>("/api/notifications/messages?status=failed")).EnumerateArray()];

    /// <summary>A webhook rule of the test's administrator, an alert it takes, and the call failed; returns the alert's id.</summary>
    private async Task<long> FailedCallAsync()
    {
        (await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "webhook", webhook = "lot-hold", min_severity = "low" })).EnsureSuccessStatusCode();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5));
        var until = DateTime.UtcNow.AddSeconds(20);
        while ((await FailedAsync()).Length == 0)
        {
            Assert.True(DateTime.UtcNow < until, "the webhook call did not fail within 20 s");
            await Task.Delay(100);
        }

        return (await FailedAsync()).Single().GetProperty("alert_id").GetInt64();
    }

    [BrowserFact]
    public async Task FailedWebhookCall_IsListedWithItsLog_OnTheAlertToo_AndASupervisorSendsItAgain()
    {
        var alert = await FailedCallAsync();
        await OpenAsync("deliveries.html");
        var message = Page.Locator(".message");
        await Assertions.Expect(message).ToHaveCountAsync(1);
        await Assertions.Expect(message.Locator(".send-state")).ToHaveTextAsync("failed");
        await Assertions.Expect(message.Locator($"a[href='alerts.html?state=all&alert={alert}']")).ToBeVisibleAsync();
        await Assertions.Expect(message).ToContainTextAsync("webhook lot-hold · 1 attempt");
        await Assertions.Expect(message).ToContainTextAsync("alert raised, for test administrator"); // the rule's owner
        await Assertions.Expect(message.Locator(".error")).ToContainTextAsync("Last error:");
        await message.Locator("summary").ClickAsync();
        await Assertions.Expect(message.Locator(".delivery-log tbody tr")).ToHaveCountAsync(1);
        await ScreenshotIfAskedAsync("deliveries-failed");

        await message.GetByRole(AriaRole.Button, new() { Name = "send again" }).ClickAsync();
        await Assertions.Expect(Page.Locator("#send-result")).ToContainTextAsync("waiting to be sent again");
        // Still unreachable: after its one attempt it fails again, and the page, looking again, shows the second.
        await Assertions.Expect(Page.Locator(".message")).ToContainTextAsync("2 attempts", new() { Timeout = 20_000 });

        await OpenAsync($"alerts.html?state=all&alert={alert}");
        var sent = Page.Locator("#notifications");
        await Assertions.Expect(sent).ToContainTextAsync("Not escalated.");
        await Assertions.Expect(sent.Locator(".send-state")).ToHaveTextAsync("failed");
        await Assertions.Expect(sent).ToContainTextAsync("webhook lot-hold");
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task ATechnician_SeesTheFailedCall_WithoutSendAgain_AndTheRosterWithoutEditing()
    {
        await FailedCallAsync();

        await Page.Locator("#sign-out").ClickAsync();
        await Page.WaitForURLAsync("**/signin.html");
        await SignInAsync("bay technician 4", "technician");
        await OpenAsync("deliveries.html");
        await Assertions.Expect(Page.Locator(".message .send-state")).ToHaveTextAsync("failed");
        await Assertions.Expect(Page.Locator(".message button")).ToHaveCountAsync(0);
        // Nor does a technician change the roster: it is shown, not offered for editing.
        await OpenAsync("roster.html");
        await Assertions.Expect(Page.Locator("#roster-intro")).ToContainTextAsync("Supervisors and up change it.");
        await Assertions.Expect(Page.Locator("#add-line")).ToBeHiddenAsync();
        AssertNoPageProblems();
    }
}

/// <summary>The people page: an e-mail address for alerts, given when a person is added and changed in their row.</summary>
public sealed class PeopleEmailTests(BrowserFixture browser) : BrowserTest(browser)
{
    protected override bool SignIn => false;

    [BrowserFact]
    public async Task Administrator_AddsAPersonWithAnAddress_ChangesIt_AndSeesWhyABadOneIsRefused()
    {
        ExpectedFailures.Add("/api/people/"); // the refused address, on purpose
        await SignInAsync("area administrator 5", "administrator");
        await OpenAsync("people.html");
        await Page.Locator("#p-name").FillAsync("night supervisor 2");
        await Page.Locator("#p-role").SelectOptionAsync("supervisor");
        await Page.Locator("#p-email").FillAsync("night.supervisor@fab.example");
        await Page.Locator("#p-password").FillAsync(PersonPassword);
        await Page.Locator("#p-add").ClickAsync();
        await Assertions.Expect(Page.Locator("#people-result")).ToContainTextAsync("night supervisor 2 added as supervisor.");
        var address = Page.GetByLabel("e-mail address of night supervisor 2");
        await Assertions.Expect(address).ToHaveValueAsync("night.supervisor@fab.example");

        await address.FillAsync("bay3.supervisor@fab.example");
        await address.PressAsync("Enter");
        await Assertions.Expect(Page.Locator("#people-result")).ToContainTextAsync("Alerts for night supervisor 2 by e-mail go to bay3.supervisor@fab.example.");
        var stored = (await Client.GetFromJsonAsync<JsonElement>("/api/people")).EnumerateArray().Single(p => p.GetProperty("name").GetString() == "night supervisor 2");
        Assert.Equal("bay3.supervisor@fab.example", stored.GetProperty("email").GetString());

        await address.FillAsync("not an address");
        await address.PressAsync("Enter");
        await Assertions.Expect(Page.Locator("#people-result .problem")).ToContainTextAsync("is not an e-mail address");
        await ScreenshotIfAskedAsync("people-email");
        AssertNoPageProblems();
    }
}
