using System.Diagnostics;
using System.Globalization;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using FinWatch.SeedDemo;
using FinWatch.Server.Features.Monitor;
using Microsoft.AspNetCore.Http.Connections;
using Microsoft.AspNetCore.SignalR.Client;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Benchmarks;

/// <summary>
/// Live push under load: a real server process, chart contexts with approved limits, N SignalR .NET clients over
/// WebSockets (most watch one or two contexts, one in ten watches everything like a floor screen), and the invented
/// demo fab's lots ingested one lot per POST /api/measurements/csv at a fixed rate. For every point entry a client
/// receives, latency = the client's receive time − the time the ingest call of that point's lot returned (same Stopwatch,
/// same process); the entry's lot is looked up afterwards in the stored feed by the entry's number, since a floor
/// screen's entries carry no point. The server pushes after its commit, off the request's path, so a push can beat the
/// HTTP response and the latency can be negative; it is reported signed, not clamped. Several client counts
/// (<c>push 3 500,1000</c>, the default) run one after the other in one invocation, each against a fresh server, and a
/// summary puts them side by side.
/// </summary>
public static class PushBenchmark
{
    private const int BaselineLots = 30;

    /// <summary>Lots ingested first at the same rate and left out of every figure (the first pushes JIT the path).</summary>
    private const int WarmupLots = 3;
    private const int FloorScreenEvery = 10;
    private const int ConnectConcurrency = 32;
    private const int TargetP99Ms = 50;
    private const string Step = DemoFab.ProfileStep;

    private static readonly string[] EtchChambers = ["FX07-L", "FX07-R", "FX08-L", "FX08-R"];

    private sealed record Lot(string LotId, string Rows);

    private sealed record ContextSpec(string Code, string Product, string Parameter, string? Chamber);

    /// <summary>
    /// One client: what it watches and what it received (the feed number and receive timestamp of each point entry; the
    /// number leads to the point's lot afterwards, through the stored feed, as a floor screen's entries carry no point).
    /// </summary>
    private sealed class Client(HubConnection connection, string[]? watches)
    {
        private readonly List<(long Seq, long At)> points = [];

        public HubConnection Connection { get; } = connection;

        /// <summary>The contexts watched; null for a client that watches everything.</summary>
        public string[]? Watches { get; } = watches;

        public int Alerts { get; private set; }

        /// <summary>Point entries that came without their point to a client that watches contexts (it draws them): must stay 0.</summary>
        public int Bare { get; private set; }

        public bool Closed { get; set; }

        public void Receive(FeedMessage m, long at)
        {
            lock (points)
            {
                if (m.Kind == "alert")
                {
                    Alerts++;
                    return;
                }

                if (m.Point is null && Watches is not null)
                {
                    Bare++;
                }

                points.Add((m.Seq, at));
            }
        }

        public List<(long Seq, long At)> Points()
        {
            lock (points)
            {
                return [.. points];
            }
        }

        public int Count
        {
            get
            {
                lock (points)
                {
                    return points.Count;
                }
            }
        }
    }

    /// <summary>What one client count measured, for the summary that puts the counts of one run side by side.</summary>
    private sealed record Outcome(int Clients, double P50, double P99, double Max, long Received, long Missing, long Bare, double FanOutMax,
        double KbAConnection, string Load);

    /// <summary>Runs the measurement once for each client count, in the order given, each against a fresh server, and compares them.</summary>
    public static async Task<int> RunAsync(double minutes, IReadOnlyList<int> clientCounts, double lotsPerMinute)
    {
        if (minutes <= 0 || clientCounts.Count == 0 || clientCounts.Any(c => c < 1) || lotsPerMinute <= 0)
        {
            Console.Error.WriteLine("push: minutes, clients and lots per minute must be positive");
            return 2;
        }

        var outcomes = new List<Outcome>();
        foreach (var clients in clientCounts)
        {
            Console.WriteLine($"== {clients} clients ==");
            var outcome = await RunOnceAsync(minutes, clients, lotsPerMinute);
            if (outcome is null)
            {
                return 1;
            }

            outcomes.Add(outcome);
            Console.WriteLine();
        }

        Console.WriteLine($"Summary ({minutes:0.#} min and {lotsPerMinute:0.#} lots a minute per client count; latency from the ingest call's return to the client's receive):");
        Console.WriteLine("clients  p50 ms  p99 ms  max ms  deliveries  missing  fan-out max ms  KB a connection  load average at the start");
        foreach (var o in outcomes)
        {
            Console.WriteLine($"{o.Clients,7}  {o.P50,6:0.0}  {o.P99,6:0.0}  {o.Max,6:0.0}  {o.Received,10:N0}  {o.Missing,7:N0}  {o.FanOutMax,14:0}  {o.KbAConnection,15:0}  {o.Load}");
        }

        var met = outcomes.All(o => o.P99 <= TargetP99Ms && o.Missing == 0 && o.Bare == 0);
        Console.WriteLine($"Target p99 ≤ {TargetP99Ms} ms with nothing missing or without its point at every client count: {(met ? "met" : "NOT met")}");
        return 0;
    }

