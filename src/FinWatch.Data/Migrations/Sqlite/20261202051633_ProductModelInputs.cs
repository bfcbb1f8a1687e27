using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class ProductModelInputs : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<double>(
                name: "model_channel_doping_cm3",
                table: "products",
                type: "REAL",
                nullable: false,
                defaultValue: 1E+17);

            migrationBuilder.AddColumn<double>(
                name: "model_eot_nm",
                table: "products",
                type: "REAL",
                nullable: false,
                defaultValue: 0.90000000000000002);

            migrationBuilder.AddColumn<double>(
                name: "model_gate_length_nm",
                table: "products",
                type: "REAL",
                nullable: false,
                defaultValue: 20.0);

            migrationBuilder.AddColumn<string>(
                name: "model_sidewall_orientation",
                table: "products",
                type: "TEXT",
                maxLength: 8,
                nullable: false,
                defaultValue: "110");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropColumn(
                name: "model_channel_doping_cm3",
                table: "products");

            migrationBuilder.DropColumn(
                name: "model_eot_nm",
                table: "products");

            migrationBuilder.DropColumn(
                name: "model_gate_length_nm",
                table: "products");

            migrationBuilder.DropColumn(
                name: "model_sidewall_orientation",
                table: "products");
        }
    }
}
