using FinWatch.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

public sealed class FinWatchDbContextTests : IDisposable
{
    private readonly SqliteConnection connection = new("Data Source=:memory:");

    public FinWatchDbContextTests() => connection.Open();

    private SqliteFinWatchDbContext NewContext() =>
        new(new DbContextOptionsBuilder<SqliteFinWatchDbContext>().UseSqlite(connection).Options);

    [Theory]
    [InlineData("MeasuredAtMs", "measured_at_ms")]
    [InlineData("TopWidthNm", "top_width_nm")]
    [InlineData("AreaNm2", "area_nm2")]
    [InlineData("Id", "id")]
    public void ToSnakeCase_PropertyNames_GiveColumnNames(string name, string expected) =>
        Assert.Equal(expected, FinWatchDbContext.ToSnakeCase(name));

    // The SQLite migration set must match the model: a model change without a migration fails here (and in CI).
    [Fact]
    public void SqliteMigrations_AreCurrentWithTheModel()
    {
        using var db = NewContext();
        Assert.False(db.Database.HasPendingModelChanges(), "run: dotnet ef migrations add <Name> --project src/FinWatch.Data --context SqliteFinWatchDbContext --output-dir Migrations/Sqlite");
    }

    // The PostgreSQL set is checked the same way; building its model needs no server.
    [Fact]
    public void PostgresMigrations_AreCurrentWithTheModel()
    {
        using var db = NewPostgresContext();
        Assert.False(db.Database.HasPendingModelChanges(), "run: dotnet ef migrations add <Name> --project src/FinWatch.Data --context PostgresFinWatchDbContext --output-dir Migrations/Postgres");
    }

    // Both sets describe one model: the same tables with the same columns, only the column types differ by provider.
    [Fact]
    public void BothProviders_MapTheSameTablesAndColumns()
    {
        using var sqlite = NewContext();
        using var postgres = NewPostgresContext();
        Assert.Equal(Columns(sqlite), Columns(postgres));
    }

    [Fact]
    public void PostgresSchemaScript_InDbFolder_MatchesTheMigrations()
    {
        using var db = NewPostgresContext();
        var script = db.GetService<IMigrator>().GenerateScript();
        var stored = File.ReadAllText(Path.Combine(TestPaths.RepositoryRoot(), "db", "postgres", "schema.sql"));
        Assert.True(Normalise(script) == Normalise(stored),
            "db/postgres/schema.sql is out of date; run: dotnet ef migrations script --project src/FinWatch.Data --context PostgresFinWatchDbContext -o db/postgres/schema.sql");
        Assert.Contains("CREATE TRIGGER audit_entries_no_update", script, StringComparison.Ordinal); // the append-only audit trail, in PL/pgSQL
    }

    private static PostgresFinWatchDbContext NewPostgresContext() =>
        new(new DbContextOptionsBuilder<PostgresFinWatchDbContext>().UseNpgsql("Host=localhost;Database=unused").Options);

    private static List<string> Columns(FinWatchDbContext db) =>
        [.. db.Model.GetRelationalModel().Tables
            .SelectMany(t => t.Columns.Select(c => $"{t.Name}.{c.Name}"))
            .Order(StringComparer.Ordinal)];

    [Fact]
    public void Migrate_CreatesTablesAndTheNaturalKeyIndex()
    {
        using var db = NewContext();
        db.Database.Migrate();
        using var cmd = connection.CreateCommand();
        cmd.CommandText = "SELECT sql FROM sqlite_master WHERE name = 'IX_measurements_lot_id_wafer_slot_site_id_step_measured_at_ms'";
        var sql = (string?)cmd.ExecuteScalar();
        Assert.NotNull(sql);
        Assert.StartsWith("CREATE UNIQUE INDEX", sql, StringComparison.Ordinal);
        Assert.Contains("\"measured_at_ms\"", sql, StringComparison.Ordinal);
    }

    [Fact]
    public void Migrate_AppliesEveryMigrationOfTheSet()
    {
        using var db = NewContext();
        db.Database.Migrate();
        var all = db.GetService<IMigrationsAssembly>().Migrations.Keys;
        Assert.Equal(all.Order(StringComparer.Ordinal), db.Database.GetAppliedMigrations().Order(StringComparer.Ordinal));
        Assert.NotEmpty(all);
    }

    // db/sqlite/schema.sql is the SQL that the migrations run, for operators who read or apply it by hand.
    [Fact]
    public void SchemaScript_InDbFolder_MatchesTheMigrations()
    {
        using var db = NewContext();
        var script = db.GetService<IMigrator>().GenerateScript();
        var path = Path.Combine(TestPaths.RepositoryRoot(), "db", "sqlite", "schema.sql");
        var stored = File.ReadAllText(path);
        Assert.True(Normalise(script) == Normalise(stored),
            "db/sqlite/schema.sql is out of date; run: dotnet ef migrations script --project src/FinWatch.Data --context SqliteFinWatchDbContext -o db/sqlite/schema.sql");
    }

    private static string Normalise(string sql) => sql.Replace("\uFEFF", "", StringComparison.Ordinal).Replace("\r\n", "\n", StringComparison.Ordinal).Trim();

    public void Dispose() => connection.Dispose();
}