    private static async Task<Outcome?> RunOnceAsync(double minutes, int clients, double lotsPerMinute)
    {
        var runLots = (int)Math.Ceiling(minutes * lotsPerMinute);
        var lots = DemoLots(BaselineLots + WarmupLots + runLots);
        var baseline = lots.Take(BaselineLots).ToList();
        var run = lots.Skip(BaselineLots).ToList();
        var contexts = DemoFab.Products.SelectMany(p => EtchChambers.Select(c => new ContextSpec($"{p.Code}-taper-{c}", p.Code, "taper_deg", c))
            .Append(new ContextSpec($"{p.Code}-mid-width", p.Code, "mid_width_nm", null))).ToList();

        var work = Directory.CreateTempSubdirectory("finwatch-push-").FullName;
        try
        {
            // One administrator computes and approves every chart's limits here, so the second-approver rule is off.
            await using var server = await BenchServer.StartAsync(work, "finwatch.db", "--FinWatch:Monitor:ApproverMustDiffer", "false");
            await server.CreateDemoProductsAsync();
            await PostCsvAsync(server.Http, Csv(baseline));
            foreach (var c in contexts)
            {
                await ApproveBaselineAsync(server.Http, c);
            }

            Console.WriteLine($"Server pid {server.ProcessId}; {contexts.Count} chart contexts with limits approved from {baseline.Count} baseline lots " +
                $"({baseline.Sum(l => l.Rows.Count(ch => ch == '\n'))} site rows)");
            var rssBefore = server.RssBytes();

            var (all, connectMs, connectWall) = await ConnectAsync(server, clients, contexts);
            var rssConnected = server.RssBytes();
            Console.WriteLine($"Connected {all.Count} clients (WebSockets, {all.Count(c => c.Watches is null)} watching everything) in {connectWall.TotalSeconds:0.00} s, " +
                $"{ConnectConcurrency} at a time; per client (negotiate + connect + Watch): p50 {Percentile(connectMs, 0.50):0} ms, " +
                $"p99 {Percentile(connectMs, 0.99):0} ms, max {connectMs.Max():0} ms");
            var kbAConnection = (rssConnected - rssBefore) / 1024.0 / all.Count;
            Console.WriteLine($"Server RSS {rssBefore / 1048576.0:0} MB before the clients, {rssConnected / 1048576.0:0} MB with them " +
                $"({kbAConnection:0} KB a connection)");

            try
            {
                var outcome = await DriveAsync(server, all, run, lotsPerMinute, contexts);
                return outcome is null ? null : outcome with { KbAConnection = kbAConnection };
            }
            finally
            {
                await Task.WhenAll(all.Select(c => c.Connection.DisposeAsync().AsTask()));
            }
        }
        finally
        {
            Directory.Delete(work, recursive: true);
        }
    }

