using System.Diagnostics;
using System.Threading.Channels;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Infrastructure;
using FinWatch.Testing;
using FinWatch.Server.Tests.Features.Monitor;
using Microsoft.AspNetCore.SignalR.Client;
using Microsoft.Extensions.DependencyInjection;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Infrastructure;

/// <summary>
/// FinWatch's instruments, heard through a <see cref="MetricRecorder"/> on the real app: each figure moves by exactly
/// what the batch, the evaluation or the screen did (the expected values are counted from the test data by hand).
/// </summary>
public class TelemetryTests : IntegrationTest
{
    private const string Rows = "finwatch.ingest.rows";
    private const string Batches = "finwatch.ingest.batches";
    private const string Duration = "finwatch.ingest.batch.duration";
    private const string RowErrors = "finwatch.ingest.row_errors";
    private const string Raised = "finwatch.monitor.alerts.raised";
    private const string Points = "finwatch.monitor.points";

    private static readonly DateTimeOffset Start = new(2026, 11, 20, 8, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task CsvBatch_Stored_CountsItsRowsOneBatchAndOneDuration_AndAgainAsAlreadyPresent()
    {
        using var metrics = new MetricRecorder(Factory.Services);
        var csv = SiteRow.Csv(SiteRow.Wafers("L100", wafers: 3, sites: 5, Start)); // 15 rows

        var wall = Stopwatch.StartNew();
        var first = await ReadJsonAsync(await PostCsvAsync(csv));
        var firstWall = wall.Elapsed.TotalSeconds;
        Assert.Equal(15, first.GetProperty("inserted").GetInt32());
        Assert.Equal(15, metrics.Sum(Rows, "finwatch.ingest.source=api-csv", "finwatch.ingest.result=inserted"));
        Assert.Equal(0, metrics.Sum(Rows, "finwatch.ingest.result=already_present"));
        Assert.Equal(["finwatch.ingest.result=stored,finwatch.ingest.source=api-csv"], metrics.TagSets(Batches));
        Assert.Equal(1, metrics.Sum(Batches));
        var duration = Assert.Single(metrics.Values(Duration, "finwatch.ingest.source=api-csv", "finwatch.ingest.result=stored"));
        // The histogram times the same span as the answer's duration_ms (from arrival to the evaluated commit), and no
        // more than the client waited.
        Assert.InRange(duration, first.GetProperty("duration_ms").GetDouble() / 1000, firstWall);

        await PostCsvAsync(csv);
        Assert.Equal(15, metrics.Sum(Rows, "finwatch.ingest.result=inserted"));
        Assert.Equal(15, metrics.Sum(Rows, "finwatch.ingest.source=api-csv", "finwatch.ingest.result=already_present"));
        Assert.Equal(2, metrics.Sum(Batches, "finwatch.ingest.result=stored"));
        Assert.Equal(2, metrics.Values(Duration).Length);
        Assert.Empty(metrics.Values(RowErrors));
    }

    [Fact]
    public async Task JsonBatch_Rejected_CountsAsRejectedWithItsProblems_AndNoRows()
    {
        using var metrics = new MetricRecorder(Factory.Services);
        var response = await PostJsonAsync(SiteRow.Json([new SiteRow(), new SiteRow { SiteId = "S02", WaferSlot = "40" }, new SiteRow { SiteId = "S03", TopWidthNm = "-1" }]));
        var errors = await AssertRejectedAsync(response);
        Assert.Equal(2, errors.Length);

        Assert.Equal(["finwatch.ingest.result=rejected,finwatch.ingest.source=api-json"], metrics.TagSets(Batches));
        Assert.Equal(1, metrics.Sum(Batches));
        Assert.Equal(2, metrics.Sum(RowErrors, "finwatch.ingest.source=api-json"));
        Assert.Single(metrics.Values(Duration, "finwatch.ingest.source=api-json", "finwatch.ingest.result=rejected"));
        Assert.Empty(metrics.Values(Rows)); // nothing was stored, so no row is counted either way
    }

    [Fact]
    public async Task CsvUpload_FormWithoutAFile_CountsAsARejectedBatchWithOneProblem()
    {
        using var metrics = new MetricRecorder(Factory.Services);
        using var form = new MultipartFormDataContent { { new StringContent("not a file"), "comment" } };
        await AssertRejectedAsync(await Client.PostAsync("/api/measurements/csv", form));

        Assert.Equal(1, metrics.Sum(Batches, "finwatch.ingest.source=api-csv", "finwatch.ingest.result=rejected"));
        Assert.Equal(1, metrics.Sum(RowErrors, "finwatch.ingest.source=api-csv"));
        Assert.Empty(metrics.Values(Duration)); // no row was read: the duration times batches that were
    }

    [Fact]
    public void BatchWithoutAnAnswer_CountsAsFailed()
    {
        using var metrics = new MetricRecorder(Factory.Services);
        // What an exception or a dropped request leaves: the batch's measurement ends without Stored or Rejected.
        using (Factory.Services.GetRequiredService<Telemetry>().StartBatch("inbox"))
        {
        }

        Assert.Equal(["finwatch.ingest.result=failed,finwatch.ingest.source=inbox"], metrics.TagSets(Batches));
        Assert.Single(metrics.Values(Duration, "finwatch.ingest.result=failed"));
        Assert.Empty(metrics.Values(Rows));
    }

    [Fact]
    public async Task AlertsRaised_CountOncePerAlertWithTheirSeverity_LaterPointsOnThemDoNot()
    {
        // As MonitorEndpointsTests: the same signal ranks critical under a 5 mV concern and medium under 1000 mV.
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP-TIGHT", concernMv: 5);
        await ApprovedContextAsync(Client, "TRI-TOP-LOOSE", concernMv: 1000);
        using var metrics = new MetricRecorder(Factory.Services);

        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5));
        Assert.Equal(2, metrics.Sum(Points)); // one wafer, two contexts
        Assert.Equal(
            ["finwatch.alert.rule=WE1,finwatch.alert.severity=critical", "finwatch.alert.rule=WE1,finwatch.alert.severity=medium"],
            metrics.TagSets(Raised));
        Assert.Equal(1, metrics.Sum(Raised, "finwatch.alert.severity=critical"));
        Assert.Equal(1, metrics.Sum(Raised, "finwatch.alert.severity=medium"));

