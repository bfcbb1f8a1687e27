namespace FinWatch.Server.Infrastructure;

/// <summary>A measurement batch that ingest has committed: the hand-over from storing to evaluating.</summary>
/// <param name="BatchId">The batch's number; batches commit in number order.</param>
/// <param name="Source">Where it came from (api-json, api-csv, inbox, demo).</param>
public sealed record StoredBatch(long BatchId, string Source);

/// <summary>
/// Hears of every batch ingest commits, in commit order, before ingest answers the sender: so when a tool's upload
/// returns, its points are judged and pushed. Ingest knows only this interface; the monitor is the listener.
/// </summary>
public interface IBatchStoredListener
{
    Task BatchStoredAsync(StoredBatch batch, CancellationToken cancellationToken);
}
