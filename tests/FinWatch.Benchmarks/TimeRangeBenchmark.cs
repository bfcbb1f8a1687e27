using System.Diagnostics;
using System.Globalization;
using FinWatch.Data;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Features.Series;
using Microsoft.EntityFrameworkCore;
using Npgsql;
using NpgsqlTypes;

namespace FinWatch.Benchmarks;

/// <summary>
/// Time-range series queries on PostgreSQL with N stored site rows (10 million by default). A fresh database is
/// migrated with the PostgreSQL migration set (so the indexes are the product's), filled with invented rows of an
/// invented fab by binary COPY, analysed, and then asked the series query the series, chart and capability endpoints
/// share (<see cref="SeriesQuery.Rows"/>, through EF Core, every row read) for random windows of one shift, one day
/// and one week, with and without a chamber.
/// </summary>
public static class TimeRangeBenchmark
{
    // The invented fab of README Scale-out: 24 lots a day, 25 wafers, 13 sites, three measured steps; two products.
    private const int LotsPerDay = 24;
    private const int Wafers = 25;
    private const int Sites = 13;
    private static readonly string[] Steps = ["FIN-PROFILE", "POST-ETCH-CD", "LINER-THK"];
    private static readonly DateTimeOffset Start = new(2025, 1, 1, 0, 0, 0, TimeSpan.Zero);

    public static async Task<int> RunAsync(long rows)
    {
        var server = Environment.GetEnvironmentVariable("FINWATCH_BENCH_POSTGRES") ?? Environment.GetEnvironmentVariable("FINWATCH_TEST_POSTGRES");
        if (string.IsNullOrEmpty(server))
        {
            Console.Error.WriteLine("set FINWATCH_BENCH_POSTGRES (or FINWATCH_TEST_POSTGRES) to a PostgreSQL connection string whose role may create databases");
            return 2;
        }

        var name = $"finwatch_bench_{DateTime.UtcNow:yyyyMMddHHmmss}";
        await ExecAsync(server, $"CREATE DATABASE {name}");
        var cs = new NpgsqlConnectionStringBuilder(server) { Database = name, CommandTimeout = 0 }.ToString();
        try
        {
            await using (var db = Context(cs))
            {
                await db.Database.MigrateAsync();
            }

            var (products, days) = await LoadAsync(cs, rows);
            await using var check = Context(cs);
            Console.WriteLine($"Stored: {await check.Measurements.LongCountAsync():N0} rows over {days} days; "
                + $"measurements with indexes {await ScalarAsync(cs, "SELECT pg_size_pretty(pg_total_relation_size('measurements'))")}, "
                + $"{await ScalarAsync(cs, "SELECT pg_total_relation_size('measurements') / GREATEST(count(*), 1) FROM measurements")} bytes a row");
            FinParameters.TryGet("top_width_nm", out var parameter);
            var random = new Random(20261202);
            foreach (var (label, hours, chamber) in new[] { ("one shift (8 h)", 8, false), ("one day", 24, false), ("one day, one etch chamber", 24, true), ("one week", 24 * 7, false) })
            {
                var times = new List<double>();
                var counts = new List<int>();
                for (var i = 0; i < 60; i++)
                {
                    var from = Start.AddHours(random.Next(0, (days * 24) - hours));
                    var q = new SeriesQuery("bench", products[random.Next(products.Length)], Steps[random.Next(Steps.Length)], parameter,
                        chamber ? $"ETA-{random.Next(1, 5)}" : null, from, from.AddHours(hours));
                    await using var db = Context(cs);
                    var sw = Stopwatch.StartNew();
                    var n = 0;
                    await foreach (var _ in q.Rows(db))
                    {
                        n++;
                    }

                    sw.Stop();
                    if (i >= 10)
                    {
                        times.Add(sw.Elapsed.TotalMilliseconds); // the first ten warm the pool and the plan cache
                        counts.Add(n);
                    }
                }

                times.Sort();
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{label}: {counts.Average():N0} rows a query; p50 {times[times.Count / 2]:0.0} ms, p95 {times[(int)(times.Count * 0.95)]:0.0} ms, max {times[^1]:0.0} ms"));
            }

            Console.WriteLine("Plan of a one-day query:");
            Console.WriteLine(await ScalarAsync(cs, $"""
                EXPLAIN (ANALYZE, BUFFERS, FORMAT TEXT)
                SELECT measured_at_ms, lot_id, wafer_slot, site_id, etch_chamber, liner_chamber, top_width_nm FROM measurements
                WHERE product_id = {products[0]} AND step = 'FIN-PROFILE' AND measured_at_ms >= {Start.AddDays(days / 2).ToUnixTimeMilliseconds()}
                  AND measured_at_ms <= {Start.AddDays((days / 2) + 1).ToUnixTimeMilliseconds()} AND top_width_nm IS NOT NULL
                ORDER BY measured_at_ms, lot_id, wafer_slot, site_id
                """, allRows: true));
            return 0;
        }
        finally
        {
            NpgsqlConnection.ClearAllPools();
            if (Environment.GetEnvironmentVariable("FINWATCH_BENCH_KEEP") is null)
            {
                await ExecAsync(server, $"DROP DATABASE IF EXISTS {name} WITH (FORCE)");
            }
            else
            {
                Console.WriteLine($"kept database {name}");
            }
        }
    }

    private static PostgresFinWatchDbContext Context(string cs) =>
        new(new DbContextOptionsBuilder<PostgresFinWatchDbContext>().UseNpgsql(cs).Options);

