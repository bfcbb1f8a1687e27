using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Measurements;

/// <summary>The answer to an ingest: either the accepted batch's summary or the rejection with its row errors.</summary>
public sealed record IngestOutcome(IngestAccepted? Accepted, RejectedBatch? Rejected);

/// <summary>An accepted batch. Rows already present are reported by row number (the first 100).</summary>
public sealed record IngestAccepted(
    long BatchId, int Rows, int Inserted, int AlreadyPresent, IReadOnlyList<int> AlreadyPresentRows,
    int ReEntrantProfiles, int RadiusExceedsMax, double DurationMs);
