using System.Text.Json;
using FinWatch.Data;
using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Monitor;

/// <summary>Writes and reads the live feed (<see cref="FeedEvent"/>): numbered in commit order, read back by number.</summary>
public static class FeedLog
{
    public static readonly JsonSerializerOptions Json = new(JsonSerializerDefaults.Web) { PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower };

    /// <summary>Adds one entry inside the caller's transaction and returns it with its number.</summary>
    public static async Task<FeedMessage> AddAsync(FinWatchDbContext db, string kind, ChartContext context, PointMessage? point, AlertMessage? alert,
        long now, CancellationToken cancellationToken)
    {
        var (entry, message) = Stage(db, kind, context, point, alert, now);
        await db.SaveChangesAsync(cancellationToken);
        return message with { Seq = entry.Seq };
    }

    /// <summary>Stages one entry for the caller's next SaveChanges; its number is known after that (see <see cref="Numbered"/>).</summary>
    public static (FeedEvent Entry, FeedMessage Message) Stage(FinWatchDbContext db, string kind, ChartContext context, PointMessage? point, AlertMessage? alert, long now)
    {
        var message = new FeedMessage(0, kind, context.Code, point, alert);
        var e = new FeedEvent { Kind = kind, ContextId = context.Id, AtMs = now, Payload = JsonSerializer.Serialize(message, Json) };
        db.FeedEvents.Add(e);
        return (e, message);
    }

    /// <summary>The staged entries with the numbers the database gave them, in number order.</summary>
    public static List<FeedMessage> Numbered(IEnumerable<(FeedEvent Entry, FeedMessage Message)> staged) =>
        [.. staged.Select(s => s.Message with { Seq = s.Entry.Seq }).OrderBy(m => m.Seq)];

    /// <summary>The entries after <paramref name="afterSeq"/>, oldest first, optionally for some contexts only.</summary>
    public static async Task<List<FeedMessage>> ReadAsync(FinWatchDbContext db, long afterSeq, IReadOnlyCollection<string>? contexts, int max,
        CancellationToken cancellationToken)
    {
        var q = db.FeedEvents.AsNoTracking().Where(e => e.Seq > afterSeq);
        if (contexts is { Count: > 0 })
        {
            var ids = await db.ChartContexts.Where(c => contexts.Contains(c.Code)).Select(c => c.Id).ToListAsync(cancellationToken);
            q = q.Where(e => ids.Contains(e.ContextId));
        }

        var rows = await q.OrderBy(e => e.Seq).Take(max).ToListAsync(cancellationToken);
        return [.. rows.Select(e => JsonSerializer.Deserialize<FeedMessage>(e.Payload, Json)! with { Seq = e.Seq })];
    }
}