    private static async Task<Outcome?> DriveAsync(BenchServer server, List<Client> all, List<Lot> run, double lotsPerMinute, List<ContextSpec> contexts)
    {
        var interval = TimeSpan.FromMinutes(1 / lotsPerMinute);
        var csv = run.Select(l => Csv([l])).ToArray();
        var sent = new long[run.Count];
        var returned = new long[run.Count];
        var rss = new List<long>();
        using var sampling = new CancellationTokenSource();
        var sampler = Task.CompletedTask;
        Console.WriteLine($"Ingesting {WarmupLots} warm-up lots and then {run.Count - WarmupLots} measured lots, one POST /api/measurements/csv each, " +
            $"{lotsPerMinute:0.#} a minute (every {interval.TotalSeconds:0.00} s), for {run.Count * interval.TotalMinutes:0.0} min…");
        TimeSpan cpu0 = default, selfCpu0 = default;
        var load0 = "";
        var measured = new Stopwatch();
        var wall = Stopwatch.StartNew();
        var late = TimeSpan.Zero;
        for (var k = 0; k < run.Count; k++)
        {
            if (k == WarmupLots)
            {
                load0 = LoadAverage();
                cpu0 = server.CpuTime();
                selfCpu0 = Process.GetCurrentProcess().TotalProcessorTime;
                measured.Start();
                sampler = Task.Run(async () =>
                {
                    while (!sampling.IsCancellationRequested)
                    {
                        rss.Add(server.RssBytes());
                        await Task.Delay(200);
                    }
                });
            }

            var wait = (interval * k) - wall.Elapsed;
            if (wait > TimeSpan.Zero)
            {
                await Task.Delay(wait);
            }
            else
            {
                late = -wait > late ? -wait : late;
            }

            sent[k] = Stopwatch.GetTimestamp();
            await PostCsvAsync(server.Http, csv[k]);
            returned[k] = Stopwatch.GetTimestamp();
        }

        var ingestWall = measured.Elapsed;
        var drained = await DrainAsync(all);
        var cpu = server.CpuTime() - cpu0;
        var selfCpu = Process.GetCurrentProcess().TotalProcessorTime - selfCpu0;
        var seconds = measured.Elapsed.TotalSeconds;
        var load1 = LoadAverage();
        await sampling.CancelAsync();
        await sampler;

        // What the server committed: the points of the measured lots in each context (each of them was pushed), and the
        // lot of each point entry of the feed.
        var lotOfEntry = await LotOfEachPointEntryAsync(server.Http, run);
        var stored = new Dictionary<string, int>();
        var runLots = run.Skip(WarmupLots).Select(l => l.LotId).ToHashSet();
        foreach (var c in contexts)
        {
            var points = await server.Http.GetFromJsonAsync<JsonElement>($"/api/contexts/{c.Code}/points?limit=50000");
            stored[c.Code] = points.EnumerateArray().Count(p => runLots.Contains(p.GetProperty("lot_id").GetString()!));
        }

        var storedAll = stored.Values.Sum();
        var latencies = new List<double>();
        var worstOfLot = new double[run.Count];
        Array.Fill(worstOfLot, double.NegativeInfinity);
        var firstOfLot = new long[run.Count];
        Array.Fill(firstOfLot, long.MaxValue);
        var lastOfLot = new long[run.Count];
        var fromSend = new List<double>();
        long expected = 0, missing = 0, extra = 0, otherPoints = 0;
        foreach (var c in all)
        {
            var want = c.Watches is null ? storedAll : c.Watches.Sum(w => stored[w]);
            var everything = c.Points().Select(x => (Lot: lotOfEntry.TryGetValue(x.Seq, out var lot) ? lot : -1, x.At)).ToList();
            otherPoints += everything.Count(x => x.Lot < 0);
            foreach (var (lot, at) in everything.Where(x => x.Lot >= 0 && x.Lot < WarmupLots))
            {
                worstOfLot[lot] = Math.Max(worstOfLot[lot], Stopwatch.GetElapsedTime(returned[lot], at).TotalMilliseconds);
            }

            var got = everything.Where(x => x.Lot >= WarmupLots).ToList();
            expected += want;
            missing += Math.Max(0, want - got.Count);
            extra += Math.Max(0, got.Count - want);
            foreach (var (lot, at) in got)
            {
                var ms = Stopwatch.GetElapsedTime(returned[lot], at).TotalMilliseconds;
                latencies.Add(ms);
                worstOfLot[lot] = Math.Max(worstOfLot[lot], ms);
                firstOfLot[lot] = Math.Min(firstOfLot[lot], at);
                lastOfLot[lot] = Math.Max(lastOfLot[lot], at);
                fromSend.Add(Stopwatch.GetElapsedTime(sent[lot], at).TotalMilliseconds);
            }
        }

        var ingestByLot = run.Select((_, k) => Stopwatch.GetElapsedTime(sent[k], returned[k]).TotalMilliseconds).ToArray();
        var ingestMs = ingestByLot.Skip(WarmupLots).Order().ToList();
        latencies.Sort();
        fromSend.Sort();
        var p99 = Percentile(latencies, 0.99);
        Console.WriteLine($"Warm-up (not counted): the last delivery of each warm-up lot came " +
            $"{string.Join(", ", worstOfLot.Take(WarmupLots).Select(ms => ms.ToString("0", CultureInfo.InvariantCulture)))} ms after its call returned");
        Console.WriteLine($"Ingested {run.Count - WarmupLots} measured lots in {ingestWall.TotalSeconds:0.0} s (at most {late.TotalMilliseconds:0} ms behind schedule); " +
            $"ingest call p50 {Percentile(ingestMs, 0.50):0} ms, p99 {Percentile(ingestMs, 0.99):0} ms, max {ingestMs.Max():0} ms");
        Console.WriteLine($"Points committed for these lots: {storedAll} over {contexts.Count} contexts ({storedAll / (double)runLots.Count:0.#} a lot)");
        Console.WriteLine($"Deliveries of those points: {latencies.Count:N0} received of {expected:N0} expected; missing {missing:N0}, extra {extra:N0}" +
            (drained ? "" : " (stopped waiting: nothing arrived for 3 s)"));
        Console.WriteLine($"Also received: {all.Sum(c => c.Alerts):N0} alert entries, {otherPoints} points of other lots, " +
            $"{all.Sum(c => c.Bare)} points without their point by clients that watch contexts; " +
            $"{all.Count(c => c.Closed)} connections closed during the run");
        if (latencies.Count == 0)
        {
            Console.WriteLine("No point was delivered: no latency to report.");
            return null;
        }

        var negative = latencies.Count(l => l < 0);
        Console.WriteLine($"Latency, ingest call returned → client received (signed, not clamped): p50 {Percentile(latencies, 0.50):0.0} ms, " +
            $"p90 {Percentile(latencies, 0.90):0.0} ms, p99 {p99:0.0} ms, max {latencies[^1]:0.0} ms, min {latencies[0]:0.0} ms; " +
            $"{negative:N0} ({negative / (double)latencies.Count:P1}) arrived before the HTTP response");
        Console.WriteLine($"Latency, ingest call sent → client received: p50 {Percentile(fromSend, 0.50):0.0} ms, p99 {Percentile(fromSend, 0.99):0.0} ms, " +
            $"max {fromSend[^1]:0.0} ms");
        var worst = worstOfLot.Select((ms, k) => (ms, k)).Skip(WarmupLots).OrderByDescending(x => x.ms).Take(5)
            .Select(x => $"lot {x.k + 1 - WarmupLots} ({run[x.k].LotId}) {x.ms:0} ms, its ingest call {ingestByLot[x.k]:0} ms");
        Console.WriteLine($"Slowest lots (last delivery after the call returned): {string.Join("; ", worst)}");
        var spread = Enumerable.Range(WarmupLots, run.Count - WarmupLots).Where(k => lastOfLot[k] > 0)
            .Select(k => Stopwatch.GetElapsedTime(firstOfLot[k], lastOfLot[k]).TotalMilliseconds).Order().ToList();
        Console.WriteLine($"Fan-out of one lot (its first delivery to any client → its last): p50 {Percentile(spread, 0.50):0} ms, max {spread.Max():0} ms");
        Console.WriteLine($"Target p99 ≤ {TargetP99Ms} ms: {(p99 <= TargetP99Ms ? "met" : "NOT met")}");
        Console.WriteLine($"Server over the run ({seconds:0.0} s wall, ingest and drain): CPU {cpu.TotalSeconds:0.0} s user+sys = " +
            $"{cpu.TotalSeconds / seconds:P0} of one core ({cpu.TotalSeconds / seconds / Environment.ProcessorCount:P0} of the {Environment.ProcessorCount} cores); " +
            $"{cpu.TotalMilliseconds / (run.Count - WarmupLots):0} ms a lot; RSS average {rss.Average() / 1048576.0:0} MB, peak {rss.Max() / 1048576.0:0} MB");
        Console.WriteLine($"Note: the {all.Count} clients and the ingest driver run in this benchmark process on the same machine " +
            $"({Environment.ProcessorCount} cores), using {selfCpu.TotalSeconds / seconds:P0} of one core themselves " +
            $"({selfCpu.TotalMilliseconds / (run.Count - WarmupLots):0} ms a lot); their receive path is part of the latency. " +
            $"Load average (1, 5, 15 min, whole machine) at the start {load0}, at the end {load1}.");
        return new Outcome(all.Count, Percentile(latencies, 0.50), p99, latencies[^1], latencies.Count, missing, all.Sum(c => c.Bare), spread.Max(), 0, load0);
    }

