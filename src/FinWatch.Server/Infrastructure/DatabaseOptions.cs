using System.ComponentModel.DataAnnotations;
using System.Globalization;
using Npgsql;

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

    /// <summary>
    /// PostgreSQL only: the planner's cost of a random page read for FinWatch's sessions, sent as a start-up option
    /// (so it outlives the pool's session reset and touches no other application on the server). PostgreSQL's default
    /// of 4 assumes spinning disks and makes the planner read a week of one series by bitmap scan and sort (25–36 ms on
    /// the 10-million-row benchmark) where the index already gives the order (6–18 ms); the PostgreSQL manual
    /// (runtime-config-query, random_page_cost) suggests about 1.1 for solid-state storage or data mostly in cache.
    /// Empty leaves the server's own setting; a value in the connection string's Options wins.
    /// </summary>
    [Range(0.1, 100, ErrorMessage = "the random page cost is 0.1 to 100")]
    public double? PostgresRandomPageCost { get; set; } = 1.1;

    public bool IsPostgreSql => Provider == PostgreSql;

    /// <summary>The PostgreSQL connection string FinWatch opens: <see cref="ConnectionString"/> with the planner option.</summary>
    public string PostgresConnectionString() => WithPlannerOptions(ConnectionString!, PostgresRandomPageCost);

    /// <summary>Adds <c>-c random_page_cost=…</c> to the connection's Options unless they already set it.</summary>
    public static string WithPlannerOptions(string connectionString, double? randomPageCost)
    {
        var builder = new NpgsqlConnectionStringBuilder(connectionString);
        if (randomPageCost is { } cost && builder.Options?.Contains("random_page_cost", StringComparison.Ordinal) != true)
        {
            builder.Options = string.Create(CultureInfo.InvariantCulture, $"{builder.Options} -c random_page_cost={cost}").Trim();
        }

        return builder.ToString();
    }

    public IEnumerable<ValidationResult> Validate(ValidationContext validationContext)
    {
        if (IsPostgreSql && string.IsNullOrWhiteSpace(ConnectionString))
        {
            yield return new ValidationResult("the PostgreSql provider needs FinWatch:Database:ConnectionString", [nameof(ConnectionString)]);
        }
        else if (IsPostgreSql && ParseError(ConnectionString!) is { } error)
        {
            yield return new ValidationResult($"FinWatch:Database:ConnectionString is not a PostgreSQL connection string: {error}", [nameof(ConnectionString)]);
        }
    }

    private static string? ParseError(string connectionString)
    {
        try
        {
            _ = new NpgsqlConnectionStringBuilder(connectionString);
            return null;
        }
        catch (ArgumentException e)
        {
            return e.Message;
        }
    }
}
