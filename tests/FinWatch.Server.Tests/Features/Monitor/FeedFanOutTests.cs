using System.Buffers;
using System.Diagnostics.CodeAnalysis;
using System.Threading.Channels;
using FinWatch.Server.Features.Monitor;
using Microsoft.AspNetCore.Connections;
using Microsoft.AspNetCore.SignalR;
using Microsoft.AspNetCore.SignalR.Protocol;
using Microsoft.AspNetCore.SignalR.Client;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Options;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Monitor;

/// <summary>
/// How often the server turns a pushed frame into bytes: once per group it goes to, however many screens are in the
/// group. The hub's JSON protocol is wrapped so that every serialization of a feed frame is counted.
/// </summary>
public class FeedFanOutTests : IntegrationTest
{
    private readonly CountingProtocol protocol = new();

    public FeedFanOutTests()
    {
        Factory.WithServices(services =>
        {
            services.RemoveAll<IHubProtocol>();
            services.AddSingleton<IHubProtocol>(sp => protocol.Wrap(new JsonHubProtocol(sp.GetRequiredService<IOptions<JsonHubProtocolOptions>>())));
        });
    }

    [Fact]
    public async Task OneIngest_ToManyScreens_IsSerializedOncePerGroup()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        await ApprovedContextAsync(Client, "TRI-TOP-2");

        // Six screens on everything, six on each context: 18 connections in three groups.
        string[]?[] watches = [.. Enumerable.Repeat<string[]?>(null, 6), .. Enumerable.Repeat<string[]?>(["TRI-TOP"], 6),
            .. Enumerable.Repeat<string[]?>(["TRI-TOP-2"], 6)];
        var screens = new List<(HubConnection Connection, Channel<FeedMessage> Received, string[]? Watches)>();
        try
        {
            foreach (var w in watches)
            {
                var received = Channel.CreateUnbounded<FeedMessage>();
                var connection = MonitorHubTests.Connect(Factory, received);
                screens.Add((connection, received, w));
                await connection.StartAsync();
                await (w is null ? connection.InvokeAsync<long>(nameof(MonitorHub.WatchAll)) : connection.InvokeAsync<long>(nameof(MonitorHub.Watch), w));
            }

            var before = protocol.FeedFrames;
            await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.0, 0.0)); // two wafers: two points in each context

            foreach (var (_, received, w) in screens)
            {
                var got = new List<FeedMessage>();
                using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
                while (got.Count < (w is null ? 4 : 2))
                {
                    got.Add(await received.Reader.ReadAsync(timeout.Token));
                }

                Assert.All(got, m => Assert.Equal("point", m.Kind));
                Assert.Equal(w is null ? ["TRI-TOP", "TRI-TOP-2"] : w, got.Select(m => m.Context).Distinct().Order(StringComparer.Ordinal));

                // A chart screen gets its points in full; a screen on everything learns only which chart changed.
                Assert.All(got, m => Assert.Equal(w is not null, m.Point is not null));
            }

            // The "all" group and the two context groups: three serializations for 18 screens.
            Assert.Equal(3, protocol.FeedFrames - before);
        }
        finally
        {
            foreach (var (connection, _, _) in screens)
            {
                await connection.DisposeAsync();
            }
        }
    }

    /// <summary>Counts the feed frames the wrapped protocol serializes, by either of the protocol's two ways of writing.</summary>
    private sealed class CountingProtocol
    {
        private int feedFrames;

        public int FeedFrames => Volatile.Read(ref feedFrames);

        public IHubProtocol Wrap(IHubProtocol inner) => new Counting(inner, this);

        private void Saw(HubMessage message)
        {
            if (message is InvocationMessage { Target: nameof(IMonitorClient.Feed) })
            {
                Interlocked.Increment(ref feedFrames);
            }
        }

        private sealed class Counting(IHubProtocol inner, CountingProtocol counts) : IHubProtocol
        {
            public string Name => inner.Name;

            public int Version => inner.Version;

            public TransferFormat TransferFormat => inner.TransferFormat;

            public bool IsVersionSupported(int version) => inner.IsVersionSupported(version);

            public bool TryParseMessage(ref ReadOnlySequence<byte> input, IInvocationBinder binder, [NotNullWhen(true)] out HubMessage? message) =>
                inner.TryParseMessage(ref input, binder, out message);

            public void WriteMessage(HubMessage message, IBufferWriter<byte> output)
            {
                counts.Saw(message);
                inner.WriteMessage(message, output);
            }

            public ReadOnlyMemory<byte> GetMessageBytes(HubMessage message)
            {
                counts.Saw(message);
                return inner.GetMessageBytes(message);
            }
        }
    }
}