    // Waits until every client has stopped receiving: no new point anywhere for 3 s (at most 60 s).
    private static async Task<bool> DrainAsync(List<Client> all)
    {
        var quiet = Stopwatch.StartNew();
        var total = Stopwatch.StartNew();
        var last = -1L;
        while (total.Elapsed < TimeSpan.FromSeconds(60))
        {
            var now = all.Sum(c => (long)c.Count);
            if (now != last)
            {
                last = now;
                quiet.Restart();
            }
            else if (quiet.Elapsed > TimeSpan.FromSeconds(3))
            {
                return true;
            }

            await Task.Delay(100);
        }

        return false;
    }

    private static async Task<(List<Client> Clients, List<double> ConnectMs, TimeSpan Wall)> ConnectAsync(
        BenchServer server, int count, List<ContextSpec> contexts)
    {
        var hub = new Uri(server.BaseAddress, MonitorHub.Path);
        var clients = new Client[count];
        var connectMs = new double[count];
        using var gate = new SemaphoreSlim(ConnectConcurrency);
        var wall = Stopwatch.StartNew();
        await Task.WhenAll(Enumerable.Range(0, count).Select(async i =>
        {
            await gate.WaitAsync();
            try
            {
                // One in ten is a floor screen (everything); the rest watch one context, every third a second one too.
                string[]? watches = i % FloorScreenEvery == 0 ? null
                    : i % 3 == 0 ? [contexts[i % contexts.Count].Code, contexts[(i + 1) % contexts.Count].Code]
                    : [contexts[i % contexts.Count].Code];
                var connection = new HubConnectionBuilder().WithUrl(hub, HttpTransportType.WebSockets, o => o.Cookies = server.Cookies)
                    .AddJsonProtocol(o => o.PayloadSerializerOptions.PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower)
                    .Build();
                var client = new Client(connection, watches);
                connection.On<List<FeedMessage>>(nameof(IMonitorClient.Feed), entries =>
                {
                    var at = Stopwatch.GetTimestamp();
                    foreach (var m in entries)
                    {
                        client.Receive(m, at);
                    }
                });
                connection.Closed += _ =>
                {
                    client.Closed = true;
                    return Task.CompletedTask;
                };
                var started = Stopwatch.GetTimestamp();
                await connection.StartAsync();
                if (watches is null)
                {
                    await connection.InvokeAsync(nameof(MonitorHub.WatchAll));
                }
                else
                {
                    await connection.InvokeAsync(nameof(MonitorHub.Watch), watches);
                }

                connectMs[i] = Stopwatch.GetElapsedTime(started).TotalMilliseconds;
                clients[i] = client;
            }
            finally
            {
                gate.Release();
            }
        }));
        return ([.. clients], [.. connectMs.Order()], wall.Elapsed);
    }

