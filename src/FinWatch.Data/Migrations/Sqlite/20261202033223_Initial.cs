using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class Initial : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "ingest_batches",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    source = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    label = table.Column<string>(type: "TEXT", maxLength: 260, nullable: true),
                    received_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    completed_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    row_count = table.Column<int>(type: "INTEGER", nullable: false),
                    inserted = table.Column<int>(type: "INTEGER", nullable: false),
                    already_present = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_ingest_batches", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "lot_chambers",
                columns: table => new
                {
                    lot_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    step = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_lot_chambers", x => new { x.lot_id, x.step, x.chamber });
                });

            migrationBuilder.CreateTable(
                name: "products",
                columns: table => new
                {
                    id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    code = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    name = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    description = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    gate_faces = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    nominal_top_width_nm = table.Column<double>(type: "REAL", nullable: false),
                    nominal_bottom_width_nm = table.Column<double>(type: "REAL", nullable: false),
                    nominal_fin_height_nm = table.Column<double>(type: "REAL", nullable: false),
                    nominal_corner_radius_nm = table.Column<double>(type: "REAL", nullable: false),
                    nominal_liner_thickness_nm = table.Column<double>(type: "REAL", nullable: false),
                    created_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    updated_at_ms = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_products", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "lot_steps",
                columns: table => new
                {
                    lot_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    step = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    first_measured_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    last_measured_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    wafer_count = table.Column<int>(type: "INTEGER", nullable: false),
                    site_count = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_lot_steps", x => new { x.lot_id, x.step });
                    table.ForeignKey(
                        name: "FK_lot_steps_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "measurements",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    batch_id = table.Column<long>(type: "INTEGER", nullable: false),
                    lot_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "INTEGER", nullable: false),
                    site_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    site_x_mm = table.Column<double>(type: "REAL", nullable: false),
                    site_y_mm = table.Column<double>(type: "REAL", nullable: false),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    step = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    etch_tool = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    etch_chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    liner_tool = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    liner_chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    metrology_tool = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    @operator = table.Column<string>(name: "operator", type: "TEXT", maxLength: 64, nullable: true),
                    measured_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    top_width_nm = table.Column<double>(type: "REAL", nullable: true),
                    bottom_width_nm = table.Column<double>(type: "REAL", nullable: true),
                    fin_height_nm = table.Column<double>(type: "REAL", nullable: true),
                    corner_radius_nm = table.Column<double>(type: "REAL", nullable: true),
                    liner_thickness_nm = table.Column<double>(type: "REAL", nullable: true),
                    taper_deg = table.Column<double>(type: "REAL", nullable: true),
                    mid_width_nm = table.Column<double>(type: "REAL", nullable: true),
                    area_nm2 = table.Column<double>(type: "REAL", nullable: true),
                    gated_perimeter_nm = table.Column<double>(type: "REAL", nullable: true),
                    max_corner_radius_nm = table.Column<double>(type: "REAL", nullable: true),
                    flags = table.Column<int>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_measurements", x => x.id);
                    table.ForeignKey(
                        name: "FK_measurements_ingest_batches_batch_id",
                        column: x => x.batch_id,
                        principalTable: "ingest_batches",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                    table.ForeignKey(
                        name: "FK_measurements_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "spec_limits",
                columns: table => new
                {
                    id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    parameter = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    lower = table.Column<double>(type: "REAL", nullable: true),
                    target = table.Column<double>(type: "REAL", nullable: true),
                    upper = table.Column<double>(type: "REAL", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_spec_limits", x => x.id);
                    table.ForeignKey(
                        name: "FK_spec_limits_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateIndex(
                name: "IX_lot_chambers_chamber",
                table: "lot_chambers",
                column: "chamber");

            migrationBuilder.CreateIndex(
                name: "IX_lot_steps_last_measured_at_ms",
                table: "lot_steps",
                column: "last_measured_at_ms");

            migrationBuilder.CreateIndex(
                name: "IX_lot_steps_product_id",
                table: "lot_steps",
                column: "product_id");

            migrationBuilder.CreateIndex(
                name: "IX_measurements_batch_id",
                table: "measurements",
                column: "batch_id");

            migrationBuilder.CreateIndex(
                name: "IX_measurements_lot_id_wafer_slot_site_id_step_measured_at_ms",
                table: "measurements",
                columns: new[] { "lot_id", "wafer_slot", "site_id", "step", "measured_at_ms" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_measurements_product_id_step_measured_at_ms",
                table: "measurements",
                columns: new[] { "product_id", "step", "measured_at_ms" });

            migrationBuilder.CreateIndex(
                name: "IX_products_code",
                table: "products",
                column: "code",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_spec_limits_product_id_parameter",
                table: "spec_limits",
                columns: new[] { "product_id", "parameter" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "lot_chambers");

            migrationBuilder.DropTable(
                name: "lot_steps");

            migrationBuilder.DropTable(
                name: "measurements");

            migrationBuilder.DropTable(
                name: "spec_limits");

            migrationBuilder.DropTable(
                name: "ingest_batches");

            migrationBuilder.DropTable(
                name: "products");
        }
    }
}
