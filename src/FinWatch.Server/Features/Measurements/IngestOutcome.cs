namespace FinWatch.Server.Features.Measurements;

/// <summary>The answer to an ingest: either the accepted batch's summary or the rejection with its row errors.</summary>
public sealed record IngestOutcome(IngestAccepted? Accepted, IngestRejected? Rejected);

/// <summary>An accepted batch. Rows already present are reported by row number (the first 100).</summary>
public sealed record IngestAccepted(
    long BatchId, int Rows, int Inserted, int AlreadyPresent, IReadOnlyList<int> AlreadyPresentRows,
    int ReEntrantProfiles, int RadiusExceedsMax, double DurationMs);

/// <summary>A rejected batch: nothing was stored. Errors holds the first ones; ErrorCount counts them all.</summary>
public sealed record IngestRejected(int RowsRead, int ErrorCount, IReadOnlyList<RowError> Errors);
