using System.Globalization;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>Notification settings that cannot work stop the start with the setting and the reason, never a silent drop later.</summary>
public sealed class BadConfigurationTests
{
    [Theory]
    [InlineData("ftp://hooks.fab.example/in", "FinWatch:Notify:Webhooks:0:Url 'ftp://hooks.fab.example/in' is not an http or https address")]
    [InlineData("hooks.fab.example/in", "FinWatch:Notify:Webhooks:0:Url 'hooks.fab.example/in' is not an http or https address")]
    public void WebhookAddressNotHttp_StopsTheStart(string url, string expected)
    {
        using var factory = new FinWatchAppFactory().With("FinWatch:Notify:Webhooks:0:Name", "pager").With("FinWatch:Notify:Webhooks:0:Url", url)
            .With("FinWatch:Notify:Webhooks:0:Secret", "a-secret-long-enough");
        var e = Assert.ThrowsAny<Exception>(() => factory.CreateClient());
        Assert.Contains(expected, e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void ShortSecret_StopsTheStart()
    {
        using var factory = new FinWatchAppFactory().With("FinWatch:Notify:Webhooks:0:Name", "pager").With("FinWatch:Notify:Webhooks:0:Url", "https://pager.example/x")
            .With("FinWatch:Notify:Webhooks:0:Secret", "short");
        var e = Assert.ThrowsAny<Exception>(() => factory.CreateClient());
        Assert.Contains("FinWatch:Notify:Webhooks:0:Secret is 5 characters; it must be at least 16", e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void UnreachableMailServer_StopsTheStart_WithTheHostAndTheWayOut()
    {
        var port = FreePort.Next(); // nothing listens there
        using var factory = new FinWatchAppFactory().With("FinWatch:Notify:Smtp:Host", "127.0.0.1")
            .With("FinWatch:Notify:Smtp:Port", port.ToString(CultureInfo.InvariantCulture)).With("FinWatch:Notify:Smtp:Security", "none")
            .With("FinWatch:Notify:Smtp:From", "finwatch@fab.example").With("FinWatch:Notify:TimeoutSeconds", "2");
        var e = Assert.ThrowsAny<Exception>(() => factory.CreateClient());
        Assert.Contains($"E-mail: the mail server 127.0.0.1:{port} (none) could not be used", e.ToString(), StringComparison.Ordinal);
        Assert.Contains("FinWatch:Notify:Smtp:CheckAtStart to false", e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task UnreachableMailServer_CheckSwitchedOff_Starts()
    {
        using var factory = new FinWatchAppFactory().With("FinWatch:Notify:Smtp:Host", "127.0.0.1")
            .With("FinWatch:Notify:Smtp:Port", FreePort.Next().ToString(CultureInfo.InvariantCulture)).With("FinWatch:Notify:Smtp:Security", "none")
            .With("FinWatch:Notify:Smtp:From", "finwatch@fab.example").With("FinWatch:Notify:Smtp:CheckAtStart", "false");
        using var client = factory.CreateClient();
        Assert.True((await client.GetAsync("/health")).IsSuccessStatusCode);
    }
}
