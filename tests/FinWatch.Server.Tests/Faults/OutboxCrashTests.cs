using System.Net.Http.Json;
using FinWatch.Server.Tests.Features.Notify;
using FinWatch.Testing;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Faults;

/// <summary>
/// SIGKILL of the real server process after an alert and its notification committed, while the webhook call is in
/// flight (the receiver holds it unanswered). The contract (README, notifications): sent at least once, the same
/// idempotency key every time. After the restart the dead sender's claim lapses and the new process sends it.
/// </summary>
[Collection(ServerProcessCollection.Name)]
public sealed class OutboxCrashTests : IDisposable
{
    private readonly string work = FaultSupport.WorkFolder();

    public void Dispose() => FaultSupport.DeleteWorkFolder(work);

    [Fact]
    public async Task Webhook_SigkillWhileSending_IsSentAfterRestart_WithTheSameKey()
    {
        var database = Path.Combine(work, "finwatch.db");
        await using var receiver = await WebhookReceiver.StartAsync(holdFirst: true);
        string[] settings =
        [
            "--FinWatch:Ingest:InboxEnabled", "false", "--FinWatch:Monitor:ApproverMustDiffer", "false",
            "--FinWatch:Notify:Webhooks:0:Name", "lot-hold", "--FinWatch:Notify:Webhooks:0:Url", receiver.Url,
            "--FinWatch:Notify:Webhooks:0:Secret", WebhookReceiver.Secret,
            "--FinWatch:Notify:PollSeconds", "0.2", "--FinWatch:Notify:TimeoutSeconds", "2", "--FinWatch:Notify:ClaimSeconds", "5",
        ];

        string key;
        await using (var server = await ServerProcess.StartAsync(database, settings))
        {
            using var admin = await server.CreateAdminClientAsync();
            await TestProducts.CreateBothAsync(admin);
            await IngestAsync(admin, Wafers("B0001", BaselineDay, new double[20]));
            await ApprovedContextAsync(admin, "TRI-TOP");
            (await admin.PostAsJsonAsync("/api/notifications/rules", new { channel = "webhook", webhook = "lot-hold", min_severity = "low" })).EnsureSuccessStatusCode();
            await IngestAsync(admin, Wafers("M0001", MonitorDay, 1.5));

            key = await receiver.Held.Task.WaitAsync(TimeSpan.FromSeconds(20)); // the call is on the wire, unanswered
            await server.KillAsync();
        }

        // Committed with the alert, claimed, never answered: no attempt was recorded.
        Assert.Equal(1, FaultSupport.Scalar(database, $"SELECT COUNT(*) FROM notification_outbox WHERE key = '{key}' AND status = 'sending' AND attempts = 1"));
        Assert.Equal(0, FaultSupport.Scalar(database, "SELECT COUNT(*) FROM notification_deliveries"));
        Assert.Empty(receiver.Calls);

        await using (var restarted = await ServerProcess.StartAsync(database, settings))
        {
            var calls = await receiver.WaitForAsync(c => c.Count >= 1, TimeSpan.FromSeconds(30));
            var call = Assert.Single(calls);
            Assert.Equal(key, call.Key);
            Assert.True(call.SignatureValid);
            Assert.Equal(200, call.Answered);
            await FaultSupport.WaitUntilAsync(() => FaultSupport.Scalar(database, $"SELECT COUNT(*) FROM notification_outbox WHERE key = '{key}' AND status = 'sent'") == 1,
                TimeSpan.FromSeconds(10), () => restarted.Output);
            Assert.Equal(2, FaultSupport.Scalar(database, $"SELECT attempts FROM notification_outbox WHERE key = '{key}'"));
            Assert.Equal(1, FaultSupport.Scalar(database, "SELECT COUNT(*) FROM notification_deliveries WHERE outcome = 'sent' AND attempt = 2"));
            Assert.Equal(1, FaultSupport.Scalar(database, "SELECT COUNT(*) FROM notification_outbox"));
        }
    }
}