    // Lots in time order; each lot is measured at every step two hours apart, its wafers a minute apart, sites 5 s apart.
    private static async Task<(int[] Products, int Days)> LoadAsync(string cs, long rows)
    {
        await using var connection = new NpgsqlConnection(cs);
        await connection.OpenAsync();
        var products = new int[2];
        for (var p = 0; p < 2; p++)
        {
            await using var cmd = new NpgsqlCommand("""
                INSERT INTO products (code, name, description, gate_faces, nominal_top_width_nm, nominal_bottom_width_nm, nominal_fin_height_nm,
                    nominal_corner_radius_nm, nominal_liner_thickness_nm, created_at_ms, updated_at_ms)
                VALUES (@code, @code, 'invented for the benchmark', 'TriGate', 6, 10, 42, 2, 2.5, 0, 0) RETURNING id
                """, connection);
            cmd.Parameters.AddWithValue("code", $"BX-{p + 1}");
            products[p] = (int)(await cmd.ExecuteScalarAsync())!;
        }

        long batch;
        await using (var cmd = new NpgsqlCommand("""
            INSERT INTO ingest_batches (source, label, received_at_ms, completed_at_ms, row_count, inserted, already_present)
            VALUES ('benchmark', 'time-range', 0, 0, 0, 0, 0) RETURNING id
            """, connection))
        {
            batch = (long)(await cmd.ExecuteScalarAsync())!;
        }

        var sw = Stopwatch.StartNew();
        var random = new Random(7);
        long written = 0;
        var lot = 0;
        await using (var copy = await connection.BeginBinaryImportAsync("""
            COPY measurements (batch_id, lot_id, wafer_slot, site_id, site_x_mm, site_y_mm, product_id, step, etch_tool, etch_chamber,
                liner_tool, liner_chamber, metrology_tool, measured_at_ms, top_width_nm, bottom_width_nm, fin_height_nm, flags)
            FROM STDIN (FORMAT BINARY)
            """))
        {
            while (written < rows)
            {
                var lotStart = Start.AddMinutes(lot * (24 * 60 / LotsPerDay));
                var lotId = $"Q{lot:000000}";
                var product = products[lot % 2];
                var chamber = $"ETA-{(lot % 4) + 1}";
                for (var s = 0; s < Steps.Length && written < rows; s++)
                {
                    for (var w = 1; w <= Wafers && written < rows; w++)
                    {
                        for (var site = 1; site <= Sites && written < rows; site++)
                        {
                            var at = lotStart.AddHours(2 * s).AddMinutes(w).AddSeconds(5 * site).ToUnixTimeMilliseconds();
                            await copy.StartRowAsync();
                            await copy.WriteAsync(batch, NpgsqlDbType.Bigint);
                            await copy.WriteAsync(lotId, NpgsqlDbType.Varchar);
                            await copy.WriteAsync(w, NpgsqlDbType.Integer);
                            await copy.WriteAsync($"S{site:00}", NpgsqlDbType.Varchar);
                            await copy.WriteAsync((site * 20.0) - 140, NpgsqlDbType.Double);
                            await copy.WriteAsync(0.0, NpgsqlDbType.Double);
                            await copy.WriteAsync(product, NpgsqlDbType.Integer);
                            await copy.WriteAsync(Steps[s], NpgsqlDbType.Varchar);
                            await copy.WriteAsync("ETA", NpgsqlDbType.Varchar);
                            await copy.WriteAsync(chamber, NpgsqlDbType.Varchar);
                            await copy.WriteAsync("LNA", NpgsqlDbType.Varchar);
                            await copy.WriteAsync($"LNA-{(lot % 2) + 1}", NpgsqlDbType.Varchar);
                            await copy.WriteAsync("OCD-1", NpgsqlDbType.Varchar);
                            await copy.WriteAsync(at, NpgsqlDbType.Bigint);
                            await copy.WriteAsync(6 + (0.1 * ((random.NextDouble() * 2) - 1)), NpgsqlDbType.Double);
                            await copy.WriteAsync(10 + (0.1 * ((random.NextDouble() * 2) - 1)), NpgsqlDbType.Double);
                            await copy.WriteAsync(42 + ((random.NextDouble() * 2) - 1), NpgsqlDbType.Double);
                            await copy.WriteAsync(0, NpgsqlDbType.Integer);
                            written++;
                        }
                    }
                }

                lot++;
                if (lot % 2000 == 0)
                {
                    Console.WriteLine(string.Create(CultureInfo.InvariantCulture, $"  {written:N0} rows, {written / sw.Elapsed.TotalSeconds:N0} rows/s"));
                }
            }

            await copy.CompleteAsync();
        }

        Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
            $"Loaded {written:N0} rows by binary COPY into the indexed table in {sw.Elapsed.TotalSeconds:0} s ({written / sw.Elapsed.TotalSeconds:N0} rows/s)"));
        await using (var analyse = new NpgsqlCommand("VACUUM ANALYZE measurements", connection))
        {
            await analyse.ExecuteNonQueryAsync();
        }

        return (products, (int)Math.Ceiling(lot / (double)LotsPerDay));
    }

    internal static async Task ExecAsync(string cs, string sql)
    {
        await using var connection = new NpgsqlConnection(cs);
        await connection.OpenAsync();
        await using var cmd = new NpgsqlCommand(sql, connection);
        await cmd.ExecuteNonQueryAsync();
    }

    private static async Task<string> ScalarAsync(string cs, string sql, bool allRows = false)
    {
        await using var connection = new NpgsqlConnection(cs);
        await connection.OpenAsync();
        await using var cmd = new NpgsqlCommand(sql, connection);
        await using var reader = await cmd.ExecuteReaderAsync();
        var lines = new List<string>();
        while (await reader.ReadAsync())
        {
            lines.Add(Convert.ToString(reader.GetValue(0), CultureInfo.InvariantCulture) ?? "");
            if (!allRows)
            {
                break;
            }
        }

        return string.Join('\n', lines);
    }
}
