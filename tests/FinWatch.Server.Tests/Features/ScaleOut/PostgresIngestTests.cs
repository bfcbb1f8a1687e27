using System.Net;
using FinWatch.Physics.Analytic;
using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Infrastructure.Csv;
using FinWatch.Server.Tests.Features.Model;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using Npgsql;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>The ingest and monitor paths on PostgreSQL: the same answers as on SQLite (IngestCsvTests, MonitorEndpointsTests).</summary>
public class PostgresIngestTests : PostgresIntegrationTest
{
    private static readonly DateTimeOffset Start = new(2026, 11, 20, 10, 0, 0, TimeSpan.Zero);

    [ScaleOutFact]
    public async Task PostCsv_ValidFile_StoresEveryRowTheSummariesAndTheDerivedGeometry()
    {
        var response = await PostCsvAsync(SiteRow.Csv(SiteRow.Wafers("L100", 2, 3, Start)));
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(6, body.GetProperty("inserted").GetInt32());
        Assert.Equal(0, body.GetProperty("already_present").GetInt32());
        var lotStep = await Factory.QueryAsync(db => db.LotSteps.SingleAsync());
        Assert.Equal((2, 6), (lotStep.WaferCount, lotStep.SiteCount));
        // The builder's chambers: ETA-1 (etch) and LNA-1 (liner), one row each for the lot and step.
        Assert.Equal(["ETA-1", "LNA-1"], await Factory.QueryAsync(db => db.LotChambers.OrderBy(c => c.Chamber).Select(c => c.Chamber).ToListAsync()));
        var site = await Factory.QueryAsync(db => db.Measurements.SingleAsync(m => m.WaferSlot == 2 && m.SiteId == "S03"));
        // Mid width is the mean of the top and bottom widths (docs/model.md §A): (6.03 + 10) / 2 nm, worked by hand.
        Assert.Equal(8.015, site.MidWidthNm!.Value, 1e-9);
        Assert.Equal(Start.AddMinutes(2).AddSeconds(3).ToUnixTimeMilliseconds(), site.MeasuredAtMs);
    }

