using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class GateFacesText : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            // products.gate_faces from the enum member's name to the API's spelling; the column type is unchanged.
            GateFacesMigrationSql.Up(migrationBuilder);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            GateFacesMigrationSql.Down(migrationBuilder);
        }
    }
}
