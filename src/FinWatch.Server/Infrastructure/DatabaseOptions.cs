using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Infrastructure;

/// <summary>Database settings (section "FinWatch:Database"). With none given, SQLite at db/finwatch.db is created and migrated.</summary>
public sealed class DatabaseOptions
{
    public const string Section = "FinWatch:Database";

    /// <summary>"Sqlite" (the embedded default). PostgreSQL support arrives with the scale-out work.</summary>
    [Required, RegularExpression("^Sqlite$", ErrorMessage = "only the Sqlite provider is available in this version")]
    public string Provider { get; set; } = "Sqlite";

    /// <summary>Path of the SQLite file; relative paths are anchored by <see cref="FinWatchPaths"/>.</summary>
    [Required]
    public string SqlitePath { get; set; } = "db/finwatch.db";

    /// <summary>A full connection string; overrides <see cref="SqlitePath"/> when set (tests use an in-memory database).</summary>
    public string? ConnectionString { get; set; }
}
