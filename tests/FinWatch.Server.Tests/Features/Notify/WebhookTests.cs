using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Server.Features.Notify;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>Webhooks: signed calls to a configured address, retries with exponential backoff, the delivery log, send again.</summary>
public sealed class WebhookTests : NotificationTestBase
{
    private WebhookReceiver receiver = null!;

    protected override async Task BeforeStartAsync()
    {
        receiver = await WebhookReceiver.StartAsync();
        receiver.Now = Factory.Clock.GetUtcNow;
        WithWebhook("lot-hold", receiver.Url);
    }

    protected override async Task AfterStopAsync() => await receiver.DisposeAsync();

    [Fact]
    public async Task Channels_NameTheConfiguredWebhooks_AndTellTheCallerTheirOwnAddress()
    {
        await AddPersonAsync("test engineer", "engineer", "bay.engineer@fab.example"); // the engineer identity's name
        using var asEngineer = new HttpRequestMessage(HttpMethod.Get, "/api/notifications/channels");
        asEngineer.Headers.Add(TestAuthHandler.Header, "engineer");
        var mine = await ReadJsonAsync(await Client.SendAsync(asEngineer));
        Assert.Equal("bay.engineer@fab.example", mine.GetProperty("your_email").GetString());
        Assert.Equal("lot-hold", mine.GetProperty("webhooks")[0].GetProperty("name").GetString());
        Assert.False(mine.GetProperty("email_configured").GetBoolean());

        var admin = await Client.GetFromJsonAsync<JsonElement>("/api/notifications/channels"); // no such person stored: no address
        Assert.True(!admin.TryGetProperty("your_email", out var none) || none.ValueKind == JsonValueKind.Null, admin.ToString());
    }

