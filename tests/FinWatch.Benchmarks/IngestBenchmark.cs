using System.Diagnostics;
using System.Text;
using FinWatch.Data;
using FinWatch.SeedDemo;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Benchmarks;

/// <summary>
/// End-to-end ingest of N site rows through POST /api/measurements/csv on a real server process, against a bare
/// baseline in the same run: the same rows inserted with Microsoft.Data.Sqlite, one prepared statement, one
/// transaction, into the same schema (same table and indexes, created by the same migrations).
/// </summary>
public static class IngestBenchmark
{
    public static async Task<int> RunAsync(int rows)
    {
        var work = Directory.CreateTempSubdirectory("finwatch-bench-").FullName;
        try
        {
            Console.WriteLine($"Generating {rows:N0} invented demo rows…");
            var csvPath = Path.Combine(work, "rows.csv");
            var data = WriteCsv(csvPath, rows);
            Console.WriteLine($"CSV: {new FileInfo(csvPath).Length / 1e6:0.0} MB");

            var baseline = Baseline(Path.Combine(work, "baseline.db"), data);
            Console.WriteLine($"Baseline (Microsoft.Data.Sqlite, one prepared statement, one transaction): {baseline:N0} rows/s");
            data.Clear();
            data.TrimExcess();
            GC.Collect();

            var (rate, peakMb) = await FinWatchAsync(work, csvPath, rows, predict: true, "finwatch.db");
            Console.WriteLine($"FinWatch (HTTP CSV upload, validate, derive, predict, store): {rate:N0} rows/s, server peak RSS {peakMb:0} MB");
            Console.WriteLine($"Ratio FinWatch / baseline: {rate / baseline:P0} (target ≥ 30 %); peak memory target < 400 MB");
            var (plain, _) = await FinWatchAsync(work, csvPath, rows, predict: false, "finwatch-no-prediction.db");
            Console.WriteLine($"FinWatch without the electrical prediction: {plain:N0} rows/s; the prediction adds {(plain / rate) - 1:P1} to ingest time (target < 10 %)");
            if (Environment.GetEnvironmentVariable("FINWATCH_BENCH_POSTGRES") is { Length: > 0 } server)
            {
                // The same upload to a server on PostgreSQL (PostgresSiteWriter: binary COPY through a staging table).
                var name = $"finwatch_ingest_{DateTime.UtcNow:yyyyMMddHHmmss}";
                await TimeRangeBenchmark.ExecAsync(server, $"CREATE DATABASE {name} TEMPLATE template0 ENCODING 'UTF8' LC_COLLATE 'C' LC_CTYPE 'C'");
                try
                {
                    var cs = new Npgsql.NpgsqlConnectionStringBuilder(server) { Database = name }.ToString();
                    var (pg, pgPeak) = await FinWatchAsync(work, csvPath, rows, predict: true, "unused.db",
                        "--FinWatch:Database:Provider", "PostgreSql", "--FinWatch:Database:ConnectionString", cs);
                    Console.WriteLine($"FinWatch on PostgreSQL (same upload, with the prediction): {pg:N0} rows/s, server peak RSS {pgPeak:0} MB");
                }
                finally
                {
                    await TimeRangeBenchmark.ExecAsync(server, $"DROP DATABASE IF EXISTS {name} WITH (FORCE)");
                }
            }
            return 0;
        }
        finally
        {
            Directory.Delete(work, recursive: true);
        }
    }

    // The 90-day demo fab yields about 650,000 rows at 24 lots a day; 38 lots a day give a million. The CSV is the demo
    // writer's own output cut after N data lines, and the baseline gets the same first N rows as objects.
    private static List<DemoSiteRow> WriteCsv(string path, int rows)
    {
        var list = DemoFab.GenerateRows(DemoFab.DefaultSeed, Scale).Take(rows).ToList();
        if (list.Count < rows)
        {
            throw new InvalidOperationException($"the generator gave only {list.Count} rows");
        }

        WriteDemoCsv(path, rows);
        return list;
    }

    private static readonly DemoScale Scale = new(LotsPerDay: 38);

    /// <summary>The demo writer's CSV cut after <paramref name="rows"/> data lines (the file every ingest run uploads).</summary>
    internal static void WriteDemoCsv(string path, int rows)
    {
        using var file = new StreamWriter(path, false, new UTF8Encoding(false), 1 << 16);
        using var limited = new LineLimitWriter(file, rows + 1);
        DemoFab.WriteMeasurementsCsv(limited, DemoFab.DefaultSeed, Scale);
    }

