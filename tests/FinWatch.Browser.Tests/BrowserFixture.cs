using Microsoft.Playwright;

namespace FinWatch.Browser.Tests;

/// <summary>One Chromium for the whole test run: Debian's package, headless, with the flags of shared/RECIPES.md.</summary>
public sealed class BrowserFixture : IAsyncLifetime
{
    public const string ChromiumPath = "/usr/bin/chromium";

    private IPlaywright? playwright;

    public IBrowser Browser { get; private set; } = null!;

    public async Task InitializeAsync()
    {
        if (!File.Exists(ChromiumPath))
        {
            throw new InvalidOperationException($"The browser tests need Debian's Chromium at {ChromiumPath}: apt-get install -y chromium (.ci/run does this).");
        }

        playwright = await Playwright.CreateAsync();
        Assertions.SetDefaultExpectTimeout(15_000); // the suite runs the test projects side by side on two cores
        Browser = await playwright.Chromium.LaunchAsync(new BrowserTypeLaunchOptions
        {
            ExecutablePath = ChromiumPath,
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
