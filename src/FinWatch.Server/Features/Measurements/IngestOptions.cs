using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Features.Measurements;

/// <summary>Ingest settings (section "FinWatch:Ingest"); every one has a working default.</summary>
public sealed class IngestOptions
{
    public const string Section = "FinWatch:Ingest";

    /// <summary>Watched folder; a dropped file is ingested and moved to processed/ or rejected/. Relative paths are anchored like the database path (the repository root in a checkout).</summary>
    public string InboxPath { get; set; } = "db/inbox";

    /// <summary>Turns the inbox watcher off (tests that do not need it).</summary>
    public bool InboxEnabled { get; set; } = true;

    /// <summary>How often the inbox is scanned for files that the file-system events missed.</summary>
    [Range(1, 3600)]
    public int InboxPollSeconds { get; set; } = 5;

    /// <summary>Measured-at times later than the server clock plus this are rejected as "in the future".</summary>
    [Range(0, 1440)]
    public int FutureToleranceMinutes { get; set; } = 60;

    /// <summary>Largest request body for the ingest endpoints (bytes). A million-row CSV is about 150 MB.</summary>
    [Range(1024, long.MaxValue)]
    public long MaxBodyBytes { get; set; } = 2L * 1024 * 1024 * 1024;

    /// <summary>Store the model's predicted electrical shifts with every site that has a whole profile (on by default).</summary>
    public bool PredictShifts { get; set; } = true;

    /// <summary>How many row errors a rejection lists (the total is always counted).</summary>
    [Range(1, 10_000)]
    public int MaxReportedErrors { get; set; } = 100;
}