    private static double Baseline(string dbPath, List<DemoSiteRow> data)
    {
        CreateSchema(dbPath);
        using var connection = new SqliteConnection($"Data Source={dbPath}");
        connection.Open();
        using (var pragma = connection.CreateCommand())
        {
            pragma.CommandText = "PRAGMA journal_mode=WAL; PRAGMA synchronous=NORMAL; " +
                "INSERT INTO ingest_batches (source, received_at_ms, completed_at_ms, row_count, inserted, already_present) VALUES ('bench', 0, 0, 0, 0, 0);";
            pragma.ExecuteNonQuery();
        }

        var products = new Dictionary<string, long>();
        using (var cmd = connection.CreateCommand())
        {
            cmd.CommandText = "SELECT code, id FROM products";
            using var r = cmd.ExecuteReader();
            while (r.Read())
            {
                products[r.GetString(0)] = r.GetInt64(1);
            }
        }

        var sw = Stopwatch.StartNew();
        using var tx = connection.BeginTransaction();
        using var insert = connection.CreateCommand();
        insert.Transaction = tx;
        insert.CommandText = """
            INSERT INTO measurements (batch_id, lot_id, wafer_slot, site_id, site_x_mm, site_y_mm, product_id, step,
                etch_tool, etch_chamber, liner_tool, liner_chamber, metrology_tool, operator, measured_at_ms,
                top_width_nm, bottom_width_nm, fin_height_nm, corner_radius_nm, liner_thickness_nm, flags)
            VALUES (1, $lot, $slot, $site, $x, $y, $product, $step, $etool, $echamber, $ltool, $lchamber, $mtool, $op, $at,
                $wt, $wb, $h, $r, $liner, 0)
            """;
        var names = new[] { "$lot", "$slot", "$site", "$x", "$y", "$product", "$step", "$etool", "$echamber", "$ltool", "$lchamber", "$mtool", "$op", "$at", "$wt", "$wb", "$h", "$r", "$liner" };
        var p = names.Select(n => insert.Parameters.Add(n, SqliteType.Text)).ToArray();
        insert.Prepare();
        foreach (var row in data)
        {
            p[0].Value = row.LotId;
            p[1].Value = row.WaferSlot;
            p[2].Value = row.SiteId;
            p[3].Value = row.SiteXMm;
            p[4].Value = row.SiteYMm;
            p[5].Value = products[row.Product];
            p[6].Value = row.Step;
            p[7].Value = (object?)row.EtchTool ?? DBNull.Value;
            p[8].Value = (object?)row.EtchChamber ?? DBNull.Value;
            p[9].Value = (object?)row.LinerTool ?? DBNull.Value;
            p[10].Value = (object?)row.LinerChamber ?? DBNull.Value;
            p[11].Value = (object?)row.MetrologyTool ?? DBNull.Value;
            p[12].Value = (object?)row.Operator ?? DBNull.Value;
            p[13].Value = new DateTimeOffset(row.MeasuredAtUtc, TimeSpan.Zero).ToUnixTimeMilliseconds();
            p[14].Value = (object?)row.TopWidthNm ?? DBNull.Value;
            p[15].Value = (object?)row.BottomWidthNm ?? DBNull.Value;
            p[16].Value = (object?)row.FinHeightNm ?? DBNull.Value;
            p[17].Value = (object?)row.CornerRadiusNm ?? DBNull.Value;
            p[18].Value = (object?)row.LinerThicknessNm ?? DBNull.Value;
            insert.ExecuteNonQuery();
        }

        tx.Commit();
        return data.Count / sw.Elapsed.TotalSeconds;
    }

    private static void CreateSchema(string dbPath)
    {
        var options = new DbContextOptionsBuilder<SqliteFinWatchDbContext>().UseSqlite($"Data Source={dbPath}").Options;
        using var db = new SqliteFinWatchDbContext(options);
        db.Database.Migrate();
        var now = 0L;
        foreach (var p in DemoFab.Products)
        {
            db.Products.Add(new FinWatch.Data.Entities.Product { Code = p.Code, Name = p.Name, CreatedAtMs = now, UpdatedAtMs = now });
        }

        db.SaveChanges();
    }

    private static async Task<(double Rate, double PeakMb)> FinWatchAsync(string work, string csvPath, int rows, bool predict, string database, params string[] settings)
    {
        await using var server = await BenchServer.StartAsync(work, database, ["--FinWatch:Ingest:PredictShifts", predict ? "true" : "false", .. settings]);
        await server.CreateDemoProductsAsync();
        var peak = 0L;
        using var sampling = new CancellationTokenSource();
        var sampler = Task.Run(async () =>
        {
            while (!sampling.IsCancellationRequested)
            {
                peak = Math.Max(peak, server.RssBytes());
                await Task.Delay(50);
            }
        });
        var sw = Stopwatch.StartNew();
        await using (var file = File.OpenRead(csvPath))
        {
            using var content = new StreamContent(file, 1 << 16);
            content.Headers.ContentType = new("text/csv");
            using var response = await server.Http.PostAsync("/api/measurements/csv", content);
            var body = await response.Content.ReadAsStringAsync();
            if (!response.IsSuccessStatusCode)
            {
                throw new InvalidOperationException($"ingest failed: {(int)response.StatusCode} {body[..Math.Min(body.Length, 2000)]}");
            }

            Console.WriteLine("server answered: " + body[..Math.Min(body.Length, 300)]);
        }

        var seconds = sw.Elapsed.TotalSeconds;
        await sampling.CancelAsync();
        await sampler;
        return (rows / seconds, peak / 1048576.0);
    }
}
