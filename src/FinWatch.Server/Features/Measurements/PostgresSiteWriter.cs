using FinWatch.Data;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Npgsql;
using NpgsqlTypes;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// Writes one ingest batch to PostgreSQL in a single transaction: rows are buffered a chunk at a time; one query finds
/// which of the chunk's lots are stored already, one looks up the natural keys of those lots' rows (the key columns
/// sent as arrays and joined through <c>unnest</c>), and the rows not found are sent by binary COPY straight into
/// <c>measurements</c>. Under the ingest lock nothing else writes
/// the table, so the keys found are exactly the rows already stored, and each row is written once. The same contract as
/// <see cref="SqliteSiteWriter"/>: all or nothing, "already present" told from "twice in this batch", lot summaries.
/// The transaction holds the ingest advisory lock (<see cref="PostgresLocks.Ingest"/>) from the batch's number to its
/// commit, so batches commit in number order across every instance: the monitor's "evaluated through batch N" then
/// never skips a batch that commits late.
/// </summary>
public sealed class PostgresSiteWriter : ISiteWriter
{
    /// <summary>Rows per COPY: large enough that the round trips vanish, small enough to keep memory flat.</summary>
    public const int ChunkRows = 8192;

    private const string Columns = """
        batch_id, lot_id, wafer_slot, site_id, site_x_mm, site_y_mm, product_id, step,
        etch_tool, etch_chamber, liner_tool, liner_chamber, metrology_tool, operator, measured_at_ms,
        top_width_nm, bottom_width_nm, fin_height_nm, corner_radius_nm, liner_thickness_nm,
        taper_deg, mid_width_nm, area_nm2, gated_perimeter_nm, max_corner_radius_nm, flags,
        delta_vt_lin_mv, delta_vt_sat_mv, delta_swing_lin_mv_per_dec, delta_dibl_mv_per_v, model_stamp_id
        """;

    // The chunk's keys that are stored already, with the batch that stored them (1-based position in the arrays).
    private const string StoredKeysSql = """
        SELECT k.ord, m.batch_id
        FROM unnest(@lot, @slot, @site, @step, @at) WITH ORDINALITY AS k(lot_id, wafer_slot, site_id, step, measured_at_ms, ord)
        JOIN measurements m ON m.lot_id = k.lot_id AND m.wafer_slot = k.wafer_slot AND m.site_id = k.site_id
            AND m.step = k.step AND m.measured_at_ms = k.measured_at_ms
        """;

    private readonly NpgsqlConnection connection;
    private readonly NpgsqlTransaction transaction;
    private readonly FinWatchDbContext? closeOnDispose;
    private readonly List<(SiteRecord Site, string MeasuredAtText, int? StampId)> chunk = new(ChunkRows);
    private readonly HashSet<(string, int, string, string, long)> chunkKeys = [];
    private readonly Dictionary<int, int> stamps = [];
    private bool completed;

    private PostgresSiteWriter(NpgsqlConnection connection, NpgsqlTransaction transaction, FinWatchDbContext? closeOnDispose, long batchId)
    {
        this.connection = connection;
        this.transaction = transaction;
        this.closeOnDispose = closeOnDispose;
        BatchId = batchId;
    }

    public long BatchId { get; }

    /// <summary>A whole chunk: the reader prepares the next one while this one is looked up and copied.</summary>
    public int Lookahead => ChunkRows;

