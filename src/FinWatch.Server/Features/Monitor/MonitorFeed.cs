using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.SignalR;

namespace FinWatch.Server.Features.Monitor;

/// <summary>Pushes committed feed entries to the watching clients, in order, off the request's path.</summary>
public sealed partial class MonitorFeed(IHubContext<MonitorHub, IMonitorClient> hub, Telemetry telemetry, ILogger<MonitorFeed> logger) : IDisposable
{
    private readonly SemaphoreSlim order = new(1, 1);

    /// <summary>How the frames to one chart context's screens are counted (not by context: there may be hundreds).</summary>
    private const string OneContext = "context";

    public void Dispose() => order.Dispose();

    public void Publish(IReadOnlyList<FeedMessage> messages)
    {
        if (messages.Count == 0)
        {
            return;
        }

        _ = SendAsync(messages);
    }

    private async Task SendAsync(IReadOnlyList<FeedMessage> messages)
    {
        await order.WaitAsync();
        var audience = MonitorHub.AllGroup;
        try
        {
            // One frame per group and publish (an ingest's points and alerts together), not one per entry: a lot
            // brings dozens of entries for hundreds of screens. SignalR turns each frame into bytes once for its whole
            // group, whatever the number of screens in it. The screens that watch everything (floor overview, alert
            // queue) use a point entry only to learn which chart changed, so theirs come without the point: every
            // screen parses all it is sent, and those points were nearly half of what was parsed (docs/performance.md).
            await hub.Clients.Group(MonitorHub.AllGroup).Feed(WithoutPoints(messages));
            telemetry.FramePushed(audience, sent: true);
            audience = OneContext;
            foreach (var group in messages.GroupBy(m => m.Context, StringComparer.Ordinal))
            {
                await hub.Clients.Group(MonitorHub.ContextGroup(group.Key)).Feed([.. group]);
                telemetry.FramePushed(audience, sent: true);
            }
        }
        catch (Exception e) when (e is not OutOfMemoryException)
        {
            // Clients that miss an entry catch up from the feed by number; the data are already committed.
            telemetry.FramePushed(audience, sent: false);
            LogSendFailed(e);
        }
        finally
        {
            order.Release();
        }
    }

    /// <summary>The entries as the screens that watch everything get them: a point entry keeps its number, kind and context.</summary>
    private static List<FeedMessage> WithoutPoints(IReadOnlyList<FeedMessage> messages) =>
        [.. messages.Select(m => m.Point is null ? m : m with { Point = null })];

    [LoggerMessage(Level = LogLevel.Warning, Message = "Live feed: sending to clients failed; they will catch up by feed number")]
    private partial void LogSendFailed(Exception e);
}
