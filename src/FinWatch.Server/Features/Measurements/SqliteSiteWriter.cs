using FinWatch.Data;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// Writes one ingest batch to SQLite in a single transaction with one prepared statement: the batch is all or nothing.
/// EF Core owns the schema; this hot path binds parameters directly because change tracking a million rows would cost
/// more than the whole insert (the ingest benchmark in the README measures both against a bare insert).
/// </summary>
public sealed class SqliteSiteWriter : ISiteWriter
{
    private const string InsertSql = """
        INSERT INTO measurements (batch_id, lot_id, wafer_slot, site_id, site_x_mm, site_y_mm, product_id, step,
            etch_tool, etch_chamber, liner_tool, liner_chamber, metrology_tool, operator, measured_at_ms,
            top_width_nm, bottom_width_nm, fin_height_nm, corner_radius_nm, liner_thickness_nm,
            taper_deg, mid_width_nm, area_nm2, gated_perimeter_nm, max_corner_radius_nm, flags,
            delta_vt_lin_mv, delta_vt_sat_mv, delta_swing_lin_mv_per_dec, delta_dibl_mv_per_v, model_stamp_id)
        VALUES ($batch, $lot, $slot, $site, $x, $y, $product, $step, $etool, $echamber, $ltool, $lchamber, $mtool, $op, $at,
            $wt, $wb, $h, $r, $liner, $taper, $mid, $area, $perim, $rmax, $flags, $dlin, $dsat, $dswing, $ddibl, $stamp)
        ON CONFLICT (lot_id, wafer_slot, site_id, step, measured_at_ms) DO NOTHING
        """;

    private const string ExistingSql = """
        SELECT batch_id FROM measurements
        WHERE lot_id = $lot AND wafer_slot = $slot AND site_id = $site AND step = $step AND measured_at_ms = $at
        """;

    private readonly SqliteConnection connection;
    private readonly SqliteTransaction transaction;
    private readonly SqliteCommand insert;
    private readonly SqliteParameter[] p;
    private readonly FinWatchDbContext? closeOnDispose;
    private SqliteCommand? existing;
    private readonly Dictionary<int, long> stamps = [];
    private bool completed;

    private SqliteSiteWriter(SqliteConnection connection, SqliteTransaction transaction, FinWatchDbContext? closeOnDispose, long batchId)
    {
        this.connection = connection;
        this.transaction = transaction;
        this.closeOnDispose = closeOnDispose;
        BatchId = batchId;
        insert = Command(InsertSql);
        string[] names = ["$batch", "$lot", "$slot", "$site", "$x", "$y", "$product", "$step", "$etool", "$echamber", "$ltool",
            "$lchamber", "$mtool", "$op", "$at", "$wt", "$wb", "$h", "$r", "$liner", "$taper", "$mid", "$area", "$perim", "$rmax", "$flags",
            "$dlin", "$dsat", "$dswing", "$ddibl", "$stamp"];
        p = names.Select(n => insert.Parameters.Add(n, SqliteType.Text)).ToArray();
        foreach (var i in new[] { 0, 2, 6, 14, 25, 30 })
        {
            p[i].SqliteType = SqliteType.Integer;
        }

        foreach (var i in new[] { 4, 5, 15, 16, 17, 18, 19, 20, 21, 22, 23, 24, 26, 27, 28, 29 })
        {
            p[i].SqliteType = SqliteType.Real;
        }

        p[0].Value = batchId;
        insert.Prepare();
    }

    public long BatchId { get; }

    /// <summary>Row by row: a few thousand rows ahead keep both cores busy.</summary>
    public int Lookahead => 4096;

