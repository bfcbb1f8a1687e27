using System.Collections.Concurrent;
using System.Net;
using System.Text;
using FinWatch.Server.Infrastructure;
using FinWatch.Testing;
using Microsoft.AspNetCore.Builder;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.DependencyInjection;
using OpenTelemetry.Metrics;
using OpenTelemetry.Trace;

namespace FinWatch.Server.Tests.Infrastructure;

/// <summary>
/// The exporters, each switched on the way an operator does it. An OpenTelemetry provider hears every meter named
/// FinWatch in the process, so these tests run alone: the figures scraped are this app's only.
/// </summary>
[CollectionDefinition(Name, DisableParallelization = true)]
public sealed class TelemetryExportCollection
{
    public const string Name = "telemetry exporters";
}

[Collection(TelemetryExportCollection.Name)]
public sealed class TelemetryExportTests
{
    private static readonly string Csv = SiteRow.Csv(SiteRow.Wafers("L100", wafers: 3, sites: 5, new DateTimeOffset(2026, 11, 20, 8, 0, 0, TimeSpan.Zero)));

    private static async Task<HttpClient> StartAsync(FinWatchAppFactory factory)
    {
        var client = factory.CreateClient();
        await TestProducts.CreateBothAsync(client);
        return client;
    }

    private static async Task IngestAsync(HttpClient client)
    {
        using var content = new StringContent(Csv, Encoding.UTF8, "text/csv");
        (await client.PostAsync("/api/measurements/csv", content)).EnsureSuccessStatusCode();
    }

    [Fact]
    public async Task Prometheus_Enabled_AnswersTextExpositionWithFinWatchMetrics_WithoutSignIn()
    {
        using var factory = new FinWatchAppFactory().With("FinWatch:Telemetry:PrometheusEnabled", "true");
        using var client = await StartAsync(factory);
        await IngestAsync(client);

        using var scrape = new HttpRequestMessage(HttpMethod.Get, "/metrics");
        scrape.Headers.Add(TestAuthHandler.Header, "anonymous");
        var response = await client.SendAsync(scrape);
        var text = await response.Content.ReadAsStringAsync();
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("text/plain", response.Content.Headers.ContentType?.MediaType);
        var lines = text.Split('\n');
        // Prometheus names: dots become underscores, counters gain _total, the unit "s" becomes _seconds.
        Assert.Equal("1", Sample(lines, "finwatch_ingest_batches_total", "finwatch_ingest_source=\"api-csv\"", "finwatch_ingest_result=\"stored\""));
        Assert.Equal("15", Sample(lines, "finwatch_ingest_rows_total", "finwatch_ingest_source=\"api-csv\"", "finwatch_ingest_result=\"inserted\""));
        Assert.Equal("0", Sample(lines, "finwatch_ingest_rows_total", "finwatch_ingest_result=\"already_present\""));
        Assert.Equal("1", Sample(lines, "finwatch_ingest_batch_duration_seconds_count", "finwatch_ingest_result=\"stored\""));
        Assert.Equal("1", Sample(lines, "finwatch_ingest_batch_duration_seconds_bucket", "finwatch_ingest_result=\"stored\"", "le=\"+Inf\""));
        Assert.Contains("# TYPE finwatch_ingest_batch_duration_seconds histogram", lines);
        Assert.Contains(lines, l => l.StartsWith("http_server_request_duration_seconds_count{", StringComparison.Ordinal)); // ASP.NET Core's own
    }

    [Fact]
    public async Task Prometheus_NotEnabled_ServesNothing()
    {
        using var factory = new FinWatchAppFactory();
        using var client = await StartAsync(factory);
        await IngestAsync(client);

        Assert.Equal(HttpStatusCode.NotFound, (await client.GetAsync("/metrics")).StatusCode); // a signed-in administrator
        Assert.Null(factory.Services.GetService<MeterProvider>());
    }

