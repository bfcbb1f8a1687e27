using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>What people type is shown as text, never run; sign-in is needed; the wall screen sees the floor only.</summary>
public sealed class AccessPagesTests(BrowserFixture browser) : BrowserTest(browser)
{
    private const string Payload = "<img src=x onerror=alert(1)>";

    [BrowserFact]
    public async Task XssPayloads_InALotIdAndAComment_RenderAsText()
    {
        await TestProducts.CreateBothAsync(Client);
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        await IngestAsync(Client, Wafers(Payload, MonitorDay, 0.5)); // the lot id is free text (README: at most 64 characters)
        var alerts = await Client.GetFromJsonAsync<JsonElement>("/api/alerts?state=active");
        var id = alerts.EnumerateArray().Single().GetProperty("id").GetInt64();
        var ack = await Client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment = "<script>alert(2)</script> held" });
        ack.EnsureSuccessStatusCode();

        await OpenAsync("index.html");
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator(".tile[data-context='TRI-TOP']")).ToContainTextAsync($"lot {Payload}");
        await OpenAsync($"alerts.html?alert={id}");
        await WaitLiveAsync();
        await Assertions.Expect(Page.Locator("#detail .history")).ToContainTextAsync("<script>alert(2)</script> held");
        await Assertions.Expect(Page.Locator("#detail")).ToContainTextAsync(Payload);
        await OpenAsync($"lot.html?lot={Uri.EscapeDataString(Payload)}");
        await Assertions.Expect(Page.Locator("#lot-title")).ToContainTextAsync(Payload);

        Assert.Equal(0, await Page.Locator("img[src='x']").CountAsync());
        Assert.Equal(0, await Page.Locator("main script").CountAsync());
        AssertNoPageProblems(); // includes: no dialog opened
    }

    [BrowserFact]
    public async Task SignedOut_APageSendsToSignIn_AndBackAfterwards()
    {
        ExpectedFailures.Add("/api/auth/sign-in"); // the wrong password's 401 is part of the test,
        ExpectedFailures.Add("/api/contexts");     // and so is the signed-out alerts page's first data request
        await Page.Locator("#sign-out").ClickAsync();
        await Assertions.Expect(Page).ToHaveURLAsync(new Regex(@"/signin\.html$"));
        await OpenAsync("alerts.html");
        await Assertions.Expect(Page).ToHaveURLAsync(new Regex(@"/signin\.html\?next=alerts\.html$")); // polls the address, not load events
        await Page.Locator("#name").FillAsync(Person);
        await Page.Locator("#password").FillAsync("wrong password here");
        await Page.Locator("#signin-button").ClickAsync();
        await Assertions.Expect(Page.Locator("#signin-result")).ToContainTextAsync("wrong");
        await Page.Locator("#password").FillAsync(PersonPassword);
        await Page.Locator("#signin-button").ClickAsync();
        await Assertions.Expect(Page).ToHaveURLAsync(new Regex(@"/alerts\.html$"));
        AssertNoPageProblems();
    }

    [BrowserFact]
    public async Task WallScreen_WithADisplayToken_ShowsTheFloorAndChartsOnly()
    {
        await TestProducts.CreateBothAsync(Client);
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        var created = await (await Client.PostAsJsonAsync("/api/keys", new { name = "bay 3 wall screen", scope = "display" })).Content.ReadFromJsonAsync<JsonElement>();
        await Page.Context.ClearCookiesAsync(); // a fresh browser on the wall
        await OpenAsync($"display/{created.GetProperty("key").GetString()}");
        await Page.WaitForURLAsync(BaseUrl.TrimEnd('/') + "/");
        await WaitLiveAsync();
        // A display token opens the wall-screen layout: a calm chart is one line (a chip), not a tile.
        await Assertions.Expect(Page.Locator("#layout")).ToHaveValueAsync("wall");
        await Assertions.Expect(Page.Locator("[data-context='TRI-TOP']")).ToBeVisibleAsync();
        await Assertions.Expect(Page.Locator(".strip nav a")).ToHaveTextAsync(["Floor", "Chart"]);
        await Assertions.Expect(Page.Locator(".strip .demo-mark")).ToContainTextAsync("Wall screen");
        AssertNoPageProblems();
    }
}
