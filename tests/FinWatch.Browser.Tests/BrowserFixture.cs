using FinWatch.Testing;
using Microsoft.Playwright;

namespace FinWatch.Browser.Tests;

/// <summary>
/// One Chromium for the whole test run: Debian's package, headless, with flags that keep it off the network (this
/// machine has none beyond its package registries, and Chromium's background connections are refused one by one).
/// </summary>
public sealed class BrowserFixture : IAsyncLifetime
{
    private IPlaywright? playwright;

    public IBrowser Browser { get; private set; } = null!;

    public async Task InitializeAsync()
    {
        if (TestServices.QuickRun)
        {
            return; // every browser test is skipped (BrowserFact) and says why
        }

        var chromium = TestServices.RequireChromium();
        playwright = await Playwright.CreateAsync();
        Assertions.SetDefaultExpectTimeout(15_000); // the suite runs the test projects side by side on two cores
        Browser = await playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions
        {
            ExecutablePath = chromium,
            Headless = true,
            Args = ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking",
                "--disable-component-update", "--disable-sync"],
        });
    }

    public async Task DisposeAsync()
    {
        if (Browser is not null)
        {
            await Browser.DisposeAsync();
        }

        playwright?.Dispose();
    }
}

[CollectionDefinition(Name)]
public sealed class BrowserCollection : ICollectionFixture<BrowserFixture>
{
    public const string Name = "browser";
}

/// <summary>A browser test: skipped only on a quick run; without Chromium it fails and says what is missing.</summary>
public sealed class BrowserFactAttribute : FactAttribute
{
    public BrowserFactAttribute() => Skip = TestServices.QuickRunSkip("browser");
}
