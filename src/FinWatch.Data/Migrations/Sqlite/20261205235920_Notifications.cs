using Microsoft.EntityFrameworkCore.Migrations;

#nullable disable

namespace FinWatch.Data.Migrations.Sqlite
{
    /// <inheritdoc />
    public partial class Notifications : Migration
    {
        /// <inheritdoc />
        protected override void Up(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.AddColumn<string>(
                name: "escalated_to",
                table: "alerts",
                type: "TEXT",
                maxLength: 2000,
                nullable: true);

            migrationBuilder.AddColumn<int>(
                name: "escalation_level",
                table: "alerts",
                type: "INTEGER",
                nullable: false,
                defaultValue: 0);

            migrationBuilder.CreateTable(
                name: "notification_outbox",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    key = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    alert_id = table.Column<long>(type: "INTEGER", nullable: false),
                    @event = table.Column<string>(name: "event", type: "TEXT", maxLength: 16, nullable: false),
                    channel = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    target = table.Column<string>(type: "TEXT", maxLength: 320, nullable: false),
                    recipient = table.Column<string>(type: "TEXT", maxLength: 200, nullable: true),
                    payload = table.Column<string>(type: "TEXT", nullable: false),
                    status = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    attempts = table.Column<int>(type: "INTEGER", nullable: false),
                    created_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    next_attempt_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    claimed_by = table.Column<string>(type: "TEXT", maxLength: 100, nullable: true),
                    claimed_until_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    sent_at_ms = table.Column<long>(type: "INTEGER", nullable: true),
                    last_error = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_notification_outbox", x => x.id);
                    table.ForeignKey(
                        name: "FK_notification_outbox_alerts_alert_id",
                        column: x => x.alert_id,
                        principalTable: "alerts",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateTable(
                name: "notification_rules",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    owner = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    channel = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    webhook = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    min_severity = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    min_severity_rank = table.Column<int>(type: "INTEGER", nullable: false),
                    product = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    step = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    equipment = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    context = table.Column<string>(type: "TEXT", maxLength: 64, nullable: true),
                    created_at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    created_by = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_notification_rules", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "shift_roster",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    shift = table.Column<string>(type: "TEXT", maxLength: 32, nullable: false),
                    person = table.Column<string>(type: "TEXT", maxLength: 200, nullable: false),
                    from_date = table.Column<string>(type: "TEXT", maxLength: 10, nullable: false),
                    to_date = table.Column<string>(type: "TEXT", maxLength: 10, nullable: true)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_shift_roster", x => x.id);
                });

            migrationBuilder.CreateTable(
                name: "notification_deliveries",
                columns: table => new
                {
                    id = table.Column<long>(type: "INTEGER", nullable: false)
                        .Annotation("Sqlite:Autoincrement", true),
                    message_id = table.Column<long>(type: "INTEGER", nullable: false),
                    alert_id = table.Column<long>(type: "INTEGER", nullable: false),
                    attempt = table.Column<int>(type: "INTEGER", nullable: false),
                    at_ms = table.Column<long>(type: "INTEGER", nullable: false),
                    duration_ms = table.Column<int>(type: "INTEGER", nullable: false),
                    outcome = table.Column<string>(type: "TEXT", maxLength: 16, nullable: false),
                    detail = table.Column<string>(type: "TEXT", maxLength: 2000, nullable: false),
                    by = table.Column<string>(type: "TEXT", maxLength: 100, nullable: false)
                },
                constraints: table =>
                {
                    table.PrimaryKey("PK_notification_deliveries", x => x.id);
                    table.ForeignKey(
                        name: "FK_notification_deliveries_notification_outbox_message_id",
                        column: x => x.message_id,
                        principalTable: "notification_outbox",
                        principalColumn: "id",
                        onDelete: ReferentialAction.Restrict);
                });

            migrationBuilder.CreateIndex(
                name: "IX_notification_deliveries_alert_id",
                table: "notification_deliveries",
                column: "alert_id");

            migrationBuilder.CreateIndex(
                name: "IX_notification_deliveries_message_id",
                table: "notification_deliveries",
                column: "message_id");

            migrationBuilder.CreateIndex(
                name: "IX_notification_outbox_alert_id",
                table: "notification_outbox",
                column: "alert_id");

            migrationBuilder.CreateIndex(
                name: "IX_notification_outbox_key",
                table: "notification_outbox",
                column: "key",
                unique: true);

            migrationBuilder.CreateIndex(
                name: "IX_notification_outbox_status_next_attempt_at_ms",
                table: "notification_outbox",
                columns: new[] { "status", "next_attempt_at_ms" });

            migrationBuilder.CreateIndex(
                name: "IX_notification_rules_owner",
                table: "notification_rules",
                column: "owner");

            migrationBuilder.CreateIndex(
                name: "IX_shift_roster_shift",
                table: "shift_roster",
                column: "shift");

            // Alerts escalated before the levels existed took the first step (the supervisors).
            migrationBuilder.Sql("UPDATE alerts SET escalation_level = 1 WHERE escalated_at_ms IS NOT NULL");
        }

        /// <inheritdoc />
        protected override void Down(MigrationBuilder migrationBuilder)
        {
            migrationBuilder.DropTable(
                name: "notification_deliveries");

            migrationBuilder.DropTable(
                name: "notification_rules");

            migrationBuilder.DropTable(
                name: "shift_roster");

            migrationBuilder.DropTable(
                name: "notification_outbox");

            migrationBuilder.DropColumn(
                name: "escalated_to",
                table: "alerts");

            migrationBuilder.DropColumn(
                name: "escalation_level",
                table: "alerts");
        }
    }
}
