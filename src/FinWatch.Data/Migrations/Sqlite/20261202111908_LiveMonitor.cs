using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class LiveMonitor : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.CreateTable(
                name: "chart_contexts",
                columns: table => new
                {
                    id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    code = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    title = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    product_id = table.Column<int>(type: "INTEGER", nullable: false),
                    step = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    parameter = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    chart_type = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    subgroup = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    rules = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false),
                    reaction_plan = table.Column<string>(type: "TEXT", maxLength: 8000, nullable: false),
                    electrical_concern_mv = table.Column<double>(type: "REAL", nullable: false),
                    evaluated_through_batch_id = table.Column<long>(type: "INTEGER", nullable: false),
                    created_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    updated_at_ms = table.Column<long>(type: "INTEGER", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_chart_contexts", x => x.id);
                    table.ForeignKey(
                        name: "FK_chart_contexts_products_product_id",
                        column: x => x.product_id,
                        principalTable: "products",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "feed_events",
                columns: table => new
                {
                    seq = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    kind = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    context_id = table.Column<int>(type: "INTEGER", nullable: false),
                    payload = table.Column<string>(type: "TEXT", nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_feed_events", x => x.seq);
                });

            migrationBuilder.CreateTable(
                name: "alerts",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    context_id = table.Column<int>(type: "INTEGER", nullable: false),
                    rule = table.Column<string>(type: "TEXT", maxLength: 8, nullable: false),
                    state = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    raised_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    updated_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    first_point_id = table.Column<long>(type: "INTEGER", nullable: false),
                    last_point_id = table.Column<long>(type: "INTEGER", nullable: false),
                    point_count = table.Column<int>(type: "INTEGER", nullable: false),
                    lot_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "INTEGER", nullable: true),
                    chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    predicted_dvt_sat_mv = table.Column<double>(type: "REAL", nullable: true),
                    severity = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    severity_rank = table.Column<int>(type: "INTEGER", nullable: false),
                    escalated_at_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    acknowledged_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    acknowledged_at_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    closed_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    closed_at_ms = table.Column<long>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_alerts", x => x.id);
                    table.ForeignKey(
                        name: "FK_alerts_chart_contexts_context_id",
                        column: x => x.context_id,
                        principalTable: "chart_contexts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "chart_points",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    context_id = table.Column<int>(type: "INTEGER", nullable: false),
                    seq = table.Column<long>(type: "INTEGER", nullable: false),
                    batch_id = table.Column<long>(type: "INTEGER", nullable: false),
                    measured_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    lot_id = table.Column<string>(type: "TEXT", maxLength: 64, nullable: false),
                    wafer_slot = table.Column<int>(type: "INTEGER", nullable: true),
                    chamber = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    value = table.Column<double>(type: "REAL", nullable: false),
                    n = table.Column<int>(type: "INTEGER", nullable: false),
                    sd = table.Column<double>(type: "REAL", nullable: true),
                    predicted_dvt_sat_mv = table.Column<double>(type: "REAL", nullable: true),
                    limit_version_id = table.Column<int>(type: "INTEGER", nullable: true),
                    z = table.Column<double>(type: "REAL", nullable: true),
                    signals = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_chart_points", x => x.id);
                    table.ForeignKey(
                        name: "FK_chart_points_chart_contexts_context_id",
                        column: x => x.context_id,
                        principalTable: "chart_contexts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "limit_versions",
                columns: table => new
                {
                    id = table.Column<int>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    context_id = table.Column<int>(type: "INTEGER", nullable: false),
                    version = table.Column<int>(type: "INTEGER", nullable: false),
                    status = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    centre = table.Column<double>(type: "REAL", nullable: false),
                    sigma = table.Column<double>(type: "REAL", nullable: false),
                    subgroup_size = table.Column<double>(type: "REAL", nullable: false),
                    points_used = table.Column<int>(type: "INTEGER", nullable: false),
                    from_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    to_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    excluded_json = table.Column<string>(type: "TEXT", nullable: false),
                    computed_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    computed_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    reason = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    approved_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    approved_at_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    approval_comment = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: true),
                    effective_from_ms = table.Column<long>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_limit_versions", x => x.id);
                    table.ForeignKey(
                        name: "FK_limit_versions_chart_contexts_context_id",
                        column: x => x.context_id,
                        principalTable: "chart_contexts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "alert_events",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    alert_id = table.Column<long>(type: "INTEGER", nullable: false),
                    kind = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    comment = table.Column<string>(type: "TEXT", maxLength: 4000, nullable: false),
                    steps_json = table.Column<string>(type: "TEXT", nullable: true),
                    point_id = table.Column<long>(type: "INTEGER", nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_alert_events", x => x.id);
                    table.ForeignKey(
                        name: "FK_alert_events_alerts_alert_id",
                        column: x => x.alert_id,
                        principalTable: "alerts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_alert_events_alert_id",
                table: "alert_events",
                column: "alert_id");

            migrationBuilder.CreateIndex(
                name: "IX_alerts_context_id_rule_state",
                table: "alerts",
                columns: new[] { "context_id", "rule", "state" });

            migrationBuilder.CreateIndex(
                name: "IX_alerts_state",
                table: "alerts",
                column: "state");

            migrationBuilder.CreateIndex(
                name: "IX_chart_contexts_code",
                table: "chart_contexts",
                column: "code",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_chart_contexts_product_id_step",
                table: "chart_contexts",
                columns: new[] { "product_id", "step" });

            migrationBuilder.CreateIndex(
                name: "IX_chart_points_context_id_measured_at_ms",
                table: "chart_points",
                columns: new[] { "context_id", "measured_at_ms" });

            migrationBuilder.CreateIndex(
                name: "IX_chart_points_context_id_seq",
                table: "chart_points",
                columns: new[] { "context_id", "seq" },
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_feed_events_context_id_seq",
                table: "feed_events",
                columns: new[] { "context_id", "seq" });

            migrationBuilder.CreateIndex(
                name: "IX_limit_versions_context_id_version",
                table: "limit_versions",
                columns: new[] { "context_id", "version" },
                unique: true);
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "alert_events");

            migrationBuilder.DropTable(
                name: "chart_points");

            migrationBuilder.DropTable(
                name: "feed_events");

            migrationBuilder.DropTable(
                name: "limit_versions");

            migrationBuilder.DropTable(
                name: "alerts");

            migrationBuilder.DropTable(
                name: "chart_contexts");
        }
    }
}
