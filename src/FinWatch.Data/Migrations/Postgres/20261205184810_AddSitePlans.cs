using Microsoft.EntityFrameworkCore.Migrations;
using Npgsql.EntityFrameworkCore.PostgreSQL.Metadata;

#nullable disable

namespace FinWatch.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class AddSitePlans : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "site_plan_sites",
                columns: table => new
                {
                    id = table.Column<int>(type: "integer", nullable: false)
                        .Annotation("Npgsql:ValueGenerationStrategy", NpgsqlValueGenerationStrategy.IdentityByDefaultColumn),
                    product_id = table.Column<int>(type: "integer", nullable: false),
                    step = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    position = table.Column<int>(type: "integer", nullable: false),
                    site_id = table.Column<string>(type: "character varying(64)", maxLength: 64, nullable: false),
                    site_x_mm = table.Column<double>(type: "double precision", nullable: false),
                    site_y_mm = table.Column<double>(type: "double precision", nullable: false),
                    updated_at_ms = table.Column<long>(type: "bigint", nullable: false),
                    updated_by = table.Column<string>(type: "character varying(200)", maxLength: 200, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_site_plan_sites", x => x.id);
                    table.ForeignKey(
                        name: "FK_site_plan_sites_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Cascade);
                });

            migrationBuilder.CreateIndex(
                name: "IX_site_plan_sites_product_id_step_position",
                table: "site_plan_sites",
                columns: new[] { "product_id", "step", "position" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_site_plan_sites_product_id_step_site_id",
                table: "site_plan_sites",
                columns: new[] { "product_id", "step", "site_id" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "site_plan_sites");
        }
    }
}