    /// <summary>The index in <paramref name="run"/> of the lot of every point entry of the feed that belongs to one of those lots.</summary>
    private static async Task<Dictionary<long, int>> LotOfEachPointEntryAsync(HttpClient http, List<Lot> run)
    {
        var lotIndex = run.Select((l, i) => (l.LotId, i)).ToDictionary(x => x.LotId, x => x.i);
        var lotOf = new Dictionary<long, int>();
        for (long after = 0; ;)
        {
            var page = await http.GetFromJsonAsync<JsonElement>($"/api/feed?after={after}");
            if (page.GetArrayLength() == 0)
            {
                return lotOf;
            }

            foreach (var e in page.EnumerateArray())
            {
                after = e.GetProperty("seq").GetInt64();
                if (e.TryGetProperty("point", out var point) && point.ValueKind == JsonValueKind.Object
                    && lotIndex.TryGetValue(point.GetProperty("lot_id").GetString()!, out var lot))
                {
                    lotOf[after] = lot;
                }
            }
        }
    }

    private static async Task ApproveBaselineAsync(HttpClient http, ContextSpec c)
    {
        var created = await http.PostAsJsonAsync("/api/contexts", new
        {
            code = c.Code, product = c.Product, step = Step, parameter = c.Parameter, chamber = c.Chamber, chart_type = "individuals", subgroup = "wafer",
            rules = "westernElectric", reaction_plan = new[] { "Hold the lot", "Check the etch chamber log" },
        });
        await EnsureAsync(created, "create context " + c.Code);
        var computed = await http.PostAsJsonAsync($"/api/contexts/{c.Code}/limits", new { reason = "benchmark baseline (invented demo lots)" });
        await EnsureAsync(computed, "compute limits of " + c.Code);
        var limit = await computed.Content.ReadFromJsonAsync<JsonElement>();
        var approved = await http.PostAsJsonAsync($"/api/contexts/{c.Code}/limits/{limit.GetProperty("version").GetInt32()}/approve",
            new { comment = "benchmark", effective_from = limit.GetProperty("to").GetDateTimeOffset(), justification = "benchmark load, not a process decision" });
        await EnsureAsync(approved, "approve limits of " + c.Code);
    }