    /// <summary>Opens the transaction and records the batch (its counts are filled in by <see cref="CommitAsync"/>).</summary>
    public static async Task<SqliteSiteWriter> BeginAsync(FinWatchDbContext db, string source, string? label, long receivedAtMs, CancellationToken cancellationToken)
    {
        var connection = (SqliteConnection)db.Database.GetDbConnection();
        var wasClosed = connection.State != System.Data.ConnectionState.Open;
        if (wasClosed)
        {
            await db.Database.OpenConnectionAsync(cancellationToken);
        }

        var transaction = (SqliteTransaction)await connection.BeginTransactionAsync(cancellationToken);
        using var cmd = connection.CreateCommand();
        cmd.Transaction = transaction;
        cmd.CommandText = """
            INSERT INTO ingest_batches (source, label, received_at_ms, completed_at_ms, row_count, inserted, already_present)
            VALUES ($source, $label, $received, 0, 0, 0, 0) RETURNING id
            """;
        cmd.Parameters.AddWithValue("$source", source);
        cmd.Parameters.AddWithValue("$label", (object?)label ?? DBNull.Value);
        cmd.Parameters.AddWithValue("$received", receivedAtMs);
        var id = (long)(await cmd.ExecuteScalarAsync(cancellationToken))!;
        return new SqliteSiteWriter(connection, transaction, wasClosed ? db : null, id);
    }

    /// <summary>Inserts the site unless its natural key is stored already; the answer comes at once.</summary>
    public void Insert(SiteRecord site, string measuredAtText, List<SiteAnswer> answers) =>
        answers.Add(new SiteAnswer(site, measuredAtText, Insert(site)));

    /// <summary>Nothing is buffered: every site was answered when it was inserted.</summary>
    public void Flush(List<SiteAnswer> answers)
    {
    }

    private InsertResult Insert(SiteRecord s)
    {
        var d = s.Derived;
        p[1].Value = s.LotId;
        p[2].Value = s.WaferSlot;
        p[3].Value = s.SiteId;
        p[4].Value = s.SiteXMm;
        p[5].Value = s.SiteYMm;
        p[6].Value = s.ProductId;
        p[7].Value = s.Step;
        p[8].Value = Db(s.EtchTool);
        p[9].Value = Db(s.EtchChamber);
        p[10].Value = Db(s.LinerTool);
        p[11].Value = Db(s.LinerChamber);
        p[12].Value = Db(s.MetrologyTool);
        p[13].Value = Db(s.Operator);
        p[14].Value = s.MeasuredAtMs;
        p[15].Value = Db(s.TopWidthNm);
        p[16].Value = Db(s.BottomWidthNm);
        p[17].Value = Db(s.FinHeightNm);
        p[18].Value = Db(s.CornerRadiusNm);
        p[19].Value = Db(s.LinerThicknessNm);
        p[20].Value = Db(d.TaperDeg);
        p[21].Value = Db(d.MidWidthNm);
        p[22].Value = Db(d.AreaNm2);
        p[23].Value = Db(d.GatedPerimeterNm);
        p[24].Value = Db(d.MaxCornerRadiusNm);
        p[25].Value = (int)d.Flags;
        var m = s.Predicted;
        p[26].Value = Db(m?.VtLinMv);
        p[27].Value = Db(m?.VtSatMv);
        p[28].Value = Db(m?.SwingLinMvPerDec);
        p[29].Value = Db(m?.DiblMvPerV);
        p[30].Value = m is null ? DBNull.Value : StampId(s.ProductId, m);
        if (insert.ExecuteNonQuery() == 1)
        {
            return InsertResult.Inserted;
        }

        existing ??= Existing();
        existing.Parameters[0].Value = s.LotId;
        existing.Parameters[1].Value = s.WaferSlot;
        existing.Parameters[2].Value = s.SiteId;
        existing.Parameters[3].Value = s.Step;
        existing.Parameters[4].Value = s.MeasuredAtMs;
        var batch = (long)existing.ExecuteScalar()!;
        return batch == BatchId ? InsertResult.DuplicateInBatch : InsertResult.AlreadyPresent;
    }

    /// <summary>The product a lot is stored under already, if any (a lot belongs to one product).</summary>
    public int? StoredProductOfLot(string lotId)
    {
        using var cmd = Command(BatchCommitSql.StoredProductOfLot);
        cmd.Parameters.AddWithValue("@lot", lotId);
        return cmd.ExecuteScalar() is long id ? (int)id : null;
    }

