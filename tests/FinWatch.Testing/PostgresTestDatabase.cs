using Npgsql;

namespace FinWatch.Testing;

/// <summary>
/// A fresh PostgreSQL database per test, on the server named by <see cref="Variable"/> (tests/run-all.sh starts a
/// private one for the run; without it the test fails and says so, <see cref="TestServices"/>). The role needs
/// CREATEDB; the database is dropped again when the test ends.
/// </summary>
public sealed class PostgresTestDatabase : IAsyncDisposable
{
    /// <summary>Connection string of a PostgreSQL server, for example <c>Host=127.0.0.1;Username=finwatch;Password=finwatch;Database=postgres</c>.</summary>
    public const string Variable = "FINWATCH_TEST_POSTGRES";

    /// <summary>A Redis server for the SignalR backplane tests, for example <c>127.0.0.1:6379</c>.</summary>
    public const string RedisVariable = "FINWATCH_TEST_REDIS";

    private PostgresTestDatabase(string name, string connectionString)
    {
        Name = name;
        ConnectionString = connectionString;
    }

    public static string? Server => Environment.GetEnvironmentVariable(Variable) is { Length: > 0 } s ? s : null;

    public static string? Redis => Environment.GetEnvironmentVariable(RedisVariable) is { Length: > 0 } s ? s : null;

    public string Name { get; }

    /// <summary>The connection string of this test's own database.</summary>
    public string ConnectionString { get; }

    public static async Task<PostgresTestDatabase> CreateAsync()
    {
        var server = TestServices.RequirePostgres();
        var name = $"finwatch_test_{Guid.NewGuid():N}";
        await using (var admin = new NpgsqlConnection(server))
        {
            await admin.OpenAsync();
            // Byte-order collation, as docker-compose.yml creates the database: strings sort as on SQLite.
            await using var cmd = new NpgsqlCommand($"CREATE DATABASE {name} TEMPLATE template0 ENCODING 'UTF8' LC_COLLATE 'C' LC_CTYPE 'C'", admin);
            await cmd.ExecuteNonQueryAsync();
        }

        var own = new NpgsqlConnectionStringBuilder(server) { Database = name }.ToString();
        return new PostgresTestDatabase(name, own);
    }

    public async ValueTask DisposeAsync()
    {
        await using (var mine = new NpgsqlConnection(ConnectionString))
        {
            NpgsqlConnection.ClearPool(mine);
        }

        await using var admin = new NpgsqlConnection(Server);
        await admin.OpenAsync();
        await using var cmd = new NpgsqlCommand($"DROP DATABASE IF EXISTS {Name} WITH (FORCE)", admin);
        await cmd.ExecuteNonQueryAsync();
    }
}
