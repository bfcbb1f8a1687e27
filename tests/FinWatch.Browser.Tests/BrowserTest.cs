using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.Extensions.DependencyInjection;
using System.Net.Http.Json;
using FinWatch.Testing;
using Microsoft.Playwright;

namespace FinWatch.Browser.Tests;

/// <summary>
/// Each test: its own server (the real app on a free port, its own SQLite file), its own browser page, and a record of
/// every script error and failed request the page reports; a test fails if the page had any.
/// </summary>
[Collection(BrowserCollection.Name)]
public abstract class BrowserTest(BrowserFixture browser) : IAsyncLifetime
{
    private readonly List<string> problems = [];
    private IBrowserContext? context;

    protected FinWatchAppFactory Factory { get; } = new();
    protected HttpClient Client { get; private set; } = null!;
    protected IPage Page { get; private set; } = null!;
    protected string BaseUrl { get; private set; } = "";

    /// <summary>The run's Chromium, for a test that needs a second browser (a wall screen beside a person's browser).</summary>
    protected IBrowser Chromium => browser.Browser;

    /// <summary>Settings for the server before it starts (for example the demo).</summary>
    protected virtual void Configure(FinWatchAppFactory factory)
    {
    }

    /// <summary>The person the browser signs in as (an invented engineer), unless the test runs the demo.</summary>
    protected const string Person = "floor engineer 7"; // invented
    protected const string PersonPassword = "an invented long password";

    /// <summary>Whether the browser signs in through the sign-in page first (off for the demo, which signs in by itself).</summary>
    protected virtual bool SignIn => true;

    public virtual async Task InitializeAsync()
    {
        // The browser uses the product's real sign-in (cookie, antiforgery); the test's own HTTP client is an administrator.
        Factory.DefaultIdentity = "none";
        Configure(Factory);
        Factory.UseKestrel(0);
        Factory.StartServer();
        BaseUrl = Factory.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First().Replace("[::]", "127.0.0.1", StringComparison.Ordinal);
        Client = new HttpClient { BaseAddress = new Uri(BaseUrl) };
        Client.DefaultRequestHeaders.Add(TestAuthHandler.Header, "administrator");
        context = await browser.Browser.NewContextAsync(new BrowserNewContextOptions { ViewportSize = new ViewportSize { Width = 1400, Height = 1000 }, Locale = "en-GB", TimezoneId = "UTC" });
        Page = await context.NewPageAsync();
        Page.SetDefaultTimeout(30_000); // generous: the suite runs the test projects side by side on two cores
        Page.Console += (_, m) =>
        {
            // A failed response is recorded below with its address; the console's copy of it says less.
            if (m.Type == "error" && !m.Text.StartsWith("Failed to load resource", StringComparison.Ordinal))
            {
                problems.Add($"console: {m.Text}");
            }
        };
        Page.PageError += (_, e) => problems.Add($"script error: {e}");
        Page.Dialog += (_, d) => problems.Add($"a dialog opened: {d.Message}"); // an injected alert() would land here
        Page.RequestFailed += (_, r) => problems.Add($"request failed: {r.Url} {r.Failure}");
        Page.Response += (_, r) =>
        {
            if (r.Status >= 400 && !ExpectedFailures.Any(f => r.Url.Contains(f, StringComparison.Ordinal)))
            {
                var what = $"{r.Status} from {r.Request.Method} {r.Url}";
                lock (problems)
                {
                    problems.Add(what);
                }

                _ = r.TextAsync().ContinueWith(t =>
                {
                    lock (problems)
                    {
                        problems.Add(t.IsCompletedSuccessfully ? $"its body: {t.Result}" : "its body could not be read");
                    }
                }, TaskScheduler.Default);
            }
        };

        if (SignIn)
        {
            await SignInAsync();
        }
    }

    /// <summary>Adds the person and signs in through the sign-in page, as someone on the floor would.</summary>
    protected Task SignInAsync() => SignInAsync(Person, "engineer");

    /// <summary>Adds a person with the role and signs them in through the sign-in page.</summary>
    protected async Task SignInAsync(string name, string role)
    {
        var added = await Client.PostAsJsonAsync("/api/people", new { name, role, password = PersonPassword });
        Assert.True(added.IsSuccessStatusCode, await added.Content.ReadAsStringAsync());
        await OpenAsync("signin.html?next=index.html");
        await Page.Locator("#name").FillAsync(name);
        await Page.Locator("#password").FillAsync(PersonPassword);
        await Page.Locator("#password").PressAsync("Enter");
        await Page.WaitForURLAsync("**/index.html");
        await Assertions.Expect(Page.Locator(".strip .who")).ToContainTextAsync(name);
    }

    public async Task DisposeAsync()
    {
        if (context is not null)
        {
            await context.DisposeAsync();
        }

        Client.Dispose();
        Factory.Dispose();
    }

    /// <summary>Addresses whose error answers a test provokes on purpose (a rejected upload).</summary>
    protected List<string> ExpectedFailures { get; } = [];

    protected Task OpenAsync(string path) => Page.GotoAsync(BaseUrl.TrimEnd('/') + "/" + path.TrimStart('/'));

    /// <summary>Waits until the page's live-feed line says it is connected and current.</summary>
    protected Task WaitLiveAsync() => Page.Locator(".link-state[data-state='live']").WaitForAsync();

    /// <summary>Photographs the whole page (the test's, or another) to FINWATCH_SCREENSHOTS/<paramref name="name"/>.png when that folder is set.</summary>
    protected async Task ScreenshotIfAskedAsync(string name, IPage? page = null)
    {
        if (Environment.GetEnvironmentVariable("FINWATCH_SCREENSHOTS") is { Length: > 0 } dir)
        {
            Directory.CreateDirectory(dir);
            await (page ?? Page).ScreenshotAsync(new PageScreenshotOptions { Path = Path.Combine(dir, name + ".png"), FullPage = true });
        }
    }

    protected async Task AssertNoSidewaysScrollAsync() =>
        Assert.True(await Page.EvaluateAsync<bool>("() => document.documentElement.scrollWidth <= window.innerWidth"), "the page is wider than the window");

    /// <summary>
    /// At each window size (width × height in CSS pixels) the page is no wider than the window: the document's scroll
    /// width is at most its client width. The window is left at the last size.
    /// </summary>
    protected async Task AssertNoHorizontalOverflowAtAsync(params (int Width, int Height)[] sizes)
    {
        foreach (var (width, height) in sizes)
        {
            await Page.SetViewportSizeAsync(width, height);
            var widths = await Page.EvaluateAsync<int[]>("() => new Promise((done) => requestAnimationFrame(() => done([document.documentElement.scrollWidth, document.documentElement.clientWidth])))");
            Assert.True(widths[0] <= widths[1], $"at {width}×{height} the page is {widths[0]} px wide in a window of {widths[1]} px");
        }
    }

    /// <summary>The common laptop and desktop screens of the floor (CSS pixels).</summary>
    protected static readonly (int Width, int Height)[] FloorScreens = [(1366, 768), (1920, 1080)];

    protected void AssertNoPageProblems() => Assert.True(problems.Count == 0, "the page reported: " + string.Join(" | ", problems));
}
