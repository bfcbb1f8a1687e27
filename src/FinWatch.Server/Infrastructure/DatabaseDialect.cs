using FinWatch.Data;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// The provider-specific pieces, chosen once at start-up with the provider (<see cref="DataExtensions"/>): the
/// cross-instance ordering of feed writers and what follows the migrations. Everything else is EF Core.
/// </summary>
public interface IDatabaseDialect
{
    /// <summary>
    /// Called first inside every transaction that writes feed entries, chart points or alerts: waits until no other
    /// such transaction of any instance sharing the database is open, so feed numbers commit in order and a chart
    /// context is evaluated by one instance at a time.
    /// </summary>
    Task LockMonitorAsync(FinWatchDbContext db, CancellationToken cancellationToken);

    /// <summary>Settings applied after the migrations (SQLite: write-ahead logging).</summary>
    Task AfterMigrateAsync(FinWatchDbContext db, CancellationToken cancellationToken);
}

/// <summary>
/// SQLite: one server process owns the file. SQLite's single writer and the process's own gates already order the
/// commits, so the monitor needs no lock of its own.
/// </summary>
public sealed class SqliteDialect : IDatabaseDialect
{
    public Task LockMonitorAsync(FinWatchDbContext db, CancellationToken cancellationToken) => Task.CompletedTask;

    public async Task AfterMigrateAsync(FinWatchDbContext db, CancellationToken cancellationToken) =>
        await db.Database.ExecuteSqlRawAsync("PRAGMA journal_mode=WAL;", cancellationToken);
}

/// <summary>PostgreSQL: several identical instances share the database and coordinate through advisory locks.</summary>
public sealed class PostgresDialect : IDatabaseDialect
{
    public async Task LockMonitorAsync(FinWatchDbContext db, CancellationToken cancellationToken)
    {
        if (db.Database.CurrentTransaction is null)
        {
            throw new InvalidOperationException("the monitor lock is a transaction lock: begin the transaction first");
        }

        await db.Database.ExecuteSqlAsync($"SELECT pg_advisory_xact_lock({PostgresLocks.ClassId}, {PostgresLocks.Monitor})", cancellationToken);
    }

    public Task AfterMigrateAsync(FinWatchDbContext db, CancellationToken cancellationToken) => Task.CompletedTask;
}

/// <summary>FinWatch's advisory lock keys (the two-number form: a class for FinWatch, then the object).</summary>
public static class PostgresLocks
{
    /// <summary>"FW" in ASCII: keeps FinWatch's locks apart from any other application's on the same server.</summary>
    public const int ClassId = 0x4657;

    /// <summary>Held by an ingest transaction from its batch number to its commit: batches commit in number order.</summary>
    public const int Ingest = 1;

    /// <summary>Held by each monitor transaction (evaluation, alert actions, escalation): feed numbers commit in order.</summary>
    public const int Monitor = 2;
}
