using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class ShiftHandovers : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "shift_handovers",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    shift_date = table.Column<string>(type: "TEXT", maxLength: 10, nullable: false),
                    shift = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    shift_start_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    notes = table.Column<string>(type: "TEXT", maxLength: 4000, nullable: false),
                    notes_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    notes_at_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    outgoing_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    outgoing_at_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    incoming_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    incoming_at_ms = table.Column<long>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_shift_handovers", x => x.id);
                });

            migrationBuilder.CreateIndex(
                name: "IX_shift_handovers_shift_date_shift",
                table: "shift_handovers",
                columns: new[] { "shift_date", "shift" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_shift_handovers_shift_start_ms",
                table: "shift_handovers",
                column: "shift_start_ms");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "shift_handovers");
        }
    }
}
