using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class Calibrations : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "model_parameter_sets",
                columns: table => new
                {
                    id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    version = table.Column<int>(type: "INTEGER", nullable: false),
                    gate_length_nm = table.Column<double>(type: "REAL", nullable: false),
                    gate_length_sd_nm = table.Column<double>(type: "REAL", nullable: false),
                    barrier_height_v = table.Column<double>(type: "REAL", nullable: false),
                    barrier_height_sd_v = table.Column<double>(type: "REAL", nullable: false),
                    threshold_offset_v = table.Column<double>(type: "REAL", nullable: false),
                    threshold_offset_sd_v = table.Column<double>(type: "REAL", nullable: false),
                    rms_residual_before_mv = table.Column<double>(type: "REAL", nullable: false),
                    rms_residual_after_mv = table.Column<double>(type: "REAL", nullable: false),
                    measurement_sd_mv = table.Column<double>(type: "REAL", nullable: false),
                    observations = table.Column<int>(type: "INTEGER", nullable: false),
                    iterations = table.Column<int>(type: "INTEGER", nullable: false),
                    code_version = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    created_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    created_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    reason = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    source_name = table.Column<string>(type: "TEXT", maxLength: 260, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_model_parameter_sets", x => x.id);
                    table.ForeignKey(
                        name: "FK_model_parameter_sets_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "electrical_tests",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    parameter_set_id = table.Column<int>(type: "INTEGER", nullable: false),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    lot_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "INTEGER", nullable: false),
                    vt_lin_v = table.Column<double>(type: "REAL", nullable: false),
                    vt_sat_v = table.Column<double>(type: "REAL", nullable: false),
                    tested_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    mean_top_width_nm = table.Column<double>(type: "REAL", nullable: false),
                    mean_bottom_width_nm = table.Column<double>(type: "REAL", nullable: false),
                    mean_fin_height_nm = table.Column<double>(type: "REAL", nullable: false),
                    mean_corner_radius_nm = table.Column<double>(type: "REAL", nullable: false),
                    sites = table.Column<int>(type: "INTEGER", nullable: false),
                    residual_lin_mv = table.Column<double>(type: "REAL", nullable: false),
                    residual_sat_mv = table.Column<double>(type: "REAL", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_electrical_tests", x => x.id);
                    table.ForeignKey(
                        name: "FK_electrical_tests_model_parameter_sets_parameter_set_id",
                        column: x => x.parameter_set_id,
                        principalTable: "model_parameter_sets",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_electrical_tests_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_electrical_tests_lot_id_wafer_slot",
                table: "electrical_tests",
                columns: new[] { "lot_id", "wafer_slot" });

            migrationBuilder.CreateIndex(
                name: "IX_electrical_tests_parameter_set_id",
                table: "electrical_tests",
                column: "parameter_set_id");

            migrationBuilder.CreateIndex(
                name: "IX_electrical_tests_product_id",
                table: "electrical_tests",
                column: "product_id");

            migrationBuilder.CreateIndex(
                name: "IX_model_parameter_sets_product_id_version",
                table: "model_parameter_sets",
                columns: new[] { "product_id", "version" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "electrical_tests");

            migrationBuilder.DropTable(
                name: "model_parameter_sets");
        }
    }
}
