using FinWatch.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

/// <summary>
/// A migration that rewrites stored rows, tested on both providers the same way: migrate to the migration before it,
/// store rows as they were kept then, migrate up, read them back, migrate down again (<see cref="Across"/>).
/// </summary>
public abstract class MigrationAcross(string migrationName) : IDisposable
{
    private readonly SqliteConnection connection = new("Data Source=:memory:");

    /// <summary>Runs <see cref="Across"/> on a fresh in-memory SQLite database.</summary>
    protected void OnSqlite()
    {
        connection.Open();
        using var db = new SqliteFinWatchDbContext(new DbContextOptionsBuilder<SqliteFinWatchDbContext>().UseSqlite(connection).Options);
        Across(db, db.GetService<IMigrator>(), MigrationBefore(db));
    }

    /// <summary>Runs <see cref="Across"/> on a fresh PostgreSQL database of the test server.</summary>
    protected async Task OnPostgresAsync()
    {
        await using var database = await PostgresTestDatabase.CreateAsync();
        await using var db = new PostgresFinWatchDbContext(new DbContextOptionsBuilder<PostgresFinWatchDbContext>().UseNpgsql(database.ConnectionString).Options);
        Across(db, db.GetService<IMigrator>(), MigrationBefore(db));
    }

    /// <summary>The test: <paramref name="before"/> is the id of the migration just before the one under test.</summary>
    protected abstract void Across(FinWatchDbContext db, IMigrator migrator, string before);

    private string MigrationBefore(FinWatchDbContext db)
    {
        var ids = db.GetService<IMigrationsAssembly>().Migrations.Keys.Order(StringComparer.Ordinal).ToList();
        var index = ids.FindIndex(id => id.EndsWith("_" + migrationName, StringComparison.Ordinal));
        Assert.True(index > 0, $"no migration named {migrationName} after a first migration");
        return ids[index - 1];
    }

    public void Dispose()
    {
        connection.Dispose();
        GC.SuppressFinalize(this);
    }
}
