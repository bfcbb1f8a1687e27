using System.Diagnostics;
using System.Globalization;
using FinWatch.Data;
using FinWatch.Physics;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Features.Series;
using FinWatch.Server.Infrastructure;
using Microsoft.EntityFrameworkCore;
using Npgsql;
using NpgsqlTypes;

namespace FinWatch.Benchmarks;

/// <summary>
/// Time-range series queries on PostgreSQL with N stored site rows (10 million by default). A fresh database is
/// migrated with the PostgreSQL migration set (so the indexes are the product's), filled with invented rows of an
/// invented fab by binary COPY, analysed, and then asked the series query the series, chart and capability endpoints
/// share (<see cref="SeriesQuery.Rows"/>, through EF Core, every row read) for random windows of one shift, one day
/// and one week, with and without a chamber, on connections with the server's planner option
/// (<see cref="DatabaseOptions.PostgresRandomPageCost"/>). The same SQL read by a bare data reader is the baseline in
/// the same run. FINWATCH_BENCH_KEEP keeps the filled database; FINWATCH_BENCH_DATABASE runs the queries on a kept one.
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

        // FINWATCH_BENCH_DATABASE names a database an earlier run kept (FINWATCH_BENCH_KEEP): it is migrated (so a new
        // index of the product lands in it) and queried again without the load.
        var reuse = Environment.GetEnvironmentVariable("FINWATCH_BENCH_DATABASE");
        var name = reuse ?? $"finwatch_bench_{DateTime.UtcNow:yyyyMMddHHmmss}";
        if (reuse is null)
        {
            // The collation README Scale-out asks for: byte order, as on SQLite.
            await ExecAsync(server, $"CREATE DATABASE {name} TEMPLATE template0 ENCODING 'UTF8' LC_COLLATE 'C' LC_CTYPE 'C'");
        }

        // The connection string the server would open: with the planner option of FinWatch:Database (its default).
        var cs = DatabaseOptions.WithPlannerOptions(new NpgsqlConnectionStringBuilder(server) { Database = name, CommandTimeout = 0 }.ToString(),
            new DatabaseOptions().PostgresRandomPageCost);
        try
        {
            await using (var db = Context(cs))
            {
                await db.Database.MigrateAsync();
            }

            var (products, days) = reuse is null ? await LoadAsync(cs, rows) : await LoadedAsync(cs);
            if (reuse is not null)
            {
                await ExecAsync(cs, "VACUUM ANALYZE measurements");
            }

            await using var check = Context(cs);
            Console.WriteLine($"Stored: {await check.Measurements.LongCountAsync():N0} rows over {days} days; "
                + $"measurements with indexes {await ScalarAsync(cs, "SELECT pg_size_pretty(pg_total_relation_size('measurements'))")}, "
                + $"{await ScalarAsync(cs, "SELECT pg_total_relation_size('measurements') / GREATEST(count(*), 1) FROM measurements")} bytes a row");
            FinParameters.TryGet("top_width_nm", out var parameter);
            var random = new Random(20261202);
            Console.WriteLine("Each window: the product's query (SeriesQuery.Rows) and, as the baseline in the same run, the same SQL read "
                + "by a bare NpgsqlDataReader into the same rows; after a warm-up, 50 random windows each after 10 more, the two alternating.");
            // Warm-up before anything is measured, to the steady state of a server that has run a while: a fresh process
            // reads large results slowly while tiered compilation and dynamic PGO re-compile the hot paths. Measured on
            // the 10-million-row database: with 30 one-week windows of warm-up, one-week p95 38–72 ms over six runs;
            // with 200, 31–36 ms (and 32–35 ms with 30 and DOTNET_TieredPGO=0). FINWATCH_BENCH_WARMUP changes the count.
            var warmUp = int.TryParse(Environment.GetEnvironmentVariable("FINWATCH_BENCH_WARMUP"), CultureInfo.InvariantCulture, out var w) ? w : 200;
            for (var i = 0; i < warmUp; i++)
            {
                var from = Start.AddHours(random.Next(0, (days - 7) * 24));
                var q = new SeriesQuery("bench", products[i % products.Length], Steps[i % Steps.Length], parameter, null, from, from.AddDays(7));
                await ProductRowsAsync(cs, q);
                await BaselineRowsAsync(cs, q);
            }

            foreach (var (label, hours, chamber) in new[] { ("one shift (8 h)", 8, false), ("one day", 24, false), ("one day, one etch chamber", 24, true), ("one week", 24 * 7, false) })
            {
                var product = new List<double>();
                var baseline = new List<double>();
                var counts = new List<int>();
                for (var i = 0; i < 60; i++)
                {
                    var from = Start.AddHours(random.Next(0, (days * 24) - hours));
                    var q = new SeriesQuery("bench", products[random.Next(products.Length)], Steps[random.Next(Steps.Length)], parameter,
                        chamber ? $"ETA-{random.Next(1, 5)}" : null, from, from.AddHours(hours));
                    // Alternating which goes first, so neither always finds the window's pages cached by the other.
                    double ef, raw;
                    int n;
                    if (i % 2 == 0)
                    {
                        (ef, n) = await TimeAsync(() => ProductRowsAsync(cs, q));
                        (raw, _) = await TimeAsync(() => BaselineRowsAsync(cs, q));
                    }
                    else
                    {
                        (raw, _) = await TimeAsync(() => BaselineRowsAsync(cs, q));
                        (ef, n) = await TimeAsync(() => ProductRowsAsync(cs, q));
                    }

                    if (i >= 10)
                    {
                        product.Add(ef); // the first ten warm the pool and the plan cache
                        baseline.Add(raw);
                        counts.Add(n);
                    }
                }

                if (Environment.GetEnvironmentVariable("FINWATCH_BENCH_VERBOSE") is not null)
                {
                    Console.WriteLine("  product:  " + string.Join(' ', product.Select(x => x.ToString("0", CultureInfo.InvariantCulture))));
                    Console.WriteLine("  baseline: " + string.Join(' ', baseline.Select(x => x.ToString("0", CultureInfo.InvariantCulture))));
                }

                product.Sort();
                baseline.Sort();
                Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                    $"{label}: {counts.Average():N0} rows a query; p50 {P(product, 0.5):0.0} ms, p95 {P(product, 0.95):0.0} ms, max {product[^1]:0.0} ms; "
                    + $"baseline p50 {P(baseline, 0.5):0.0} ms, p95 {P(baseline, 0.95):0.0} ms; p95 ratio {P(product, 0.95) / P(baseline, 0.95):0.00}"));
            }

            Console.WriteLine("Plan of a one-week query:");
            var middle = Start.AddDays(days / 2);
            Console.WriteLine(await PlanAsync(cs, new SeriesQuery("bench", products[0], Steps[0], parameter, null, middle, middle.AddDays(7))));
            return 0;
        }
        finally
        {
            NpgsqlConnection.ClearAllPools();
            if (reuse is null && Environment.GetEnvironmentVariable("FINWATCH_BENCH_KEEP") is null)
            {
                await ExecAsync(server, $"DROP DATABASE IF EXISTS {name} WITH (FORCE)");
            }
            else
            {
                Console.WriteLine($"kept database {name}");
            }
        }
    }

    private static double P(List<double> sorted, double q) => sorted[Math.Min(sorted.Count - 1, (int)(sorted.Count * q))];

    private static async Task<(double Ms, int Rows)> TimeAsync(Func<Task<int>> read)
    {
        var sw = Stopwatch.StartNew();
        var n = await read();
        return (sw.Elapsed.TotalMilliseconds, n);
    }

    // The product's path: a fresh context from the pool's connection, every row read.
    private static async Task<int> ProductRowsAsync(string cs, SeriesQuery q)
    {
        await using var db = Context(cs);
        var n = 0;
        await foreach (var _ in q.Rows(db))
        {
            n++;
        }

        return n;
    }

    // The baseline: EF Core's own command for the same query (its SQL and parameters), read by a bare data reader into
    // the same records.
    private static async Task<int> BaselineRowsAsync(string cs, SeriesQuery q)
    {
        await using var db = Context(cs);
        await using var cmd = q.Queryable(db).CreateDbCommand();
        await db.Database.OpenConnectionAsync();
        await using var reader = await cmd.ExecuteReaderAsync();
        var rows = new List<SeriesRow>();
        while (await reader.ReadAsync())
        {
            rows.Add(new SeriesRow(reader.GetInt64(0), reader.GetString(1), reader.GetInt32(2), reader.GetString(3),
                reader.IsDBNull(4) ? null : reader.GetString(4), reader.IsDBNull(5) ? null : reader.GetString(5), reader.GetDouble(6)));
        }

        return rows.Count;
    }

    // PostgreSQL's EXPLAIN ANALYZE of the same command, one line of the plan per line.
    private static async Task<string> PlanAsync(string cs, SeriesQuery q)
    {
        await using var db = Context(cs);
        await using var cmd = q.Queryable(db).CreateDbCommand();
        cmd.CommandText = "EXPLAIN (ANALYZE, BUFFERS, FORMAT TEXT) " + cmd.CommandText;
        await db.Database.OpenConnectionAsync();
        return await FirstColumnAsync(cmd, allRows: true);
    }

    // A kept database: its products and how many days its lots span.
    private static async Task<(int[] Products, int Days)> LoadedAsync(string cs)
    {
        var ids = (await ScalarAsync(cs, "SELECT id FROM products ORDER BY id", allRows: true)).Split('\n').Select(x => int.Parse(x, CultureInfo.InvariantCulture)).ToArray();
        var last = long.Parse(await ScalarAsync(cs, "SELECT max(measured_at_ms) FROM measurements"), CultureInfo.InvariantCulture);
        return (ids, (int)Math.Ceiling((last - Start.ToUnixTimeMilliseconds()) / 86_400_000.0));
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
                VALUES (@code, @code, 'invented for the benchmark', @faces, 6, 10, 42, 2, 2.5, 0, 0) RETURNING id
                """, connection);
            cmd.Parameters.AddWithValue("code", $"BX-{p + 1}");
            cmd.Parameters.AddWithValue("faces", GateFacesText.TriGate);
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
        return await FirstColumnAsync(cmd, allRows);
    }

    // The first column of the first row, or of every row on its own line.
    private static async Task<string> FirstColumnAsync(System.Data.Common.DbCommand cmd, bool allRows)
    {
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