    /// <summary>Opens the transaction, waits for the ingest lock and records the batch.</summary>
    public static async Task<PostgresSiteWriter> BeginAsync(FinWatchDbContext db, string source, string? label, long receivedAtMs, CancellationToken cancellationToken)
    {
        var connection = (NpgsqlConnection)db.Database.GetDbConnection();
        var wasClosed = connection.State != System.Data.ConnectionState.Open;
        if (wasClosed)
        {
            await db.Database.OpenConnectionAsync(cancellationToken);
        }

        var transaction = await connection.BeginTransactionAsync(cancellationToken);
        try
        {
            await using (var lockCmd = new NpgsqlCommand("SELECT pg_advisory_xact_lock(@class, @object)", connection, transaction))
            {
                lockCmd.Parameters.AddWithValue("class", PostgresLocks.ClassId);
                lockCmd.Parameters.AddWithValue("object", PostgresLocks.Ingest);
                await lockCmd.ExecuteNonQueryAsync(cancellationToken);
            }

            await using var cmd = new NpgsqlCommand("""
                INSERT INTO ingest_batches (source, label, received_at_ms, completed_at_ms, row_count, inserted, already_present)
                VALUES (@source, @label, @received, 0, 0, 0, 0) RETURNING id
                """, connection, transaction);
            cmd.Parameters.AddWithValue("source", source);
            cmd.Parameters.AddWithValue("label", NpgsqlDbType.Varchar, (object?)label ?? DBNull.Value);
            cmd.Parameters.AddWithValue("received", receivedAtMs);
            var id = (long)(await cmd.ExecuteScalarAsync(cancellationToken))!;
            return new PostgresSiteWriter(connection, transaction, wasClosed ? db : null, id);
        }
        catch
        {
            await transaction.RollbackAsync(CancellationToken.None);
            await transaction.DisposeAsync();
            if (wasClosed)
            {
                await db.Database.CloseConnectionAsync();
            }

            throw;
        }
    }

    public void Insert(SiteRecord site, string measuredAtText, List<SiteAnswer> answers)
    {
        // Twice in this chunk is known at once; twice across chunks shows in the flush's join (batch_id is this batch).
        if (!chunkKeys.Add(Key(site)))
        {
            answers.Add(new SiteAnswer(site, measuredAtText, InsertResult.DuplicateInBatch));
            return;
        }

        chunk.Add((site, measuredAtText, site.Predicted is { } m ? StampId(site.ProductId, m) : null));
        if (chunk.Count >= ChunkRows)
        {
            Flush(answers);
        }
    }

    public void Flush(List<SiteAnswer> answers)
    {
        if (chunk.Count == 0)
        {
            return;
        }

        // Under the ingest lock no other transaction writes measurements, so the keys found here are all the conflicts.
        // Only rows of lots stored already (by an earlier batch or an earlier chunk of this one) can conflict: one
        // probe per lot finds those, and only their rows' keys are looked up.
        var conflicts = new Dictionary<int, long>();
        var storedLots = StoredLots(chunk.Select(c => c.Site.LotId).Distinct().ToArray());
        var candidates = Enumerable.Range(0, chunk.Count).Where(i => storedLots.Contains(chunk[i].Site.LotId)).ToArray();
        if (candidates.Length > 0)
        {
            using var cmd = new NpgsqlCommand(StoredKeysSql, connection, transaction);
            KeyArray(cmd, "lot", NpgsqlDbType.Text, candidates, s => s.LotId);
            KeyArray(cmd, "slot", NpgsqlDbType.Integer, candidates, s => s.WaferSlot);
            KeyArray(cmd, "site", NpgsqlDbType.Text, candidates, s => s.SiteId);
            KeyArray(cmd, "step", NpgsqlDbType.Text, candidates, s => s.Step);
            KeyArray(cmd, "at", NpgsqlDbType.Bigint, candidates, s => s.MeasuredAtMs);
            using var reader = cmd.ExecuteReader();
            while (reader.Read())
            {
                conflicts[candidates[(int)reader.GetInt64(0) - 1]] = reader.GetInt64(1);
            }
        }

        ulong inserted = 0;
        if (conflicts.Count < chunk.Count)
        {
            using var copy = connection.BeginBinaryImport($"COPY measurements ({Columns}) FROM STDIN (FORMAT BINARY)");
            for (var i = 0; i < chunk.Count; i++)
            {
                if (!conflicts.ContainsKey(i))
                {
                    WriteRow(copy, chunk[i].Site, chunk[i].StampId);
                }
            }

            inserted = copy.Complete();
        }

        if ((int)inserted + conflicts.Count != chunk.Count)
        {
            throw new InvalidOperationException($"ingest: {chunk.Count} rows in the chunk, {inserted} copied and {conflicts.Count} stored already");
        }

        for (var i = 0; i < chunk.Count; i++)
        {
            var (site, text, _) = chunk[i];
            var result = !conflicts.TryGetValue(i, out var batch) ? InsertResult.Inserted
                : batch == BatchId ? InsertResult.DuplicateInBatch : InsertResult.AlreadyPresent;
            answers.Add(new SiteAnswer(site, text, result));
        }

        chunk.Clear();
        chunkKeys.Clear();
    }

