using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.Playwright;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Browser.Tests;

/// <summary>
/// Every page with something on it (a monitored chart with an open alert, a lot, a maintenance event), for an
/// administrator who sees every link: nothing overflows sideways at 1366×768 or 1920×1080, and axe-core (the
/// accessibility engine from npm, evaluated in the page) finds no critical or serious violation of its WCAG 2.1 A and AA
/// rules.
/// </summary>
public sealed class EveryPageTests(BrowserFixture browser) : BrowserTest(browser)
{
    private static readonly string[] Pages =
    [
        "index.html", "index.html?view=chambers&layout=wall", "chart.html?context=TRI-TOP&range=all", "alerts.html?state=all",
        "limits.html?context=TRI-TOP", "lot.html", "lot.html?lot=M0001", "whatif.html", "entry.html",
        "shift.html?date=2026-11-26&shift=early", "maintenance.html", "audit.html", "notify.html", "roster.html", "deliveries.html?status=all", "people.html",
    ];

    protected override bool SignIn => false;

    private static readonly Lazy<string> Axe = new(() => File.ReadAllText(Path.Combine(AppContext.BaseDirectory, "axe", "axe.min.js")));

    [BrowserFact]
    public async Task EveryPage_FitsTheScreen_AndHasNoSeriousAccessibilityProblem()
    {
        const string admin = "area administrator 3"; // invented
        await FinWatch.Testing.TestProducts.CreateBothAsync(Client);
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.5)); // WE1: an open alert
        (await Client.PostAsJsonAsync("/api/maintenance", new
        {
            chamber = "ETA-1", kind = "wet_clean", occurred_at = MonitorDay.AddHours(-2), performed_by = "Crew Amber", note = "invented",
        })).EnsureSuccessStatusCode();

        await SignInAsync(admin, "administrator");

        var failures = new List<string>();
        foreach (var page in Pages)
        {
            await OpenAsync(page);
            await Page.WaitForLoadStateAsync(LoadState.NetworkIdle);
            await Page.Locator(".strip .who").WaitForAsync();
            foreach (var (width, height) in FloorScreens)
            {
                await Page.SetViewportSizeAsync(width, height);
                var widths = await Page.EvaluateAsync<int[]>(
                    "() => new Promise((done) => requestAnimationFrame(() => requestAnimationFrame(() => done([document.documentElement.scrollWidth, document.documentElement.clientWidth]))))");
                if (widths[0] > widths[1])
                {
                    failures.Add($"{page} at {width}×{height}: {widths[0]} px wide in a window of {widths[1]} px");
                }
            }

            // Page.EvaluateAsync runs outside the page's content security policy, so the engine needs no script tag.
            await Page.EvaluateAsync(Axe.Value);
            var violations = await Page.EvaluateAsync<JsonElement>(
                "async () => (await axe.run(document, { runOnly: { type: 'tag', values: ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa'] }, resultTypes: ['violations'] }))"
                + ".violations.filter((v) => v.impact === 'critical' || v.impact === 'serious')"
                + ".map((v) => `${v.impact} ${v.id} (${v.help}): ${v.nodes.slice(0, 3).map((n) => n.target.join(' ')).join(' | ')}`)");
            failures.AddRange(violations.EnumerateArray().Select(v => $"{page}: {v.GetString()}"));
        }

        Assert.True(failures.Count == 0, string.Join("\n", failures));
        AssertNoPageProblems();
    }
}
