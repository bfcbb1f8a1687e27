using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data;

/// <summary>
/// The data step of the ExcursionAlertsAndBaselineCheck migration, the same SQL on SQLite and PostgreSQL. Alerts stored
/// before excursions existed (one per chart and rule, holding only that rule's signal points) keep every field and
/// event; the new fields are filled from them: the rules fired are the alert's rule, the signal count its old point
/// count, the first and last signal its first and last point (their chart positions and measured times), and the
/// points, lots and wafers are counted over the chart positions from the first to the last point, as an excursion
/// counts them. Down drops the new columns and keeps the rest.
/// </summary>
internal static class ExcursionMigrationSql
{
    private const string Range = "p.context_id = alerts.context_id AND p.seq BETWEEN alerts.first_seq AND alerts.last_seq";

    public static void Up(MigrationBuilder migrationBuilder)
    {
        migrationBuilder.Sql("""
            UPDATE alerts SET
                rules = rule,
                signal_count = point_count,
                first_seq = (SELECT p.seq FROM chart_points p WHERE p.id = alerts.first_point_id),
                last_seq = (SELECT p.seq FROM chart_points p WHERE p.id = alerts.last_point_id),
                last_signal_seq = (SELECT p.seq FROM chart_points p WHERE p.id = alerts.last_point_id),
                first_signal_at_ms = (SELECT p.measured_at_ms FROM chart_points p WHERE p.id = alerts.first_point_id),
                last_signal_at_ms = (SELECT p.measured_at_ms FROM chart_points p WHERE p.id = alerts.last_point_id);
            """);
        migrationBuilder.Sql($"""
            UPDATE alerts SET
                point_count = (SELECT COUNT(*) FROM chart_points p WHERE {Range}),
                lot_count = (SELECT COUNT(DISTINCT p.lot_id) FROM chart_points p WHERE {Range}),
                wafer_count = (SELECT COUNT(DISTINCT p.lot_id || '/' || CAST(p.wafer_slot AS VARCHAR(12))) FROM chart_points p
                               WHERE {Range} AND p.wafer_slot IS NOT NULL);
            """);
    }
}