    public int? StoredProductOfLot(string lotId)
    {
        using var cmd = new NpgsqlCommand(BatchCommitSql.StoredProductOfLot, connection, transaction);
        cmd.Parameters.AddWithValue("lot", lotId);
        return cmd.ExecuteScalar() is int id ? id : null;
    }

    public async Task CommitAsync(IEnumerable<(string LotId, string Step)> lotSteps, IEnumerable<(string LotId, string Step, string Chamber)> chambers,
        int rowCount, int inserted, int alreadyPresent, long completedAtMs, CancellationToken cancellationToken)
    {
        if (chunk.Count > 0)
        {
            throw new InvalidOperationException("flush the writer before committing");
        }

        await using (var summary = new NpgsqlCommand(BatchCommitSql.LotStep, connection, transaction))
        {
            var lot = summary.Parameters.Add("lot", NpgsqlDbType.Varchar);
            var step = summary.Parameters.Add("step", NpgsqlDbType.Varchar);
            foreach (var (l, s) in lotSteps)
            {
                lot.Value = l;
                step.Value = s;
                await summary.ExecuteNonQueryAsync(cancellationToken);
            }
        }

        await using (var chamber = new NpgsqlCommand(BatchCommitSql.LotChamber, connection, transaction))
        {
            var lot = chamber.Parameters.Add("lot", NpgsqlDbType.Varchar);
            var step = chamber.Parameters.Add("step", NpgsqlDbType.Varchar);
            var name = chamber.Parameters.Add("chamber", NpgsqlDbType.Varchar);
            foreach (var (l, s, c) in chambers)
            {
                lot.Value = l;
                step.Value = s;
                name.Value = c;
                await chamber.ExecuteNonQueryAsync(cancellationToken);
            }
        }

        await using (var batch = new NpgsqlCommand(BatchCommitSql.Batch, connection, transaction))
        {
            batch.Parameters.AddWithValue("rows", rowCount);
            batch.Parameters.AddWithValue("inserted", inserted);
            batch.Parameters.AddWithValue("present", alreadyPresent);
            batch.Parameters.AddWithValue("done", completedAtMs);
            batch.Parameters.AddWithValue("id", BatchId);
            await batch.ExecuteNonQueryAsync(cancellationToken);
        }

        await transaction.CommitAsync(cancellationToken);
        completed = true;
    }

    private void WriteRow(NpgsqlBinaryImporter copy, SiteRecord s, int? stampId)
    {
        var d = s.Derived;
        var m = s.Predicted;
        copy.StartRow();
        copy.Write(BatchId, NpgsqlDbType.Bigint);
        copy.Write(s.LotId, NpgsqlDbType.Varchar);
        copy.Write(s.WaferSlot, NpgsqlDbType.Integer);
        copy.Write(s.SiteId, NpgsqlDbType.Varchar);
        copy.Write(s.SiteXMm, NpgsqlDbType.Double);
        copy.Write(s.SiteYMm, NpgsqlDbType.Double);
        copy.Write(s.ProductId, NpgsqlDbType.Integer);
        copy.Write(s.Step, NpgsqlDbType.Varchar);
        Text(copy, s.EtchTool);
        Text(copy, s.EtchChamber);
        Text(copy, s.LinerTool);
        Text(copy, s.LinerChamber);
        Text(copy, s.MetrologyTool);
        Text(copy, s.Operator);
        copy.Write(s.MeasuredAtMs, NpgsqlDbType.Bigint);
        Real(copy, s.TopWidthNm);
        Real(copy, s.BottomWidthNm);
        Real(copy, s.FinHeightNm);
        Real(copy, s.CornerRadiusNm);
        Real(copy, s.LinerThicknessNm);
        Real(copy, d.TaperDeg);
        Real(copy, d.MidWidthNm);
        Real(copy, d.AreaNm2);
        Real(copy, d.GatedPerimeterNm);
        Real(copy, d.MaxCornerRadiusNm);
        copy.Write((int)d.Flags, NpgsqlDbType.Integer);
        Real(copy, m?.VtLinMv);
        Real(copy, m?.VtSatMv);
        Real(copy, m?.SwingLinMvPerDec);
        Real(copy, m?.DiblMvPerV);
        if (stampId is { } id)
        {
            copy.Write(id, NpgsqlDbType.Integer);
        }
        else
        {
            copy.WriteNull();
        }
    }

