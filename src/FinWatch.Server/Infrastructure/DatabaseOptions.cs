using System.ComponentModel.DataAnnotations;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// Database settings (section "FinWatch:Database"). With none given, SQLite at db/finwatch.db is created and migrated;
/// with Provider "PostgreSql" and a connection string, the PostgreSQL database is migrated and shared by every instance.
/// </summary>
public sealed class DatabaseOptions : IValidatableObject
{
    public const string Section = "FinWatch:Database";
    public const string Sqlite = "Sqlite";
    public const string PostgreSql = "PostgreSql";

    /// <summary>"Sqlite" (the embedded default, one server) or "PostgreSql" (several instances, README Scale-out).</summary>
    [Required, RegularExpression("^(Sqlite|PostgreSql)$", ErrorMessage = "the provider is Sqlite or PostgreSql")]
    public string Provider { get; set; } = Sqlite;

    /// <summary>Path of the SQLite file; relative paths are anchored by <see cref="FinWatchPaths"/>.</summary>
    [Required]
    public string SqlitePath { get; set; } = "db/finwatch.db";

    /// <summary>
    /// A full connection string. SQLite: overrides <see cref="SqlitePath"/> when set. PostgreSQL: required
    /// (for example <c>Host=db;Database=finwatch;Username=finwatch;Password=…</c>).
    /// </summary>
    public string? ConnectionString { get; set; }

    public bool IsPostgreSql => Provider == PostgreSql;

    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        if (IsPostgreSql && string.IsNullOrWhiteSpace(ConnectionString))
        {
            yield return new ValidationResult("the PostgreSql provider needs FinWatch:Database:ConnectionString", [nameof(ConnectionString)]);
        }
    }
}
