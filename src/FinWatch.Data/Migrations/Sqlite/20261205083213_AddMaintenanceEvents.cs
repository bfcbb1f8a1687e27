using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class AddMaintenanceEvents : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "maintenance_events",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    occurred_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    performed_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    note = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    recorded_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    recorded_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    source = table.Column<string>(type: "TEXT", maxLength: 260, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_maintenance_events", x => x.id);
                });

            migrationBuilder.CreateIndex(
                name: "IX_maintenance_events_chamber_occurred_at_ms",
                table: "maintenance_events",
                columns: new[] { "chamber", "occurred_at_ms" });

            migrationBuilder.CreateIndex(
                name: "IX_maintenance_events_occurred_at_ms",
                table: "maintenance_events",
                column: "occurred_at_ms");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "maintenance_events");
        }
    }
}
