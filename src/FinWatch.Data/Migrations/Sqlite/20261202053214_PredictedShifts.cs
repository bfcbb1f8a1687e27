using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class PredictedShifts : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<double>(
                name: "delta_dibl_mv_per_v",
                table: "measurements",
                type: "REAL",
                nullable: true);

            migrationBuilder.AddColumn<double>(
                name: "delta_swing_lin_mv_per_dec",
                table: "measurements",
                type: "REAL",
                nullable: true);

            migrationBuilder.AddColumn<double>(
                name: "delta_vt_lin_mv",
                table: "measurements",
                type: "REAL",
                nullable: true);

            migrationBuilder.AddColumn<double>(
                name: "delta_vt_sat_mv",
                table: "measurements",
                type: "REAL",
                nullable: true);

            migrationBuilder.AddColumn<int>(
                name: "model_stamp_id",
                table: "measurements",
                type: "INTEGER",
                nullable: true);

            migrationBuilder.CreateTable(
                name: "model_stamps",
                columns: table => new
                {
                    id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    parameter_set = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    parameter_set_version = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    code_version = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_model_stamps", x => x.id);
                    table.ForeignKey(
                        name: "FK_model_stamps_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_model_stamps_product_id_parameter_set_parameter_set_version_code_version",
                table: "model_stamps",
                columns: new[] { "product_id", "parameter_set", "parameter_set_version", "code_version" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "model_stamps");

            migrationBuilder.DropColumn(
                name: "delta_dibl_mv_per_v",
                table: "measurements");

            migrationBuilder.DropColumn(
                name: "delta_swing_lin_mv_per_dec",
                table: "measurements");

            migrationBuilder.DropColumn(
                name: "delta_vt_lin_mv",
                table: "measurements");

            migrationBuilder.DropColumn(
                name: "delta_vt_sat_mv",
                table: "measurements");

            migrationBuilder.DropColumn(
                name: "model_stamp_id",
                table: "measurements");
        }
    }
}
