using System.Data.Common;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace FinWatch.Data;

/// <summary>
/// Per-connection SQLite settings : wait for a busy writer instead of failing at once,
/// enforce foreign keys, use synchronous=NORMAL (durable in WAL mode across process crashes), and cut the write-ahead
/// log back to 64 MB after a large batch has been checkpointed.
/// </summary>
public sealed class SqliteConnectionSetup : DbConnectionInterceptor
{
    public const string Pragmas = "PRAGMA busy_timeout=10000; PRAGMA foreign_keys=ON; PRAGMA synchronous=NORMAL; PRAGMA journal_size_limit=67108864;";

    public override void ConnectionOpened(DbConnection connection, ConnectionEndEventData eventData) => Apply(connection);

    public override async Task ConnectionOpenedAsync(DbConnection connection, ConnectionEndEventData eventData, CancellationToken cancellationToken = default)
    {
        using var cmd = connection.CreateCommand();
        cmd.CommandText = Pragmas;
        await cmd.ExecuteNonQueryAsync(cancellationToken);
    }

    private static void Apply(DbConnection connection)
    {
        using var cmd = connection.CreateCommand();
        cmd.CommandText = Pragmas;
        cmd.ExecuteNonQuery();
    }
}
