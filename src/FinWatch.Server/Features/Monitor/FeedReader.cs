using FinWatch.Data;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// Reads the live feed for screens that join or reconnect: the newest number, and the entries after a number (what a
/// screen missed). The hub and the feed endpoint both read through it.
/// </summary>
public sealed class FeedReader(FinWatchDbContext db)
{
    /// <summary>Most entries one catch-up returns; a screen further behind reloads its page.</summary>
    public const int MaxCatchUp = 10_000;

    /// <summary>The newest feed number (0 when the feed is empty).</summary>
    public async Task<long> HeadAsync(CancellationToken cancellationToken) =>
        await db.FeedEvents.MaxAsync(e => (long?)e.Seq, cancellationToken) ?? 0;

    /// <summary>The entries after <paramref name="afterSeq"/> (of these contexts, or all when none), oldest first, at most <see cref="MaxCatchUp"/>.</summary>
    public Task<List<FeedMessage>> AfterAsync(long afterSeq, IReadOnlyCollection<string>? contexts, CancellationToken cancellationToken) =>
        FeedLog.ReadAsync(db, afterSeq, contexts, MaxCatchUp, cancellationToken);
}