    private static async Task PostCsvAsync(HttpClient http, string csv)
    {
        using var content = new StringContent(csv, Encoding.UTF8, "text/csv");
        using var response = await http.PostAsync("/api/measurements/csv", content);
        await EnsureAsync(response, "ingest");
    }

    private static async Task EnsureAsync(HttpResponseMessage response, string what)
    {
        if (!response.IsSuccessStatusCode)
        {
            var body = await response.Content.ReadAsStringAsync();
            throw new InvalidOperationException($"{what} failed: {(int)response.StatusCode} {body[..Math.Min(body.Length, 2000)]}");
        }
    }

    private static string Csv(IEnumerable<Lot> lots) => DemoFab.CsvHeader + "\n" + string.Concat(lots.Select(l => l.Rows));

    /// <summary>
    /// The first <paramref name="count"/> lots of the invented demo fab at its profile step, in measurement order, each as
    /// CSV lines without the header (the demo writer's own lines; 24 lots a day, 25 wafers, 13 or 9 sites a wafer).
    /// </summary>
    private static List<Lot> DemoLots(int count)
    {
        var days = (int)Math.Ceiling(count / 24.0 * 1.2) + 2;
        if (days > 90)
        {
            throw new ArgumentOutOfRangeException(nameof(count), count, "the demo fab holds about 2,000 lots (90 days); run fewer lots");
        }

        var scale = new DemoScale(days);
        using var text = new StringWriter(CultureInfo.InvariantCulture) { NewLine = "\n" };
        DemoFab.WriteMeasurementsCsv(text, DemoFab.DefaultSeed, scale);
        var lines = text.ToString().Split('\n').Skip(1); // the header; the writer's lines follow GenerateRows' order
        var byLot = new Dictionary<string, StringBuilder>();
        var order = new List<string>();
        foreach (var (row, line) in DemoFab.GenerateRows(DemoFab.DefaultSeed, scale).Zip(lines))
        {
            if (row.Step != Step)
            {
                continue;
            }

            if (!byLot.TryGetValue(row.LotId, out var sb))
            {
                byLot[row.LotId] = sb = new StringBuilder();
                order.Add(row.LotId);
            }

            sb.Append(line).Append('\n');
        }

        if (order.Count < count)
        {
            throw new InvalidOperationException($"the demo fab gave {order.Count} profile lots, fewer than {count}");
        }

        return [.. order.Take(count).Select(id => new Lot(id, byLot[id].ToString()))];
    }

    private static string LoadAverage()
    {
        try
        {
            return string.Join(' ', File.ReadAllText("/proc/loadavg").Split(' ').Take(3));
        }
        catch (IOException)
        {
            return "unknown";
        }
    }

    private static double Percentile(List<double> sorted, double p) =>
        sorted.Count == 0 ? double.NaN : sorted[Math.Clamp((int)Math.Ceiling(p * sorted.Count) - 1, 0, sorted.Count - 1)];
}
