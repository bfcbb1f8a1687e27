using System.Data.Common;
using Microsoft.EntityFrameworkCore.Diagnostics;

namespace FinWatch.Data;

/// <summary>
/// Per-connection SQLite settings (shared/RECIPES.md): wait for a busy writer instead of failing at once,
/// enforce foreign keys, and use synchronous=NORMAL, which is durable in WAL mode across process crashes.
/// </summary>
public sealed class SqliteConnectionSetup : DbConnectionInterceptor
{
    public const string Pragmas = "PRAGMA busy_timeout=10000; PRAGMA foreign_keys=ON; PRAGMA synchronous=NORMAL;";

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