    /// <summary>Recomputes the lot summaries the batch touched, fills in the batch record and commits.</summary>
    public async Task CommitAsync(IEnumerable<(string LotId, string Step)> lotSteps, IEnumerable<(string LotId, string Step, string Chamber)> chambers,
        int rowCount, int inserted, int alreadyPresent, long completedAtMs, CancellationToken cancellationToken)
    {
        using (var summary = Command(BatchCommitSql.LotStep))
        {
            var lot = summary.Parameters.Add("@lot", SqliteType.Text);
            var step = summary.Parameters.Add("@step", SqliteType.Text);
            foreach (var (l, s) in lotSteps)
            {
                lot.Value = l;
                step.Value = s;
                await summary.ExecuteNonQueryAsync(cancellationToken);
            }
        }

        using (var chamber = Command(BatchCommitSql.LotChamber))
        {
            var lot = chamber.Parameters.Add("@lot", SqliteType.Text);
            var step = chamber.Parameters.Add("@step", SqliteType.Text);
            var name = chamber.Parameters.Add("@chamber", SqliteType.Text);
            foreach (var (l, s, c) in chambers)
            {
                lot.Value = l;
                step.Value = s;
                name.Value = c;
                await chamber.ExecuteNonQueryAsync(cancellationToken);
            }
        }

        using (var batch = Command(BatchCommitSql.Batch))
        {
            batch.Parameters.AddWithValue("@rows", rowCount);
            batch.Parameters.AddWithValue("@inserted", inserted);
            batch.Parameters.AddWithValue("@present", alreadyPresent);
            batch.Parameters.AddWithValue("@done", completedAtMs);
            batch.Parameters.AddWithValue("@id", BatchId);
            await batch.ExecuteNonQueryAsync(cancellationToken);
        }

        await transaction.CommitAsync(cancellationToken);
        completed = true;
    }

    // One stamp row per product and model version, written inside the batch so a rejected batch leaves none behind.
    private long StampId(int productId, PredictedShifts m)
    {
        if (stamps.TryGetValue(productId, out var id))
        {
            return id;
        }

        using var cmd = Command("""
            INSERT INTO model_stamps (product_id, parameter_set, parameter_set_version, code_version) VALUES ($p, $s, $v, $c)
            ON CONFLICT DO NOTHING;
            SELECT id FROM model_stamps WHERE product_id = $p AND parameter_set = $s AND parameter_set_version = $v AND code_version = $c;
            """);
        cmd.Parameters.AddWithValue("$p", productId);
        cmd.Parameters.AddWithValue("$s", m.ParameterSet);
        cmd.Parameters.AddWithValue("$v", m.ParameterSetVersion);
        cmd.Parameters.AddWithValue("$c", m.CodeVersion);
        id = (long)cmd.ExecuteScalar()!;
        stamps[productId] = id;
        return id;
    }

    private SqliteCommand Existing()
    {
        var cmd = Command(ExistingSql);
        cmd.Parameters.Add("$lot", SqliteType.Text);
        cmd.Parameters.Add("$slot", SqliteType.Integer);
        cmd.Parameters.Add("$site", SqliteType.Text);
        cmd.Parameters.Add("$step", SqliteType.Text);
        cmd.Parameters.Add("$at", SqliteType.Integer);
        return cmd;
    }

    private SqliteCommand Command(string sql)
    {
        var cmd = connection.CreateCommand();
        cmd.Transaction = transaction;
        cmd.CommandText = sql;
        return cmd;
    }

    private static object Db(string? value) => (object?)value ?? DBNull.Value;

    private static object Db(double? value) => value.HasValue ? value.Value : DBNull.Value;

    /// <summary>Rolls back unless committed, so an error or a dropped request leaves nothing behind.</summary>
    public async ValueTask DisposeAsync()
    {
        insert.Dispose();
        existing?.Dispose();
        if (!completed)
        {
            await transaction.RollbackAsync();
        }

        await transaction.DisposeAsync();
        if (closeOnDispose is not null)
        {
            await closeOnDispose.Database.CloseConnectionAsync();
        }
    }
}
