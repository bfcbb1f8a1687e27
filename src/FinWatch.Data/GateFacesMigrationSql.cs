using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data;

/// <summary>
/// The SQL of the GateFacesText migration, the same on SQLite and PostgreSQL: <c>products.gate_faces</c> from the enum
/// member's name ("TriGate", "DoubleGate") to the API's spelling ("tri-gate", "double-gate"), and back on Down. The
/// names are written out here rather than taken from <c>GateFacesText</c>, so that the migration keeps doing what it
/// did when the spelling ever changes again.
/// </summary>
internal static class GateFacesMigrationSql
{
    private static readonly (string EnumName, string Text)[] Spellings = [("TriGate", "tri-gate"), ("DoubleGate", "double-gate")];

    public static void Up(MigrationBuilder migrationBuilder)
    {
        foreach (var (enumName, text) in Spellings)
        {
            Respell(migrationBuilder, enumName, text);
        }
    }

    public static void Down(MigrationBuilder migrationBuilder)
    {
        foreach (var (enumName, text) in Spellings)
        {
            Respell(migrationBuilder, text, enumName);
        }
    }

    private static void Respell(MigrationBuilder migrationBuilder, string from, string to) =>
        migrationBuilder.Sql($"UPDATE products SET gate_faces = '{to}' WHERE gate_faces = '{from}';");
}