    [ScaleOutFact]
    public async Task PostCsv_SameBatchTwice_ReportsAlreadyPresentAndStoresNoDuplicate()
    {
        var csv = SiteRow.Csv(SiteRow.Wafers("L400", 2, 3, Start));
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(csv)).StatusCode);
        var body = await ReadJsonAsync(await PostCsvAsync(csv));
        Assert.Equal(0, body.GetProperty("inserted").GetInt32());
        Assert.Equal(6, body.GetProperty("already_present").GetInt32());
        Assert.Equal([2, 3, 4, 5, 6, 7], body.GetProperty("already_present_rows").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal(6, (await Factory.CountsAsync()).Measurements);
    }

    [ScaleOutFact]
    public async Task PostCsv_SiteTwiceInOneCopyChunk_IsRejectedAndNothingIsStored()
    {
        var rows = SiteRow.Wafers("L200", 1, 3, Start).ToList();
        var errors = await AssertRejectedAsync(await PostCsvAsync(SiteRow.Csv([.. rows, rows[0]])));
        Assert.True(HasError(errors, 5, null), Describe(errors)); // header is row 1, the repeated site is the fifth line
        await AssertNothingStoredAsync();
    }

    [ScaleOutFact]
    public async Task PostCsv_SiteTwiceInDifferentCopyChunks_IsRejectedAndNothingIsStored()
    {
        // 25 lots of 25 wafers of 15 sites: 9,375 rows, more than one COPY chunk; the first site comes again as the last row.
        var rows = ManyRows("L3");
        Assert.True(rows.Count > PostgresSiteWriter.ChunkRows);
        var errors = await AssertRejectedAsync(await PostCsvAsync(SiteRow.Csv([.. rows, rows[0]])));
        Assert.True(HasError(errors, rows.Count + 2, null), Describe(errors));
        await AssertNothingStoredAsync();
    }

    [ScaleOutFact]
    public async Task PostCsv_MoreRowsThanOneChunk_StoresEveryRowAndTheOverlapIsAlreadyPresent()
    {
        var rows = ManyRows("L5");
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(SiteRow.Csv(rows.Take(100)))).StatusCode);
        var body = await ReadJsonAsync(await PostCsvAsync(SiteRow.Csv(rows)));
        Assert.Equal(rows.Count - 100, body.GetProperty("inserted").GetInt32());
        Assert.Equal(100, body.GetProperty("already_present").GetInt32());
        Assert.Equal(rows.Count, (await Factory.CountsAsync()).Measurements);
        Assert.Equal(rows.Count, await Factory.QueryAsync(db => db.LotSteps.SumAsync(l => l.SiteCount)));
    }

    private static List<SiteRow> ManyRows(string prefix) =>
        [.. Enumerable.Range(1, 25).SelectMany(lot => SiteRow.Wafers($"{prefix}{lot:00}", 25, 15, Start.AddHours(lot)))];

    [ScaleOutFact]
    public async Task AuditTrail_OnPostgres_RefusesUpdateAndDelete()
    {
        Assert.True(await Factory.QueryAsync(db => db.AuditEntries.CountAsync()) > 0, "creating the test products writes audit entries");
        var delete = await Assert.ThrowsAsync<PostgresException>(() => Factory.QueryAsync(db => db.Database.ExecuteSqlRawAsync("DELETE FROM audit_entries")));
        Assert.Contains("append-only", delete.MessageText, StringComparison.Ordinal);
        var update = await Assert.ThrowsAsync<PostgresException>(() => Factory.QueryAsync(db => db.Database.ExecuteSqlRawAsync("UPDATE audit_entries SET action = 'changed'")));
        Assert.Contains("append-only", update.MessageText, StringComparison.Ordinal);
    }

    [ScaleOutFact]
    public async Task PointBeyondTheLimit_OnPostgres_RaisesOneAlertWithTheHandComputedPoints()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP");
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0, 0, 1.5));
        // As on SQLite (MonitorEndpointsTests): 20 baseline points, then three; the third is 1.5 nm above the centre.
        var alert = Assert.Single((await ReadJsonAsync(await Client.GetAsync("/api/alerts?state=open"))).EnumerateArray());
        Assert.Equal("WE1", alert.GetProperty("rule").GetString());
        Assert.Equal(3, alert.GetProperty("wafer_slot").GetInt32());
        Assert.Equal(23, alert.GetProperty("last_point_seq").GetInt64());
        var points = await Factory.QueryAsync(db => db.ChartPoints.OrderBy(p => p.Seq).Select(p => p.Seq).ToListAsync());
        Assert.Equal(Enumerable.Range(1, 23).Select(i => (long)i), points);
    }

    // PostgreSQL enforces text lengths where SQLite does not: the model's code version (72 characters) once exceeded
    // model_parameter_sets.code_version (64) and every calibration failed on PostgreSQL only.
    [ScaleOutFact]
    public async Task Calibrate_OnPostgres_StoresTheParameterSetWithTheFullCodeVersion()
    {
        (await PostCsvAsync(CalibrationFixture.FinsCsv())).EnsureSuccessStatusCode();
        var response = await Client.PostAsync("/api/model/calibrations?reason=first%20e-test%20lots",
            new StringContent(CalibrationFixture.ElectricalCsv(CalibrationFixture.TruthTheta()), System.Text.Encoding.UTF8, "text/csv"));
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal(1, (await ReadJsonAsync(response)).GetProperty("version").GetInt32());
        var stored = await Factory.QueryAsync(db => db.ModelParameterSets.SingleAsync());
        Assert.Equal(ThresholdModel.CodeVersion, stored.CodeVersion);
    }

    // The file name becomes the batch label (260 characters): a longer one is cut there rather than refused by PostgreSQL.
    [ScaleOutFact]
    public async Task PostCsv_FileNameLongerThanTheLabel_IsIngestedWithTheNameCut()
    {
        using var form = new MultipartFormDataContent();
        var file = new ByteArrayContent(System.Text.Encoding.UTF8.GetBytes(SiteRow.Csv(SiteRow.Wafers("L600", 1, 2, Start))));
        file.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("text/csv");
        var name = new string('n', 300) + ".csv";
        form.Add(file, "file", name);
        Assert.Equal(HttpStatusCode.OK, (await Client.PostAsync("/api/measurements/csv", form)).StatusCode);
        Assert.Equal(name[..CsvUpload.MaxFileNameLength], await Factory.QueryAsync(db => db.IngestBatches.Select(b => b.Label).SingleAsync()));
    }
}
