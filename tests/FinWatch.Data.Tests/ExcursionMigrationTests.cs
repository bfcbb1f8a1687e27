using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Infrastructure;
using Microsoft.EntityFrameworkCore.Migrations;

namespace FinWatch.Data.Tests;

/// <summary>
/// The ExcursionAlertsAndBaselineCheck migration of both providers keeps alerts stored before it (one per chart and rule)
/// readable: every old field and history entry stays, and the excursion fields are filled from them (rules, signal count,
/// first and last signal, the points, lots and wafers over the chart positions they span). Down keeps the old fields.
/// </summary>
public sealed class ExcursionMigrationTests : MigrationTest
{
    private const string MigrationName = "ExcursionAlertsAndBaselineCheck";

    [Fact]
    public void Sqlite_AlertsStoredPerRule_KeepTheirHistoryAndGainTheirExcursionFields() => OnSqlite(MigrateAcrossAndBack);

    [ScaleOutFact]
    public Task Postgres_AlertsStoredPerRule_KeepTheirHistoryAndGainTheirExcursionFields() => OnPostgresAsync(MigrateAcrossAndBack);

    private static void MigrateAcrossAndBack(FinWatchDbContext db)
    {
        var migrator = db.GetService<IMigrator>();
        var (before, _) = Around(db, MigrationName);
        migrator.Migrate(before);
        StoreTheOldWay(db);

        migrator.Migrate();

        var alerts = db.Alerts.AsNoTracking().OrderBy(a => a.Id).ToList();
        Assert.Equal(2, alerts.Count);
        var we1 = alerts[0];
        // Old fields as stored.
        Assert.Equal(("WE1", "acknowledged", "medium", "L3", "test engineer"), (we1.Rule, we1.State, we1.Severity, we1.LotId, we1.AcknowledgedBy));
        // New fields from them: the WE1 alert had its signals at seq 2 and 5 (points 2 and 5), measured at 2000 and 5000 ms.
        Assert.Equal("WE1", we1.Rules);
        Assert.Equal(2, we1.SignalCount);
        Assert.Equal((2L, 5L, 5L), (we1.FirstSeq, we1.LastSeq, we1.LastSignalSeq));
        Assert.Equal((2000L, 5000L), (we1.FirstSignalAtMs, we1.LastSignalAtMs));
        Assert.Equal(4, we1.PointCount); // seq 2..5
        Assert.Equal(3, we1.LotCount); // L1 (seq 2), L2 (seq 3, 4), L3 (seq 5)
        Assert.Equal(4, we1.WaferCount); // L1/2, L2/1, L2/2, L3/1
        Assert.Null(we1.BackInControlAtMs);
        var we2 = alerts[1];
        Assert.Equal(("WE2", "WE2", 1, 1, 1), (we2.Rule, we2.Rules, we2.SignalCount, we2.PointCount, we2.LotCount));
        Assert.Equal(3, db.AlertEvents.AsNoTracking().Count()); // the history is untouched
        Assert.Null(db.LimitVersions.AsNoTracking().Single().Verdict); // computed before the check: not checked

        migrator.Migrate(before);
        Assert.Equal(["WE1", "WE2"], [.. db.Database.SqlQueryRaw<string>("SELECT rule AS \"Value\" FROM alerts ORDER BY id")]);
    }

    // Plain SQL in the columns of the migration before: a product, a context, an approved limit version, five points
    // (seq 1..5 on lots L1, L2, L3) and two alerts as they were kept then, one per rule, with their history.
    private static void StoreTheOldWay(FinWatchDbContext db)
    {
        db.Database.ExecuteSqlRaw("""
            INSERT INTO products (code, name, description, gate_faces, nominal_top_width_nm, nominal_bottom_width_nm,
                nominal_fin_height_nm, nominal_corner_radius_nm, nominal_liner_thickness_nm, created_at_ms, updated_at_ms)
            VALUES ('TRN-OLD', 'TRN-OLD', 'stored before the migration', 'tri-gate', 6, 10, 42, 2, 2.5, 0, 0)
            """);
        db.Database.ExecuteSqlRaw("""
            INSERT INTO chart_contexts (code, title, product_id, step, parameter, chamber, chart_type, subgroup, rules, reaction_plan,
                electrical_concern_mv, evaluated_through_batch_id, created_at_ms, updated_at_ms)
            VALUES ('OLD-TOP', 'old chart', (SELECT id FROM products WHERE code = 'TRN-OLD'), 'FIN-PROFILE', 'top_width_nm', NULL, 'xbar', 'wafer',
                'WE1,WE2', '', 10, 0, 0, 0)
            """);
        db.Database.ExecuteSqlRaw("""
            INSERT INTO limit_versions (context_id, version, status, centre, sigma, subgroup_size, points_used, from_ms, to_ms, excluded_json,
                computed_by, computed_at_ms, reason, approved_by, approved_at_ms, approval_comment, effective_from_ms)
            VALUES ((SELECT id FROM chart_contexts WHERE code = 'OLD-TOP'), 1, 'approved', 6, 0.08, 5, 20, 0, 0, '[]', 'a', 0, 'r', 'b', 0, NULL, 0)
            """);
        (string Lot, int Slot, string Signals)[] points = [("L1", 1, ""), ("L1", 2, "WE1"), ("L2", 1, ""), ("L2", 2, "WE2"), ("L3", 1, "WE1")];
        for (var i = 0; i < points.Length; i++)
        {
            var (lot, slot, signals) = points[i];
            db.Database.ExecuteSql($"""
                INSERT INTO chart_points (context_id, seq, batch_id, measured_at_ms, lot_id, wafer_slot, chamber, value, n, sd,
                    predicted_dvt_sat_mv, limit_version_id, z, signals)
                VALUES ((SELECT id FROM chart_contexts WHERE code = 'OLD-TOP'), {i + 1}, 1, {(i + 1) * 1000}, {lot}, {slot}, NULL, 6, 5, 0.08,
                    NULL, NULL, 0, {signals})
                """);
        }

        Alert("WE1", "acknowledged", 2, 5, 2, "L3", "test engineer");
        Alert("WE2", "open", 4, 4, 1, "L2", null);
        Event("WE1", "raised", 2);
        Event("WE1", "point-added", 5);
        Event("WE2", "raised", 4);

        void Alert(string rule, string state, int firstSeq, int lastSeq, int count, string lot, string? acknowledgedBy) => db.Database.ExecuteSql($"""
            INSERT INTO alerts (context_id, rule, state, raised_at_ms, updated_at_ms, first_point_id, last_point_id, point_count, lot_id,
                wafer_slot, chamber, predicted_dvt_sat_mv, severity, severity_rank, escalated_at_ms, acknowledged_by, acknowledged_at_ms,
                closed_by, closed_at_ms)
            VALUES ((SELECT id FROM chart_contexts WHERE code = 'OLD-TOP'), {rule}, {state}, 9000, 9000,
                (SELECT id FROM chart_points WHERE seq = {firstSeq}), (SELECT id FROM chart_points WHERE seq = {lastSeq}), {count}, {lot},
                1, NULL, NULL, 'medium', 2, NULL, {acknowledgedBy}, NULL, NULL, NULL)
            """);

        void Event(string rule, string kind, int seq) => db.Database.ExecuteSql($"""
            INSERT INTO alert_events (alert_id, kind, at_ms, "by", comment, steps_json, point_id)
            VALUES ((SELECT id FROM alerts WHERE rule = {rule}), {kind}, 9000, 'FinWatch', '', NULL, (SELECT id FROM chart_points WHERE seq = {seq}))
            """);
    }
}