    [Fact]
    public async Task Otlp_WithoutItsVariable_IsNotRegistered()
    {
        using var factory = new FinWatchAppFactory().With(TelemetryExtensions.OtlpEndpointVariable, "");
        using var client = await StartAsync(factory);
        await IngestAsync(client);

        Assert.Null(factory.Services.GetService<TracerProvider>());
        Assert.Null(factory.Services.GetService<MeterProvider>());
    }

    [Fact]
    public async Task Otlp_WithItsVariables_ExportsFinWatchSpansAndMetrics()
    {
        await using var collector = await OtlpCollector.StartAsync();
        using var factory = new FinWatchAppFactory()
            .With(TelemetryExtensions.OtlpEndpointVariable, collector.Address)
            .With("OTEL_EXPORTER_OTLP_PROTOCOL", "http/protobuf")
            .With("OTEL_SERVICE_NAME", "finwatch-line-7");
        using var client = await StartAsync(factory);
        await IngestAsync(client);

        Assert.True(factory.Services.GetRequiredService<TracerProvider>().ForceFlush(10_000));
        Assert.True(factory.Services.GetRequiredService<MeterProvider>().ForceFlush(10_000));
        // OTLP is protobuf: names and string values travel as UTF-8, so they can be looked for in the bytes.
        var traces = collector.Text("/v1/traces");
        Assert.Contains("finwatch-line-7", traces, StringComparison.Ordinal); // OTEL_SERVICE_NAME wins over the default
        Assert.Contains("finwatch.ingest.batch", traces, StringComparison.Ordinal);
        Assert.Contains("finwatch.monitor.evaluate", traces, StringComparison.Ordinal);
        Assert.Contains("/api/measurements/csv", traces, StringComparison.Ordinal); // the ASP.NET Core server span's route
        Assert.Contains("sqlite", traces, StringComparison.Ordinal); // the database spans of EF Core's commands
        var metrics = collector.Text("/v1/metrics");
        Assert.Contains("finwatch-line-7", metrics, StringComparison.Ordinal);
        Assert.Contains("finwatch.ingest.rows", metrics, StringComparison.Ordinal);
        Assert.Contains("finwatch.ingest.batch.duration", metrics, StringComparison.Ordinal);
        Assert.Contains("http.server.request.duration", metrics, StringComparison.Ordinal);
    }

    // The value of the one sample of this metric whose labels include all of these.
    private static string Sample(string[] lines, string metric, params string[] labels)
    {
        var line = Assert.Single(lines, l => l.StartsWith(metric + "{", StringComparison.Ordinal) && labels.All(x => l.Contains(x, StringComparison.Ordinal)));
        return line[(line.LastIndexOf('}') + 2)..].Split(' ')[0];
    }

    /// <summary>A stand-in OTLP/HTTP receiver on a free loopback port: keeps every request body by path, answers 200.</summary>
    private sealed class OtlpCollector : IAsyncDisposable
    {
        private readonly WebApplication app;
        private readonly ConcurrentQueue<(string Path, byte[] Body)> received = new();

        private OtlpCollector(WebApplication app) => this.app = app;

        public string Address => app.Urls.First(); // the port the system gave, once started

        public static async Task<OtlpCollector> StartAsync()
        {
            var builder = WebApplication.CreateSlimBuilder();
            builder.WebHost.UseUrls("http://127.0.0.1:0");
            var collector = new OtlpCollector(builder.Build());
            collector.app.MapPost("/v1/{signal}", async (HttpContext http) =>
            {
                using var body = new MemoryStream();
                await http.Request.Body.CopyToAsync(body);
                collector.received.Enqueue((http.Request.Path, body.ToArray()));
                return Results.Bytes([], "application/x-protobuf");
            });
            await collector.app.StartAsync();
            return collector;
        }

        public string Text(string path) =>
            string.Concat(received.Where(r => r.Path == path).Select(r => Encoding.UTF8.GetString(r.Body)));

        public async ValueTask DisposeAsync() => await app.DisposeAsync();
    }
}
