using FinWatch.Data;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Measurements;

/// <summary>Opens the site writer of the database's provider.</summary>
public static class SiteWriters
{
    /// <summary>Opens an ingest batch's transaction with the provider's bulk writer.</summary>
    public static async Task<ISiteWriter> BeginAsync(FinWatchDbContext db, string source, string? label, long receivedAtMs, CancellationToken cancellationToken) =>
        db.Database.IsNpgsql()
            ? await PostgresSiteWriter.BeginAsync(db, source, label, receivedAtMs, cancellationToken)
            : await SqliteSiteWriter.BeginAsync(db, source, label, receivedAtMs, cancellationToken);
}

/// <summary>
/// Writes one ingest batch in one transaction, all or nothing, with the provider's fastest path: prepared inserts on
/// SQLite (<see cref="SqliteSiteWriter"/>), binary COPY on PostgreSQL (<see cref="PostgresSiteWriter"/>). Disposing
/// without <see cref="CommitAsync"/> rolls back, so an error or a dropped request leaves nothing.
/// </summary>
public interface ISiteWriter : IAsyncDisposable
{
    long BatchId { get; }

    /// <summary>
    /// How many validated rows the reader may run ahead of this writer. A bulk writer stops the consumer for a whole
    /// chunk at a time, so the reader must be able to prepare the next chunk meanwhile.
    /// </summary>
    int Lookahead { get; }

    /// <summary>The product a lot is stored under already, if any (a lot belongs to one product).</summary>
    int? StoredProductOfLot(string lotId);

    /// <summary>
    /// Adds a site. Every site added is answered exactly once in <paramref name="answers"/>: by this call or by a later
    /// one or by <see cref="Flush"/> (a bulk writer answers a chunk at a time).
    /// </summary>
    void Insert(SiteRecord site, string measuredAtText, List<SiteAnswer> answers);

    /// <summary>Stores what is buffered and answers the sites still unanswered; call before <see cref="CommitAsync"/>.</summary>
    void Flush(List<SiteAnswer> answers);

    /// <summary>Recomputes the lot summaries the batch touched, fills in the batch record and commits.</summary>
    Task CommitAsync(IEnumerable<(string LotId, string Step)> lotSteps, IEnumerable<(string LotId, string Step, string Chamber)> chambers,
        int rowCount, int inserted, int alreadyPresent, long completedAtMs, CancellationToken cancellationToken);
}

/// <summary>What became of one site: stored, already present from an earlier batch, or twice in this batch.</summary>
public readonly record struct SiteAnswer(SiteRecord Site, string MeasuredAtText, InsertResult Result);
