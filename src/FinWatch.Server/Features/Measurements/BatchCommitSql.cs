namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// The statements both site writers run at commit, in the SQL that SQLite and PostgreSQL share (named parameters with
/// <c>@</c>, <c>ON CONFLICT</c>, <c>excluded</c>).
/// </summary>
internal static class BatchCommitSql
{
    /// <summary>Recomputes one lot and step's summary from its stored sites.</summary>
    public const string LotStep = """
        INSERT INTO lot_steps (lot_id, step, product_id, first_measured_at_ms, last_measured_at_ms, wafer_count, site_count)
        SELECT lot_id, step, MIN(product_id), MIN(measured_at_ms), MAX(measured_at_ms), COUNT(DISTINCT wafer_slot), COUNT(*)
        FROM measurements WHERE lot_id = @lot AND step = @step GROUP BY lot_id, step
        ON CONFLICT (lot_id, step) DO UPDATE SET
            first_measured_at_ms = excluded.first_measured_at_ms, last_measured_at_ms = excluded.last_measured_at_ms,
            wafer_count = excluded.wafer_count, site_count = excluded.site_count
        """;

    public const string LotChamber = "INSERT INTO lot_chambers (lot_id, step, chamber) VALUES (@lot, @step, @chamber) ON CONFLICT DO NOTHING";

    public const string Batch = """
        UPDATE ingest_batches SET row_count = @rows, inserted = @inserted, already_present = @present, completed_at_ms = @done
        WHERE id = @id
        """;

    public const string StoredProductOfLot = "SELECT product_id FROM lot_steps WHERE lot_id = @lot LIMIT 1";
}
