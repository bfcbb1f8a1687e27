using System.Net;
using System.Net.Http.Headers;
using System.Text;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Measurements;

public class IngestCsvTests : IntegrationTest
{
    private static readonly DateTimeOffset Start = new(2026, 11, 20, 8, 0, 0, TimeSpan.Zero);

    [Fact]
    public async Task PostCsv_ValidFile_StoresEveryRowWithDerivedGeometry()
    {
        var csv = SiteRow.Csv(SiteRow.Wafers("L100", wafers: 3, sites: 5, Start));
        var response = await PostCsvAsync(csv);
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(15, body.GetProperty("rows").GetInt32());
        Assert.Equal(15, body.GetProperty("inserted").GetInt32());
        Assert.Equal(0, body.GetProperty("already_present").GetInt32());

        var site = await Factory.QueryAsync(db => db.Measurements.SingleAsync(m => m.WaferSlot == 2 && m.SiteId == "S03"));
        Assert.Equal(6.03, site.TopWidthNm!.Value, 12);
        // Taper by docs/model.md §A.1: atan((Wb − Wt)/(2H)) = atan((10 − 6.03)/84), evaluated independently here.
        Assert.Equal(Math.Atan((10 - 6.03) / 84) * 180 / Math.PI, site.TaperDeg!.Value, 9);
        // Mid-height width (A.3): (Wt + Wb)/2.
        Assert.Equal((6.03 + 10) / 2, site.MidWidthNm!.Value, 12);
        Assert.NotNull(site.AreaNm2);
        Assert.NotNull(site.GatedPerimeterNm);
        Assert.Equal(0, site.Flags);
    }

    [Fact]
    public async Task PostCsv_BomCrlfAndQuotedFields_AreRead()
    {
        var rows = new[]
        {
            new SiteRow { LotId = "L\"Q\",1", Operator = "OP, night shift" },
            new SiteRow { LotId = "L2", SiteId = "S02" },
        };
        var csv = SiteRow.Csv(rows, "\r\n");
        var bytes = Encoding.UTF8.GetPreamble().Concat(Encoding.UTF8.GetBytes(csv)).ToArray();
        var response = await PostCsvAsync(bytes);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var stored = await Factory.QueryAsync(db => db.Measurements.OrderBy(m => m.SiteId).Select(m => new { m.LotId, m.Operator }).ToListAsync());
        Assert.Equal("L\"Q\",1", stored[0].LotId);
        Assert.Equal("OP, night shift", stored[0].Operator);
    }

    [Fact]
    public async Task PostCsv_MultipartFormFile_IsIngested()
    {
        var csv = SiteRow.Csv(SiteRow.Wafers("L300", 1, 4, Start));
        using var form = new MultipartFormDataContent();
        var file = new ByteArrayContent(Encoding.UTF8.GetBytes(csv));
        file.Headers.ContentType = new MediaTypeHeaderValue("text/csv");
        form.Add(file, "file", "lot-L300.csv");
        var response = await Client.PostAsync("/api/measurements/csv", form);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var batch = await Factory.QueryAsync(db => db.IngestBatches.SingleAsync());
        Assert.Equal("lot-L300.csv", batch.Label);
        Assert.Equal(4, batch.Inserted);
    }