    private static void Text(NpgsqlBinaryImporter copy, string? value)
    {
        if (value is null)
        {
            copy.WriteNull();
        }
        else
        {
            copy.Write(value, NpgsqlDbType.Varchar);
        }
    }

    private static void Real(NpgsqlBinaryImporter copy, double? value)
    {
        if (value is { } v)
        {
            copy.Write(v, NpgsqlDbType.Double);
        }
        else
        {
            copy.WriteNull();
        }
    }

    private static (string, int, string, string, long) Key(SiteRecord s) => (s.LotId, s.WaferSlot, s.SiteId, s.Step, s.MeasuredAtMs);

    // One stamp row per product and model version, written inside the batch so a rejected batch leaves none behind.
    private int StampId(int productId, PredictedShifts m)
    {
        if (stamps.TryGetValue(productId, out var id))
        {
            return id;
        }

        using (var insert = new NpgsqlCommand("""
            INSERT INTO model_stamps (product_id, parameter_set, parameter_set_version, code_version) VALUES (@p, @s, @v, @c)
            ON CONFLICT DO NOTHING
            """, connection, transaction))
        {
            AddStampParameters(insert, productId, m);
            insert.ExecuteNonQuery();
        }

        using var select = new NpgsqlCommand("""
            SELECT id FROM model_stamps WHERE product_id = @p AND parameter_set = @s AND parameter_set_version = @v AND code_version = @c
            """, connection, transaction);
        AddStampParameters(select, productId, m);
        id = (int)select.ExecuteScalar()!;
        stamps[productId] = id;
        return id;
    }

    private static void AddStampParameters(NpgsqlCommand cmd, int productId, PredictedShifts m)
    {
        cmd.Parameters.AddWithValue("p", productId);
        cmd.Parameters.AddWithValue("s", m.ParameterSet);
        cmd.Parameters.AddWithValue("v", m.ParameterSetVersion);
        cmd.Parameters.AddWithValue("c", m.CodeVersion);
    }

    // One key column of the chunk's candidate rows as an array parameter.
    private void KeyArray<T>(NpgsqlCommand cmd, string name, NpgsqlDbType type, int[] rows, Func<SiteRecord, T> column) =>
        cmd.Parameters.Add(new NpgsqlParameter<T[]>(name, NpgsqlDbType.Array | type) { TypedValue = [.. rows.Select(i => column(chunk[i].Site))] });

    private HashSet<string> StoredLots(string[] lots)
    {
        using var cmd = new NpgsqlCommand("SELECT l.lot_id FROM unnest(@lots) AS l(lot_id) WHERE EXISTS (SELECT 1 FROM measurements m WHERE m.lot_id = l.lot_id)", connection, transaction);
        cmd.Parameters.Add(new NpgsqlParameter<string[]>("lots", NpgsqlDbType.Array | NpgsqlDbType.Text) { TypedValue = lots });
        using var reader = cmd.ExecuteReader();
        var stored = new HashSet<string>(StringComparer.Ordinal);
        while (reader.Read())
        {
            stored.Add(reader.GetString(0));
        }

        return stored;
    }

    /// <summary>Rolls back unless committed, so an error or a dropped request leaves nothing behind.</summary>
    public async ValueTask DisposeAsync()
    {
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
