using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class SeriesOrderIndex : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            // The new index first, so the series queries always have one.
            migrationBuilder.CreateIndex(
                name: "IX_measurements_series_order",
                table: "measurements",
                columns: new[] { "product_id", "step", "measured_at_ms", "lot_id", "wafer_slot", "site_id" });

            migrationBuilder.DropIndex(
                name: "IX_measurements_product_id_step_measured_at_ms",
                table: "measurements");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateIndex(
                name: "IX_measurements_product_id_step_measured_at_ms",
                table: "measurements",
                columns: new[] { "product_id", "step", "measured_at_ms" });

            migrationBuilder.DropIndex(
                name: "IX_measurements_series_order",
                table: "measurements");
        }
    }
}
