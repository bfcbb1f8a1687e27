using FinWatch.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

/// <summary>
/// A test of one named migration of both providers: an in-memory SQLite database for the SQLite set (a PostgreSQL
/// test makes its own database), and the ids of the migration and of the one before it in a provider's set.
/// </summary>
public abstract class MigrationTest : IDisposable
{
    private readonly SqliteConnection connection = new("Data Source=:memory:");

    protected MigrationTest() => connection.Open();

    /// <summary>Runs <paramref name="check"/> on a fresh in-memory SQLite database, not yet migrated.</summary>
    protected void OnSqlite(Action<FinWatchDbContext> check)
    {
        using var db = new SqliteFinWatchDbContext(new DbContextOptionsBuilder<SqliteFinWatchDbContext>().UseSqlite(connection).Options);
        check(db);
    }

    /// <summary>Runs <paramref name="check"/> on a fresh PostgreSQL database of the test server, not yet migrated.</summary>
    protected static async Task OnPostgresAsync(Action<FinWatchDbContext> check)
    {
        await using var database = await PostgresTestDatabase.CreateAsync();
        await using (var db = new PostgresFinWatchDbContext(new DbContextOptionsBuilder<PostgresFinWatchDbContext>().UseNpgsql(database.ConnectionString).Options))
        {
            check(db);
        }
    }

    /// <summary>The ids of the migration before <paramref name="name"/> and of <paramref name="name"/> itself.</summary>
    protected static (string Before, string Self) Around(FinWatchDbContext db, string name)
    {
        var ids = db.GetService<IMigrationsAssembly>().Migrations.Keys.Order(StringComparer.Ordinal).ToList();
        var index = ids.FindIndex(id => id.EndsWith("_" + name, StringComparison.Ordinal));
        Assert.True(index > 0, $"no migration named {name} after a first migration");
        return (ids[index - 1], ids[index]);
    }

    public void Dispose()
    {
        connection.Dispose();
        GC.SuppressFinalize(this);
    }
}
