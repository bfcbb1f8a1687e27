using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.SignalR;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// What the server calls on a connected browser: the feed entries (points and alert changes) of one commit, in number
/// order. A client that watches everything and some contexts too may get an entry twice; it keeps the first, which is
/// the one for everything (a point entry without its point), so a page that draws points watches their contexts only.
/// </summary>
public interface IMonitorClient
{
    Task Feed(IReadOnlyList<FeedMessage> entries);
}

/// <summary>
/// The live monitor hub (/hubs/monitor). A client watches the contexts it shows (or everything, for the floor
/// overview and the alert queue), and after a dropped connection asks for what it missed since the last feed number it
/// saw. Entries carry their number, so a client drops any it has already seen. The hub manages subscriptions only: what
/// it returns comes from the <see cref="FeedReader"/>.
/// </summary>
public sealed class MonitorHub(FeedReader feed, Telemetry telemetry) : Hub<IMonitorClient>
{
    public const string Path = "/hubs/monitor";
    public const string AllGroup = "all";

    public static string ContextGroup(string code) => "context:" + code;

    public override Task OnConnectedAsync()
    {
        telemetry.ScreenConnected();
        return base.OnConnectedAsync();
    }

    public override Task OnDisconnectedAsync(Exception? exception)
    {
        telemetry.ScreenDisconnected();
        return base.OnDisconnectedAsync(exception);
    }

    /// <summary>
    /// Receive the entries of these contexts from now on. Returns the newest feed number at the moment of joining:
    /// everything up to it is in the HTTP endpoints already, everything after it will be pushed.
    /// </summary>
    public async Task<long> Watch(string[] contexts)
    {
        ArgumentNullException.ThrowIfNull(contexts);
        foreach (var c in contexts.Distinct(StringComparer.Ordinal).Take(500))
        {
            await Groups.AddToGroupAsync(Context.ConnectionId, ContextGroup(c));
        }

        return await feed.HeadAsync(Context.ConnectionAborted);
    }

    /// <summary>
    /// Receive every entry from now on (floor overview, alert queue), point entries without their point (number, kind and
    /// context: which chart changed); returns the newest feed number, as <see cref="Watch"/>.
    /// </summary>
    public async Task<long> WatchAll()
    {
        await Groups.AddToGroupAsync(Context.ConnectionId, AllGroup);
        return await feed.HeadAsync(Context.ConnectionAborted);
    }

    /// <summary>The entries after <paramref name="afterSeq"/> (of these contexts, or all when empty), oldest first, at most 10,000.</summary>
    public Task<List<FeedMessage>> CatchUp(long afterSeq, string[]? contexts) => feed.AfterAsync(afterSeq, contexts, Context.ConnectionAborted);
}