    [Fact]
    public async Task PostCsv_SameBatchTwice_ReportsAlreadyPresentAndStoresNoDuplicate()
    {
        var csv = SiteRow.Csv(SiteRow.Wafers("L400", 2, 3, Start));
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(csv)).StatusCode);
        var second = await PostCsvAsync(csv);
        var body = await ReadJsonAsync(second);
        Assert.Equal(HttpStatusCode.OK, second.StatusCode);
        Assert.Equal(0, body.GetProperty("inserted").GetInt32());
        Assert.Equal(6, body.GetProperty("already_present").GetInt32());
        Assert.Equal([2, 3, 4, 5, 6, 7], body.GetProperty("already_present_rows").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal(6, (await Factory.CountsAsync()).Measurements);
    }

    [Fact]
    public async Task PostCsv_OverlappingBatch_StoresOnlyTheNewRows()
    {
        var rows = SiteRow.Wafers("L500", 2, 3, Start).ToList();
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(SiteRow.Csv(rows.Take(3)))).StatusCode);
        var body = await ReadJsonAsync(await PostCsvAsync(SiteRow.Csv(rows)));
        Assert.Equal(3, body.GetProperty("inserted").GetInt32());
        Assert.Equal(3, body.GetProperty("already_present").GetInt32());
        Assert.Equal(6, (await Factory.CountsAsync()).Measurements);
    }

    [Fact]
    public async Task PostCsv_OnlySomeValueColumns_StoresWhatWasMeasured()
    {
        var csv = "lot_id,wafer_slot,site_id,site_x_mm,site_y_mm,product,step,measured_at,top_width_nm,bottom_width_nm\n"
            + "L600,1,S01,0,0,TP-TRI,POST-ETCH-CD,2026-11-20T10:00:00Z,6.1,9.9\n"
            + "L600,1,S02,50,0,TP-TRI,POST-ETCH-CD,2026-11-20T10:00:05Z,6.2,\n";
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(csv)).StatusCode);
        var stored = await Factory.QueryAsync(db => db.Measurements.OrderBy(m => m.SiteId).ToListAsync());
        Assert.Null(stored[0].FinHeightNm);
        Assert.Null(stored[0].TaperDeg); // taper needs the height
        Assert.Equal(8.0, stored[0].MidWidthNm!.Value, 12);
        Assert.Null(stored[1].BottomWidthNm);
        Assert.Null(stored[1].MidWidthNm);
    }

    [Fact]
    public async Task PostCsv_ReEntrantAndOversizedRadius_AreStoredWithFlags()
    {
        var rows = new[]
        {
            new SiteRow { SiteId = "S01", TopWidthNm = "10", BottomWidthNm = "8" },
            new SiteRow { SiteId = "S02", TopWidthNm = "6", BottomWidthNm = "10", CornerRadiusNm = "4.5" },
        };
        var body = await ReadJsonAsync(await PostCsvAsync(SiteRow.Csv(rows)));
        Assert.Equal(1, body.GetProperty("re_entrant_profiles").GetInt32());
        Assert.Equal(1, body.GetProperty("radius_exceeds_max").GetInt32());
        var stored = await Factory.QueryAsync(db => db.Measurements.OrderBy(m => m.SiteId).ToListAsync());
        Assert.Equal(1, stored[0].Flags);
        Assert.True(stored[0].TaperDeg < 0);
        Assert.Equal(2, stored[1].Flags);
    }

    [Fact]
    public async Task PostCsv_TimeWithOffset_IsStoredAsUtc()
    {
        var csv = SiteRow.Csv([new SiteRow { MeasuredAt = "2026-11-20T11:00:00+01:00" }]);
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(csv)).StatusCode);
        var stored = await Factory.QueryAsync(db => db.Measurements.SingleAsync());
        Assert.Equal(new DateTimeOffset(2026, 11, 20, 10, 0, 0, TimeSpan.Zero).ToUnixTimeMilliseconds(), stored.MeasuredAtMs);
    }

    [Fact]
    public async Task PostCsv_LotUnderAnotherProduct_IsRejected()
    {
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(SiteRow.Csv([new SiteRow { LotId = "L700" }]))).StatusCode);
        var response = await PostCsvAsync(SiteRow.Csv([new SiteRow { LotId = "L700", SiteId = "S09", Product = TestProducts.DoubleGate }]));
        var errors = await AssertRejectedAsync(response);
        Assert.True(HasError(errors, 2, "product"), Describe(errors));
    }

    [Fact]
    public async Task PostCsv_StreamedBodyOf50000Rows_IsAccepted()
    {
        // The body is produced while it is sent (chunked, no Content-Length), as a large upload from a tool would be.
        var rows = Enumerable.Range(0, 50_000).Select(i => new SiteRow
        {
            LotId = $"B{i / 250:0000}",
            WaferSlot = (1 + (i / 10 % 25)).ToString(System.Globalization.CultureInfo.InvariantCulture),
            SiteId = $"S{i % 10:00}",
            MeasuredAt = Start.AddSeconds(i).ToString("yyyy-MM-ddTHH:mm:ssZ", System.Globalization.CultureInfo.InvariantCulture),
        });
        using var content = new PushStreamContentOfCsv(rows);
        var response = await Client.PostAsync("/api/measurements/csv", content);
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(50_000, body.GetProperty("inserted").GetInt32());
        Assert.Equal(200, await Factory.QueryAsync(db => db.LotSteps.CountAsync()));
    }

    [Fact]
    public async Task PostCsv_NegativeZeroRadiusAndLiner_IsStoredAsZero()
    {
        // Found by IngestFuzzTests: "-0" is within 0 ≤ r ≤ 50 (README), but the geometry refused it as negative: a 500.
        var csv = SiteRow.Csv([new SiteRow { LotId = "Z0001", CornerRadiusNm = "-0", LinerThicknessNm = "-0.0" }]);
        var response = await PostCsvAsync(csv);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var stored = await Factory.QueryAsync(db => db.Measurements.SingleAsync());
        Assert.Equal(0.0, stored.CornerRadiusNm);
        Assert.False(double.IsNegative(stored.CornerRadiusNm!.Value));
        Assert.Equal(0.0, stored.LinerThicknessNm);
        Assert.NotNull(stored.AreaNm2); // the geometry was derived with r = 0
    }

    // Found by IngestFuzzTests: a form cut before the file part's closing boundary, or with a part header longer than
    // the multipart reader's line limit, answered 500. The upload is the sender's problem: a 400 problem, nothing stored.
    [Theory]
    [InlineData("cut short", "the multipart form ends before the file part's closing boundary")]
    [InlineData("huge part header", "the multipart form is broken")]
    public async Task PostCsv_BrokenMultipartForm_IsRejectedAndStoresNothing(string broken, string reason)
    {
        var csv = SiteRow.Csv(SiteRow.Wafers("M0001", 1, 3, Start));
        var body = broken == "cut short"
            ? "--b0\r\nContent-Disposition: form-data; name=\"file\"; filename=\"lots.csv\"\r\n\r\n" + csv
            : "--b0\r\nContent-Disposition: form-data; name=\"file\"; filename=\"lots.csv\"\r\nX-Note: " + new string('h', 20_000) + "\r\n\r\n" + csv + "\r\n--b0--\r\n";
        using var content = new StringContent(body, Encoding.UTF8);
        content.Headers.ContentType = MediaTypeHeaderValue.Parse("multipart/form-data; boundary=b0");
        var response = await Client.PostAsync("/api/measurements/csv", content);
        var errors = await AssertRejectedAsync(response);
        Assert.Contains(reason, errors[0].GetProperty("reason").GetString(), StringComparison.Ordinal);
        await AssertNothingStoredAsync();
    }

    [Theory]
    [InlineData("\r")]
    [InlineData("\r\n")]
    public async Task PostCsv_BodyEndingInCarriageReturn_IsAccepted(string newline)
    {
        // The reader takes CR, LF and CRLF line ends (CsvRecordReader). A body whose last character was a CR answered 500:
        // looking for an LF after it, the reader read the request body synchronously, which ASP.NET Core refuses.
        var csv = SiteRow.Csv(SiteRow.Wafers("E0001", 2, 3, Start), newline).TrimEnd('\n');
        var response = await PostCsvAsync(csv);
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(6, body.GetProperty("inserted").GetInt32());
    }

    private sealed class PushStreamContentOfCsv(IEnumerable<SiteRow> rows) : HttpContent
    {
        protected override async Task SerializeToStreamAsync(Stream stream, System.Net.TransportContext? context)
        {
            await using var writer = new StreamWriter(stream, new UTF8Encoding(false), 1 << 14, leaveOpen: true);
            await writer.WriteAsync(string.Join(',', SiteRow.Columns) + "\n");
            foreach (var row in rows)
            {
                await writer.WriteAsync(string.Join(',', row.Values()) + "\n");
            }
        }

        protected override bool TryComputeLength(out long length)
        {
            length = 0;
            return false;
        }
    }
}
