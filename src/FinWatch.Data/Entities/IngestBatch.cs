namespace FinWatch.Data.Entities;

/// <summary>The record of one accepted ingest: where it came from, when, and what it contained.</summary>
public sealed class IngestBatch
{
    public long Id { get; set; }

    /// <summary>api-json, api-csv, inbox or demo.</summary>
    public required string Source { get; set; }

    /// <summary>File name or other caller-supplied label, if any.</summary>
    public string? Label { get; set; }

    public long ReceivedAtMs { get; set; }
    public long CompletedAtMs { get; set; }
    public int RowCount { get; set; }
    public int Inserted { get; set; }
    public int AlreadyPresent { get; set; }
}