    [Fact]
    public async Task FirstCallAnswered500_IsRetriedAfterTheBackoff_SignedWithTheSameKey_AndLogged()
    {
        receiver.Answer(500);
        await ChartAsync();
        await AddRuleAsync(new { channel = "webhook", webhook = "lot-hold", min_severity = "low" });
        var alert = await RaiseAsync();
        var id = alert.GetProperty("id").GetInt64();

        var first = await receiver.WaitForAsync(c => c.Count >= 1, TimeSpan.FromSeconds(10));
        Assert.Equal(500, first[0].Answered);
        await EventuallyAsync(async () => (await MessagesAsync()).Single().GetProperty("status").GetString() == "waiting", "the message waits for its retry");
        var waiting = (await MessagesAsync()).Single();
        Assert.Equal(1, waiting.GetProperty("attempts").GetInt32());
        // First retry after 30 s by default (exponential: 30, 60, 120 s …), on the fake clock.
        Assert.Equal(FinWatchAppFactory.Now.AddSeconds(30), waiting.GetProperty("next_attempt_at").GetDateTimeOffset());

        Factory.Clock.Advance(TimeSpan.FromSeconds(29));
        await Task.Delay(500); // the sender polls every 0.1 s: it must not call before the backoff ends
        Assert.Single(receiver.Calls);

        Factory.Clock.Advance(TimeSpan.FromSeconds(2));
        var calls = await receiver.WaitForAsync(c => c.Count >= 2, TimeSpan.FromSeconds(10));
        Assert.Equal([500, 200], calls.Select(c => c.Answered));
        Assert.All(calls, c => Assert.True(c.SignatureValid, "signature checked by the receiver"));
        Assert.Equal($"alert-{id}-raised-rule-1", calls[0].Key);
        Assert.Equal(calls[0].Key, calls[1].Key); // one idempotency key for every attempt
        Assert.Equal(calls[0].Body, calls[1].Body);

        var body = JsonDocument.Parse(calls[1].Body).RootElement;
        Assert.Equal(calls[1].Key, body.GetProperty("idempotency_key").GetString());
        Assert.Equal("raised", body.GetProperty("event").GetString());
        var a = body.GetProperty("alert");
        Assert.Equal(id, a.GetProperty("id").GetInt64());
        Assert.Equal("TRI-TOP", a.GetProperty("chart").GetString());
        Assert.Equal("M0001", a.GetProperty("lot_id").GetString());
        Assert.Equal(1, a.GetProperty("wafer_slot").GetInt32());
        Assert.Equal($"{PublicUrl}/alerts.html?state=all&alert={id}", a.GetProperty("url").GetString());
        Assert.Contains("Engineering estimate", a.GetProperty("predicted_dvt_note").GetString(), StringComparison.Ordinal);

        await EventuallyAsync(async () => (await MessagesAsync()).Single().GetProperty("status").GetString() == "sent", "the message is sent");
        var log = (await MessagesAsync($"?alert={id}")).Single().GetProperty("deliveries").EnumerateArray().ToList();
        Assert.Equal(["error", "sent"], log.Select(d => d.GetProperty("outcome").GetString()));
        Assert.Contains("500", log[0].GetProperty("detail").GetString(), StringComparison.Ordinal);
        Assert.Contains("200", log[1].GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task RefusedCall_FailsAtOnce_ListedAsFailed_AndSentAgainBySupervisor()
    {
        receiver.Answer(400);
        await ChartAsync();
        await AddRuleAsync(new { channel = "webhook", webhook = "lot-hold", min_severity = "low" });
        await RaiseAsync();
        await EventuallyAsync(async () => (await MessagesAsync("?status=failed")).Length == 1, "a refused call fails without retries");
        var failed = (await MessagesAsync("?status=failed")).Single();
        Assert.Equal(1, failed.GetProperty("attempts").GetInt32());
        Assert.Contains("refused", failed.GetProperty("last_error").GetString(), StringComparison.Ordinal);
        var messageId = failed.GetProperty("id").GetInt64();

        using var asTechnician = new HttpRequestMessage(HttpMethod.Post, $"/api/notifications/messages/{messageId}/send-again");
        asTechnician.Headers.Add(TestAuthHandler.Header, "technician");
        Assert.Equal(HttpStatusCode.Forbidden, (await Client.SendAsync(asTechnician)).StatusCode);

        using var asSupervisor = new HttpRequestMessage(HttpMethod.Post, $"/api/notifications/messages/{messageId}/send-again");
        asSupervisor.Headers.Add(TestAuthHandler.Header, "supervisor");
        Assert.Equal(HttpStatusCode.OK, (await Client.SendAsync(asSupervisor)).StatusCode);
        await EventuallyAsync(async () => (await MessagesAsync()).Single().GetProperty("status").GetString() == "sent", "sent again");
        Assert.Equal([400, 200], receiver.Calls.Select(c => c.Answered));
        var again = await Client.PostAsync($"/api/notifications/messages/{messageId}/send-again", null);
        Assert.Equal(HttpStatusCode.BadRequest, again.StatusCode); // only a failed message is sent again

        var audit = await Client.GetFromJsonAsync<JsonElement>("/api/audit?entity=notification");
        Assert.Contains(audit.EnumerateArray(), e => e.GetProperty("action").GetString() == "send_again");
    }

    [Fact]
    public async Task Redirect_IsNotFollowed_TheCallFails()
    {
        receiver.Answer(307);
        await ChartAsync();
        await AddRuleAsync(new { channel = "webhook", webhook = "lot-hold", min_severity = "low" });
        await RaiseAsync();
        await EventuallyAsync(async () => (await MessagesAsync("?status=failed")).Length == 1, "a redirect fails the call");
        Assert.Equal("lot-hold refused the call: 307 Temporary Redirect; not tried again", (await MessagesAsync()).Single().GetProperty("last_error").GetString());
        Assert.Equal(0, receiver.Redirected); // only configured addresses are ever called
    }

    [Fact]
    public void RetryDelay_DoublesFromTheFirstDelay_UpToTheCap()
    {
        // Exponential backoff: delay(n) = first · 2^(n−1), capped (common practice; no published source).
        var o = new NotifyOptions { FirstRetryDelaySeconds = 30, MaxRetryDelaySeconds = 3600 };
        Assert.Equal([30, 60, 120, 240, 480, 960, 1920, 3600, 3600], Enumerable.Range(1, 9).Select(n => o.RetryDelay(n).TotalSeconds));
    }

    [Fact]
    public void Signature_IsHmacSha256OfTimestampNewlineBody()
    {
        // RFC 4231, test case 2: HMAC-SHA256 with key "Jefe" of "what do ya want for nothing?" is 5bdcc146…3843 (the
        // primitive; value quoted from memory). The signature is that HMAC of "<timestamp>\n<body>", prefixed "hmac-sha256=".
        Assert.Equal("5bdcc146bf60754e6a042426089575c75a003f089d2739839dec58b964ec3843",
            Convert.ToHexStringLower(System.Security.Cryptography.HMACSHA256.HashData("Jefe"u8, "what do ya want for nothing?"u8)));
        var body = "{\"a\":1}"u8.ToArray();
        var signature = WebhookSignature.Sign("Jefe", 1_700_000_000, body);
        Assert.Equal("hmac-sha256=" + Convert.ToHexStringLower(System.Security.Cryptography.HMACSHA256.HashData("Jefe"u8, "1700000000\n{\"a\":1}"u8)), signature);
        var at = DateTimeOffset.FromUnixTimeSeconds(1_700_000_000);
        Assert.True(WebhookSignature.Verify("Jefe", "1700000000", signature, body, at.AddMinutes(4), TimeSpan.FromMinutes(5)));
        Assert.False(WebhookSignature.Verify("Jefe", "1700000000", signature, body, at.AddMinutes(6), TimeSpan.FromMinutes(5))); // replayed late
        Assert.False(WebhookSignature.Verify("Jefe", "1700000001", signature, body, at, TimeSpan.FromMinutes(5))); // timestamp changed
        Assert.False(WebhookSignature.Verify("Jefe", "1700000000", signature, "{\"a\":2}"u8, at, TimeSpan.FromMinutes(5))); // body changed
        Assert.False(WebhookSignature.Verify("other secret", "1700000000", signature, body, at, TimeSpan.FromMinutes(5)));
    }
}
