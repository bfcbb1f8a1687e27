using System.Threading.Channels;
using FinWatch.Server.Features.Monitor;
using FinWatch.Testing;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.AspNetCore.SignalR.Client;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// Two server instances on Kestrel, as behind the compose file's proxy: one PostgreSQL database, one Redis backplane
/// (a channel prefix of their own, so tests running side by side do not hear each other).
/// </summary>
public sealed class TwoInstanceTests : IAsyncLifetime
{
    private readonly string channelPrefix = $"finwatch-test-{Guid.NewGuid():N}";
    private PostgresTestDatabase? database;
    private FinWatchAppFactory? a;
    private FinWatchAppFactory? b;
    private HttpClient clientA = null!;
    private HttpClient clientB = null!;

    public async Task InitializeAsync()
    {
        if (TestServices.QuickRun)
        {
            return; // the tests are skipped (ScaleOutFact) and say why
        }

        TestServices.RequireRedis();

        database = await PostgresTestDatabase.CreateAsync();
        a = Start(database.ConnectionString); // migrates the shared database; B finds it current
        b = Start(database.ConnectionString);
        clientA = a.CreateClient();
        clientB = b.CreateClient();
        await TestProducts.CreateBothAsync(clientA);
    }

    private FinWatchAppFactory Start(string connectionString)
    {
        var factory = new FinWatchAppFactory().UsePostgres(connectionString)
            .With(SignalRScaleOut.RedisKey, TestServices.RequireRedis())
            .With(SignalRScaleOut.ChannelPrefixKey, channelPrefix);
        factory.UseKestrel(0);
        factory.StartServer();
        return factory;
    }

    private static Uri Address(FinWatchAppFactory factory) =>
        new(factory.Services.GetRequiredService<IServer>().Features.Get<IServerAddressesFeature>()!.Addresses.First()
            .Replace("[::]", "127.0.0.1", StringComparison.Ordinal));

    [ScaleOutFact]
    public async Task ClientOnInstanceA_ReceivesThePointIngestedThroughInstanceB()
    {
        await IngestAsync(clientA, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(clientA, "TRI-TOP");
        var received = Channel.CreateUnbounded<FeedMessage>();
        await using var connection = new HubConnectionBuilder()
            .WithUrl(new Uri(Address(a!), MonitorHub.Path))
            .AddJsonProtocol(o => o.PayloadSerializerOptions.PropertyNamingPolicy = System.Text.Json.JsonNamingPolicy.SnakeCaseLower)
            .Build();
        connection.On<List<FeedMessage>>(nameof(IMonitorClient.Feed), entries => entries.ForEach(m => received.Writer.TryWrite(m)));
        await connection.StartAsync();
        var head = await connection.InvokeAsync<long>("Watch", new[] { "TRI-TOP" });

        await IngestAsync(clientB, Wafers("M0001", MonitorDay, 0.0));
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(15));
        var m = await received.Reader.ReadAsync(timeout.Token);
        // Instance A stored and evaluated nothing: the entry can only have come from B through Redis.
        Assert.Equal(head + 1, m.Seq);
        Assert.Equal("point", m.Kind);
        Assert.Equal("M0001", m.Point!.LotId);
        Assert.Equal(21, m.Point.Seq); // after the 20 baseline points
    }

    [ScaleOutFact]
    public async Task IngestThroughBothAtOnce_EvaluatesEveryPointOnce_NoAlertDuplicatedOrMissed()
    {
        await IngestAsync(clientA, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(clientA, "TRI-TOP");

        // Twelve lots of four wafers, offsets +0.02, -0.02, +0.02 and +1.5 nm (z about +0.5, -0.5, +0.5 and +40 by the
        // hand-computed limits of MonitorEndpointsTests): exactly one Western Electric signal per lot, rule 1 at wafer 4;
        // no run of 2-of-3, 4-of-5 or 8 on one side whatever order the lots are evaluated in. Even lots go through A,
        // odd through B, all at once.
        const int Lots = 12;
        var lots = Enumerable.Range(1, Lots).Select(i => $"M{i:0000}").ToList();
        await Task.WhenAll(lots.Select((lot, i) =>
            IngestAsync(i % 2 == 0 ? clientA : clientB, Wafers(lot, MonitorDay.AddHours(i), 0.02, -0.02, 0.02, 1.5))));
        await using var scope = a!.Services.CreateAsyncScope();
        var evaluator = scope.ServiceProvider.GetRequiredService<MonitorEvaluator>();
        Assert.Empty(await evaluator.EvaluatePendingAsync(CancellationToken.None)); // nothing was left over

        var points = await a.QueryAsync(db => db.ChartPoints.AsNoTracking().Where(p => p.LotId != "B0001").ToListAsync());
        Assert.Equal(Lots * 4, points.Count);
        Assert.Equal(Lots * 4, points.Select(p => (p.LotId, p.WaferSlot)).Distinct().Count());
        var seqs = await a.QueryAsync(db => db.ChartPoints.OrderBy(p => p.Seq).Select(p => p.Seq).ToListAsync());
        Assert.Equal(Enumerable.Range(1, 20 + (Lots * 4)).Select(i => (long)i), seqs);

        // One excursion, opened once, holding every point from the first signal on; its signal points are the wafers 4.
        var alert = Assert.Single(await a.QueryAsync(db => db.Alerts.AsNoTracking().ToListAsync()));
        Assert.Equal(("WE1", "WE1", Lots), (alert.Rule, alert.Rules, alert.SignalCount));
        Assert.Equal(alert.LastSeq - alert.FirstSeq + 1, alert.PointCount);
        var raised = await a.QueryAsync(db => db.AlertEvents.AsNoTracking().Where(e => e.Kind == "raised").ToListAsync());
        Assert.Equal(alert.FirstPointId, Assert.Single(raised).PointId);
        var wafer4 = points.Where(p => p.WaferSlot == 4).Select(p => p.Seq).Order().ToList();
        Assert.Equal(wafer4, points.Where(p => p.Signals.Length > 0).Select(p => p.Seq).Order().ToList());
        Assert.Equal(wafer4[0], alert.FirstSeq);
        Assert.Equal(wafer4[^1], alert.LastSignalSeq);

        // The live feed: every point once, numbered without a gap.
        var feed = await a.QueryAsync(db => db.FeedEvents.AsNoTracking().OrderBy(e => e.Seq).ToListAsync());
        Assert.Equal(seqs.Count, feed.Count(e => e.Kind == "point"));
        // One alert entry per evaluation that touched the excursion (batches evaluated together share one), the last
        // carrying the whole excursion.
        var alertEntries = feed.Where(e => e.Kind == "alert").ToList();
        Assert.InRange(alertEntries.Count, 1, Lots);
        var last = System.Text.Json.JsonDocument.Parse(alertEntries[^1].Payload).RootElement;
        Assert.Equal(Lots, last.GetProperty("alert").GetProperty("signal_count").GetInt32());
        Assert.Equal(alert.PointCount, last.GetProperty("alert").GetProperty("point_count").GetInt32());
        Assert.Equal(feed.Count, feed.Select(e => e.Seq).Distinct().Count());
    }

    public async Task DisposeAsync()
    {
        clientA?.Dispose();
        clientB?.Dispose();
        a?.Dispose();
        b?.Dispose();
        if (database is not null)
        {
            await database.DisposeAsync();
        }
    }
}
