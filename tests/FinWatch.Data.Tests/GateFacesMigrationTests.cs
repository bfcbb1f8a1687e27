using FinWatch.Physics;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

/// <summary>
/// The GateFacesText migration of both providers: products stored before it with the enum member's name
/// ("TriGate", "DoubleGate") read back as the same gate configuration after it, stored as the API's spelling; Down
/// writes the old names again.
/// </summary>
public sealed class GateFacesMigrationTests : MigrationTest
{
    private const string MigrationName = "GateFacesText";

    [Fact]
    public void Sqlite_ProductsStoredWithEnumNames_ReadBackAfterTheMigrationAndRevertOnDown() => OnSqlite(MigrateAcrossAndBack);

    [ScaleOutFact]
    public Task Postgres_ProductsStoredWithEnumNames_ReadBackAfterTheMigrationAndRevertOnDown() => OnPostgresAsync(MigrateAcrossAndBack);

    private static void MigrateAcrossAndBack(FinWatchDbContext db)
    {
        var migrator = db.GetService<IMigrator>();
        var (before, _) = Around(db, MigrationName);
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
}
