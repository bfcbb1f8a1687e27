using System.Threading.Channels;
using FinWatch.Server.Features.Monitor;
using FinWatch.Testing;
using Microsoft.AspNetCore.Http.Connections;
using Microsoft.AspNetCore.SignalR.Client;
using Microsoft.Extensions.DependencyInjection;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Monitor;

/// <summary>The hub with real SignalR .NET clients (long polling through the test server).</summary>
public class MonitorHubTests : IntegrationTest
{
    /// <summary>A hub client of the test server whose pushed entries go into <paramref name="received"/> (not started).</summary>
    internal static HubConnection Connect(FinWatchAppFactory factory, Channel<FeedMessage> received)
    {
        var connection = new HubConnectionBuilder()
            .WithUrl(new Uri(factory.Server.BaseAddress, MonitorHub.Path), o =>
            {
                o.Transports = HttpTransportType.LongPolling;
                o.HttpMessageHandlerFactory = _ => factory.Server.CreateHandler();
            })
            .AddJsonProtocol(o => o.PayloadSerializerOptions.PropertyNamingPolicy = System.Text.Json.JsonNamingPolicy.SnakeCaseLower)
            .Build();
        connection.On<List<FeedMessage>>(nameof(IMonitorClient.Feed), entries => entries.ForEach(m => received.Writer.TryWrite(m)));
        return connection;
    }

    private static async Task<FeedMessage> NextAsync(Channel<FeedMessage> received)
    {
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
        return await received.Reader.ReadAsync(timeout.Token);
    }

    [Fact]
    public async Task Watching_AContext_ReceivesThePointAfterTheIngestReturns()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        var received = Channel.CreateUnbounded<FeedMessage>();
        await using var connection = Connect(Factory, received);
        await connection.StartAsync();
        var head = await connection.InvokeAsync<long>("Watch", new[] { "TRI-TOP" });
        var stored = await ReadJsonAsync(await Client.GetAsync("/api/feed?after=0"));
        Assert.Equal(stored.EnumerateArray().Max(e => e.GetProperty("seq").GetInt64()), head); // the number at joining: all of it is stored already

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.0));
        var m = await NextAsync(received);
        Assert.Equal(head + 1, m.Seq);
        Assert.Equal("point", m.Kind);
        Assert.Equal("TRI-TOP", m.Context);
        Assert.Equal(21, m.Point!.Seq);
        Assert.Equal(6.0, m.Point.Value, 1e-9);
        Assert.Equal(0, m.Point.Z!.Value, 1e-9);
    }

    [Fact]
    public async Task AfterADroppedConnection_CatchUp_GivesExactlyTheMissedEntries()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        var received = Channel.CreateUnbounded<FeedMessage>();
        long lastSeen;
        await using (var first = Connect(Factory, received))
        {
            await first.StartAsync();
            await first.InvokeAsync("Watch", new[] { "TRI-TOP" });
            await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.0));
            lastSeen = (await NextAsync(received)).Seq;
        }

        // While disconnected: two more wafers and the alert of the second.
        await IngestAsync(Client, Wafers("M0002", MonitorDay.AddHours(1), 0.0, 1.5));

        await using var second = Connect(Factory, received);
        await second.StartAsync();
        await second.InvokeAsync("Watch", new[] { "TRI-TOP" });
        var missed = await second.InvokeAsync<List<FeedMessage>>("CatchUp", lastSeen, new[] { "TRI-TOP" });
        Assert.Equal(["point", "point", "alert"], missed.Select(m => m.Kind));
        Assert.Equal([22L, 23L], missed.Where(m => m.Point is not null).Select(m => m.Point!.Seq));
        Assert.All(missed, m => Assert.True(m.Seq > lastSeen));
        Assert.Equal(missed.Count, missed.Select(m => m.Seq).Distinct().Count());
        Assert.False(received.Reader.TryRead(out _)); // nothing pushed twice while away
    }
}
