using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Testing;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>The monitor fixture's chart (TRI-TOP, limits approved) and an alert raised on it by a wafer 1.5 nm off (WE1).</summary>
public abstract class NotificationTestBase : IntegrationTest
{
    protected const string Password = "correct horse battery";
    protected const string PublicUrl = "https://finwatch.fab.example";

    protected NotificationTestBase()
    {
        Factory.With("FinWatch:Notify:PublicUrl", PublicUrl).With("FinWatch:Notify:PollSeconds", "0.1");
    }

    protected FinWatchAppFactory WithWebhook(string name, string url) =>
        Factory.With("FinWatch:Notify:Webhooks:0:Name", name).With("FinWatch:Notify:Webhooks:0:Url", url)
            .With("FinWatch:Notify:Webhooks:0:Secret", WebhookReceiver.Secret);

    protected async Task ChartAsync()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
    }

    /// <summary>Ingests lot M0001 whose one wafer is 1.5 nm off; returns the alert it raised.</summary>
    protected async Task<JsonElement> RaiseAsync(string lot = "M0001")
    {
        await IngestAsync(Client, Wafers(lot, MonitorDay, 1.5));
        return (await Client.GetFromJsonAsync<JsonElement>("/api/alerts?state=open")).EnumerateArray().Single(a => a.GetProperty("lot_id").GetString() == lot);
    }

    protected async Task AddPersonAsync(string name, string role, string? email = null)
    {
        var r = await Client.PostAsJsonAsync("/api/people", new { name, role, password = Password, email });
        Assert.True(r.IsSuccessStatusCode, await r.Content.ReadAsStringAsync());
    }

    protected async Task<JsonElement> AddRuleAsync(object rule)
    {
        var r = await Client.PostAsJsonAsync("/api/notifications/rules", rule);
        Assert.True(r.IsSuccessStatusCode, await r.Content.ReadAsStringAsync());
        return await ReadJsonAsync(r);
    }

    protected async Task<JsonElement[]> MessagesAsync(string query = "") =>
        [.. (await Client.GetFromJsonAsync<JsonElement>($"/api/notifications/messages{query}")).EnumerateArray()];

    protected static async Task EventuallyAsync(Func<Task<bool>> condition, string what, double seconds = 10)
    {
        var until = DateTime.UtcNow.AddSeconds(seconds);
        while (!await condition())
        {
            Assert.True(DateTime.UtcNow < until, $"not within {seconds} s: {what}");
            await Task.Delay(50);
        }
    }
}
