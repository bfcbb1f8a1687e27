using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// The real app on its own fresh PostgreSQL database (migrated by the app at start, as in production). Use with
/// <see cref="ScaleOutFactAttribute"/>: without a server the test fails and says so, except on a quick run, which skips it.
/// </summary>
public abstract class PostgresIntegrationTest : IntegrationTest
{
    private PostgresTestDatabase? database;

    protected PostgresTestDatabase Database => database ?? throw new InvalidOperationException("the database is created at initialisation");

    protected override async Task BeforeStartAsync()
    {
        database = await PostgresTestDatabase.CreateAsync();
        Factory.UsePostgres(database.ConnectionString);
    }

    protected override async Task AfterStopAsync()
    {
        if (database is not null)
        {
            await database.DisposeAsync();
        }
    }
}