        // 1.5 then 1.6 nm: WE2 fires too, but each chart's excursion is already open, so it joins it: nothing is raised.
        await IngestAsync(Client, Wafers("M0002", MonitorDay.AddHours(2), 1.6));
        Assert.Equal(4, metrics.Sum(Points));
        Assert.Equal(
            ["finwatch.alert.rule=WE1,finwatch.alert.severity=critical", "finwatch.alert.rule=WE1,finwatch.alert.severity=medium"],
            metrics.TagSets(Raised));
        Assert.Equal(2, metrics.Sum(Raised));
        Assert.Equal(2, metrics.Values("finwatch.monitor.evaluation.duration", "finwatch.monitor.result=evaluated").Length); // one per ingest
    }

    [Fact]
    public async Task Escalation_CountsTheAlertsEscalated()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5));
        using var metrics = new MetricRecorder(Factory.Services);

        const string Escalated = "finwatch.monitor.alerts.escalated";
        var worker = Factory.Services.GetRequiredService<MonitorWorker>();
        Factory.Clock.Advance(TimeSpan.FromMinutes(31)); // the default escalation is after 30 minutes; the worker's timer fires too
        await worker.EscalateAsync(CancellationToken.None);
        Assert.True(await MetricRecorder.EventuallyAsync(() => metrics.Sum(Escalated) == 1), $"escalated: {metrics.Sum(Escalated)}");
        Assert.Equal(0, await worker.EscalateAsync(CancellationToken.None)); // once only
        Assert.Equal(1, metrics.Sum(Escalated));
        Assert.Empty(metrics.Values(Raised));
    }

    [Fact]
    public async Task ConnectedScreen_MovesTheGauge_AndAPushCountsOneFramePerGroup()
    {
        // A context without history: creating it pushes nothing, so every frame heard below is the ingest's.
        await CreateContextAsync(Client, "TRI-TOP");
        using var metrics = new MetricRecorder(Factory.Services);
        const string Screens = "finwatch.monitor.screens";
        const string Frames = "finwatch.monitor.push.frames";

        var received = Channel.CreateUnbounded<FeedMessage>();
        await using (var connection = MonitorHubTests.Connect(Factory, received))
        {
            await connection.StartAsync();
            Assert.True(await MetricRecorder.EventuallyAsync(() => metrics.Sum(Screens) == 1), $"connected screens: {metrics.Sum(Screens)}");
            await connection.InvokeAsync<long>("Watch", new[] { "TRI-TOP" });

            await IngestAsync(Client, Wafers("M0001", MonitorDay, 0.0));
            using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
            Assert.Equal("point", (await received.Reader.ReadAsync(timeout.Token)).Kind);
            Assert.True(await MetricRecorder.EventuallyAsync(() => metrics.Values(Frames).Length == 2), $"frames: {metrics.Values(Frames).Length}");
            Assert.Equal(
                ["finwatch.push.group=all,finwatch.push.result=sent", "finwatch.push.group=context,finwatch.push.result=sent"],
                metrics.TagSets(Frames));
            Assert.Equal(2, metrics.Sum(Frames));
        }

        Assert.True(await MetricRecorder.EventuallyAsync(() => metrics.Sum(Screens) == 0), $"connected screens after closing: {metrics.Sum(Screens)}");
    }
}

/// <summary>A batch from the inbox folder counts under its own source.</summary>
public class TelemetryInboxTests : IntegrationTest
{
    public TelemetryInboxTests()
    {
        Factory.With("FinWatch:Ingest:InboxEnabled", "true");
    }

    [Fact]
    public async Task InboxFile_Stored_CountsUnderTheInboxSource()
    {
        using var metrics = new MetricRecorder(Factory.Services);
        var csv = SiteRow.Csv(SiteRow.Wafers("IN1", 2, 3, new DateTimeOffset(2026, 11, 21, 0, 0, 0, TimeSpan.Zero))); // 6 rows
        var temp = Path.Combine(Factory.InboxPath, ".lot-IN1.csv");
        await File.WriteAllTextAsync(temp, csv);
        File.Move(temp, Path.Combine(Factory.InboxPath, "lot-IN1.csv"));

        Assert.True(await MetricRecorder.EventuallyAsync(() => metrics.Sum("finwatch.ingest.batches") == 1));
        Assert.Equal(["finwatch.ingest.result=stored,finwatch.ingest.source=inbox"], metrics.TagSets("finwatch.ingest.batches"));
        Assert.Equal(6, metrics.Sum("finwatch.ingest.rows", "finwatch.ingest.source=inbox", "finwatch.ingest.result=inserted"));
    }
}
