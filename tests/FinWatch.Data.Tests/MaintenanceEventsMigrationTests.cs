using FinWatch.Physics;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

/// <summary>
/// The AddMaintenanceEvents migration of both providers: it adds the maintenance log and its two indexes and nothing
/// else; a row written as the API stores it reads back through the model; Down removes the table and leaves every
/// other table as it was.
/// </summary>
public sealed class MaintenanceEventsMigrationTests : MigrationTest
{
    private const string MigrationName = "AddMaintenanceEvents";

    private const string SqliteTables = "SELECT name AS \"Value\" FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%'";
    private const string SqliteIndexes = "SELECT name AS \"Value\" FROM sqlite_master WHERE type = 'index' AND tbl_name = 'maintenance_events'";
    private const string PostgresTables = "SELECT table_name AS \"Value\" FROM information_schema.tables WHERE table_schema = 'public'";
    private const string PostgresIndexes = "SELECT indexname AS \"Value\" FROM pg_indexes WHERE tablename = 'maintenance_events' AND indexname NOT LIKE 'PK_%'";

    [Fact]
    public void Sqlite_UpAddsTheLogAndItsIndexes_DownRemovesOnlyIt() =>
        OnSqlite(db => MigrateUpAndDown(db, () => Names(db, SqliteTables), () => Names(db, SqliteIndexes)));

    [ScaleOutFact]
    public Task Postgres_UpAddsTheLogAndItsIndexes_DownRemovesOnlyIt() =>
        OnPostgresAsync(db => MigrateUpAndDown(db, () => Names(db, PostgresTables), () => Names(db, PostgresIndexes)));

    private static void MigrateUpAndDown(FinWatchDbContext db, Func<List<string>> tables, Func<List<string>> indexes)
    {
        var migrator = db.GetService<IMigrator>();
        var (before, self) = Around(db, MigrationName);
        migrator.Migrate(before);
        var tablesBefore = tables();
        Assert.DoesNotContain("maintenance_events", tablesBefore);

        migrator.Migrate(self);

        Assert.Equal([.. tablesBefore.Append("maintenance_events").Order(StringComparer.Ordinal)], tables());
        Assert.Equal(["IX_maintenance_events_chamber_occurred_at_ms", "IX_maintenance_events_occurred_at_ms"], indexes());
        // Written as the endpoint stores it (the kind's one spelling, times in UTC epoch ms), read through the model.
        db.Database.ExecuteSql(
            $"""
            INSERT INTO maintenance_events (chamber, kind, occurred_at_ms, performed_by, note, recorded_by, recorded_at_ms, source)
            VALUES ('ETA-1', 'wet_clean', 1795000000000, 'Crew Blue', 'after 1200 RF hours', 'sam.supervisor', 1795000600000, 'api')
            """);
        var stored = db.MaintenanceEvents.AsNoTracking().Single();
        Assert.Equal(("ETA-1", MaintenanceKind.WetClean, 1_795_000_000_000L), (stored.Chamber, stored.Kind, stored.OccurredAtMs));

        migrator.Migrate(before);

        Assert.Equal(tablesBefore, tables());
    }

    private static List<string> Names(FinWatchDbContext db, string sql) =>
        [.. db.Database.SqlQueryRaw<string>(sql).AsEnumerable().Order(StringComparer.Ordinal)];
}
