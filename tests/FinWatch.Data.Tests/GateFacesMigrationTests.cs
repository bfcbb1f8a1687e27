using FinWatch.Physics;
using FinWatch.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

/// <summary>
/// The GateFacesText migration of both providers: products stored before it with the enum member's name
/// ("TriGate", "DoubleGate") read back as the same gate configuration after it, stored as the API's spelling; Down
/// writes the old names again.
/// </summary>
public sealed class GateFacesMigrationTests : IDisposable
{
    private const string MigrationName = "GateFacesText";

    private readonly SqliteConnection connection = new("Data Source=:memory:");

    public GateFacesMigrationTests() => connection.Open();

    [Fact]
    public void Sqlite_ProductsStoredWithEnumNames_ReadBackAfterTheMigrationAndRevertOnDown()
    {
        using var db = new SqliteFinWatchDbContext(new DbContextOptionsBuilder<SqliteFinWatchDbContext>().UseSqlite(connection).Options);
        MigrateAcrossAndBack(db);
    }

    [ScaleOutFact]
    public async Task Postgres_ProductsStoredWithEnumNames_ReadBackAfterTheMigrationAndRevertOnDown()
    {
        await using var database = await PostgresTestDatabase.CreateAsync();
        await using (var db = new PostgresFinWatchDbContext(new DbContextOptionsBuilder<PostgresFinWatchDbContext>().UseNpgsql(database.ConnectionString).Options))
        {
            MigrateAcrossAndBack(db);
        }
    }

    private static void MigrateAcrossAndBack(FinWatchDbContext db)
    {
        var migrator = db.GetService<IMigrator>();
        var before = MigrationBefore(db);
        migrator.Migrate(before);
        InsertProduct(db, "TRN-OLD", "TriGate");
        InsertProduct(db, "BRM-OLD", "DoubleGate");

        migrator.Migrate();

        Assert.Equal(GateFaces.TriGate, db.Products.AsNoTracking().Single(p => p.Code == "TRN-OLD").GateFaces);
        Assert.Equal(GateFaces.DoubleGate, db.Products.AsNoTracking().Single(p => p.Code == "BRM-OLD").GateFaces);
        Assert.Equal(["double-gate", "tri-gate"], StoredText(db));

        migrator.Migrate(before);

        Assert.Equal(["DoubleGate", "TriGate"], StoredText(db));
    }

    /// <summary>The id of the migration just before GateFacesText in the provider's set.</summary>
    private static string MigrationBefore(FinWatchDbContext db)
    {
        var ids = db.GetService<IMigrationsAssembly>().Migrations.Keys.Order(StringComparer.Ordinal).ToList();
        var index = ids.FindIndex(id => id.EndsWith("_" + MigrationName, StringComparison.Ordinal));
        Assert.True(index > 0, $"no migration named {MigrationName} after a first migration");
        return ids[index - 1];
    }

    // Plain SQL: the model's converter cannot write the old names, and the columns are the same on both providers.
    private static void InsertProduct(FinWatchDbContext db, string code, string storedFaces) => db.Database.ExecuteSql(
        $"""
        INSERT INTO products (code, name, description, gate_faces, nominal_top_width_nm, nominal_bottom_width_nm,
            nominal_fin_height_nm, nominal_corner_radius_nm, nominal_liner_thickness_nm, created_at_ms, updated_at_ms)
        VALUES ({code}, {code}, 'stored before the migration', {storedFaces}, 6, 10, 42, 2, 2.5, 0, 0)
        """);

    /// <summary>The column's raw text, ordered by product code (BRM-OLD, TRN-OLD).</summary>
    private static List<string> StoredText(FinWatchDbContext db) =>
        [.. db.Database.SqlQueryRaw<string>("SELECT gate_faces AS \"Value\" FROM products ORDER BY code")];

    public void Dispose() => connection.Dispose();
}
