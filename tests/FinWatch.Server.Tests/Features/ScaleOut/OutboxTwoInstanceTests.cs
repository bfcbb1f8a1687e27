using System.Net.Http.Json;
using FinWatch.Server.Features.Notify;
using FinWatch.Server.Tests.Features.Notify;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// Two server instances on one PostgreSQL database, both sending the outbox to one webhook receiver as fast as they
/// can: each message is claimed under the monitor lock by one of them, so the receiver gets each key exactly once.
/// </summary>
public sealed class OutboxTwoInstanceTests : IAsyncLifetime
{
    private const int Charts = 3;
    private const int Rules = 12;
    private PostgresTestDatabase? database;
    private WebhookReceiver receiver = null!;
    private FinWatchAppFactory? a;
    private FinWatchAppFactory? b;

    public async Task InitializeAsync()
    {
        if (TestServices.QuickRun)
        {
            return; // skipped (ScaleOutFact) and says why
        }

        database = await PostgresTestDatabase.CreateAsync();
        receiver = await WebhookReceiver.StartAsync();
        a = Start(database.ConnectionString);
        b = Start(database.ConnectionString);
        receiver.Now = a.Clock.GetUtcNow;
    }

    private FinWatchAppFactory Start(string connectionString)
    {
        var factory = new FinWatchAppFactory().UsePostgres(connectionString).With("FinWatch:Notify:Webhooks:0:Name", "lot-hold")
            .With("FinWatch:Notify:Webhooks:0:Url", receiver.Url).With("FinWatch:Notify:Webhooks:0:Secret", WebhookReceiver.Secret)
            .With("FinWatch:Notify:PollSeconds", "0.05");
        factory.StartServer();
        return factory;
    }

    public async Task DisposeAsync()
    {
        a?.Dispose();
        b?.Dispose();
        if (receiver is not null)
        {
            await receiver.DisposeAsync();
        }

        if (database is not null)
        {
            await database.DisposeAsync();
        }
    }

    [ScaleOutFact]
    public async Task BothInstancesSending_EachMessageReachesTheReceiverOnce()
    {
        using var clientA = a!.CreateClient();
        using var clientB = b!.CreateClient();
        await TestProducts.CreateBothAsync(clientA);
        await IngestAsync(clientA, Wafers("B0001", BaselineDay, new double[20]));
        for (var c = 1; c <= Charts; c++)
        {
            await ApprovedContextAsync(c % 2 == 0 ? clientA : clientB, $"TRI-TOP-{c}");
        }

        for (var r = 0; r < Rules; r++)
        {
            (await clientB.PostAsJsonAsync("/api/notifications/rules", new { channel = "webhook", webhook = "lot-hold", min_severity = "low" })).EnsureSuccessStatusCode();
        }

        // One lot raises an alert on each chart: Charts × Rules messages. Both instances send at once, in loops of their own too.
        var ingest = IngestAsync(clientA, Wafers("M0001", MonitorDay, 1.5));
        using var stop = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        var senders = new[] { a, b }.Select(f => Task.Run(async () =>
        {
            var sender = f.Services.GetRequiredService<OutboxSender>();
            while (!stop.IsCancellationRequested && receiver.Calls.Count < Charts * Rules)
            {
                await sender.SendDueAsync(CancellationToken.None);
            }
        })).ToList();
        await ingest;
        await receiver.WaitForAsync(c => c.Count >= Charts * Rules, TimeSpan.FromSeconds(20));
        await Task.WhenAll(senders);
        await Task.Delay(1000); // a duplicate would arrive now

        var calls = receiver.Calls.ToList();
        Assert.Equal(Charts * Rules, calls.Count);
        Assert.Equal(Charts * Rules, calls.Select(c => c.Key).Distinct().Count());
        Assert.All(calls, c => Assert.True(c.SignatureValid));
        var sent = await a.QueryAsync(db => db.Outbox.AsNoTracking().Where(m => m.Status == OutboxStates.Sent).CountAsync());
        Assert.Equal(Charts * Rules, sent);
        var attempts = await a.QueryAsync(db => db.DeliveryAttempts.AsNoTracking().ToListAsync());
        Assert.Equal(Charts * Rules, attempts.Count);
    }
}
