using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Postgres
{
    /// <inheritdoc />
    public partial class ExcursionAlertsAndBaselineCheck : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropIndex(
                name: "IX_alerts_context_id_rule_state",
                table: "alerts");

            migrationBuilder.AddColumn<string>(
                name: "check_json",
                table: "limit_versions",
                type: "text",
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "justification",
                table: "limit_versions",
                type: "character varying(4000)",
                maxLength: 4000,
                nullable: true);

            migrationBuilder.AddColumn<string>(
                name: "verdict",
                table: "limit_versions",
                type: "character varying(16)",
                maxLength: 16,
                nullable: true);

            migrationBuilder.AddColumn<long>(
                name: "back_in_control_at_ms",
                table: "alerts",
                type: "bigint",
                nullable: true);

            migrationBuilder.AddColumn<long>(
                name: "first_seq",
                table: "alerts",
                type: "bigint",
                nullable: false,
                defaultValue: 0L);

            migrationBuilder.AddColumn<long>(
                name: "first_signal_at_ms",
                table: "alerts",
                type: "bigint",
                nullable: false,
                defaultValue: 0L);

            migrationBuilder.AddColumn<long>(
                name: "last_seq",
                table: "alerts",
                type: "bigint",
                nullable: false,
                defaultValue: 0L);

            migrationBuilder.AddColumn<long>(
                name: "last_signal_at_ms",
                table: "alerts",
                type: "bigint",
                nullable: false,
                defaultValue: 0L);

            migrationBuilder.AddColumn<long>(
                name: "last_signal_seq",
                table: "alerts",
                type: "bigint",
                nullable: false,
                defaultValue: 0L);

            migrationBuilder.AddColumn<int>(
                name: "lot_count",
                table: "alerts",
                type: "integer",
                nullable: false,
                defaultValue: 0);

            migrationBuilder.AddColumn<string>(
                name: "rules",
                table: "alerts",
                type: "character varying(64)",
                maxLength: 64,
                nullable: false,
                defaultValue: "");

            migrationBuilder.AddColumn<int>(
                name: "signal_count",
                table: "alerts",
                type: "integer",
                nullable: false,
                defaultValue: 0);

            migrationBuilder.AddColumn<int>(
                name: "wafer_count",
                table: "alerts",
                type: "integer",
                nullable: false,
                defaultValue: 0);

            migrationBuilder.CreateIndex(
                name: "IX_alerts_context_id_state",
                table: "alerts",
                columns: new[] { "context_id", "state" });

            ExcursionMigrationSql.Up(migrationBuilder);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropIndex(
                name: "IX_alerts_context_id_state",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "check_json",
                table: "limit_versions");

            migrationBuilder.DropColumn(
                name: "justification",
                table: "limit_versions");

            migrationBuilder.DropColumn(
                name: "verdict",
                table: "limit_versions");

            migrationBuilder.DropColumn(
                name: "back_in_control_at_ms",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "first_seq",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "first_signal_at_ms",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "last_seq",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "last_signal_at_ms",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "last_signal_seq",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "lot_count",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "rules",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "signal_count",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "wafer_count",
                table: "alerts");

            migrationBuilder.CreateIndex(
                name: "IX_alerts_context_id_rule_state",
                table: "alerts",
                columns: new[] { "context_id", "rule", "state" });
        }
    }
}
