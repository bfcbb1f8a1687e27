using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class MonitorBatchIndex : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropIndex(
                name: "IX_measurements_batch_id",
                table: "measurements");

            migrationBuilder.CreateIndex(
                name: "IX_measurements_batch_id_product_id_step",
                table: "measurements",
                columns: new[] { "batch_id", "product_id", "step" });
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropIndex(
                name: "IX_measurements_batch_id_product_id_step",
                table: "measurements");

            migrationBuilder.CreateIndex(
                name: "IX_measurements_batch_id",
                table: "measurements",
                column: "batch_id");
        }
    }
}
