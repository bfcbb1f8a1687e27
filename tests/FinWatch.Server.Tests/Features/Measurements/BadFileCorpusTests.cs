using System.Text;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Measurements;

/// <summary>
/// A corpus of bad files a metrology tool or a person can produce (docs/api.md, ingest checks). Each must get a 400 problem naming the right row and column,
/// and leave the database exactly as it was (no measurement, batch or lot summary written).
/// Row numbers count the header as row 1, as a spreadsheet shows them.
/// </summary>
public class BadFileCorpusTests : IntegrationTest
{
    private static readonly string Header = string.Join(',', SiteRow.Columns);

    private static string Csv(params SiteRow[] rows) => SiteRow.Csv(rows);

    public static TheoryData<string, string, int, string?> Corpus => new()
    {
        { "empty file", "", 1, null },
        { "header only", Header + "\n", 1, null },
        { "wrong delimiter", Csv(new SiteRow()).Replace(',', ';'), 1, Header.Replace(',', ';') },
        { "missing column", Csv(new SiteRow()).Replace("measured_at", "when", StringComparison.Ordinal), 1, "measured_at" },
        { "unknown column", Header + ",colour\n" + string.Join(',', new SiteRow().Values()) + ",red\n", 1, "colour" },
        { "text in a number", Csv(new SiteRow(), new SiteRow { SiteId = "S02", TopWidthNm = "six" }), 3, "top_width_nm" },
        { "decimal comma", Csv(new SiteRow { FinHeightNm = "\"42,5\"" }).Replace("\"\"\"42,5\"\"\"", "\"42,5\"", StringComparison.Ordinal), 2, "fin_height_nm" },
        { "NaN", Csv(new SiteRow { TopWidthNm = "NaN" }), 2, "top_width_nm" },
        { "Infinity", Csv(new SiteRow { FinHeightNm = "Infinity" }), 2, "fin_height_nm" },
        { "negative", Csv(new SiteRow { BottomWidthNm = "-3" }), 2, "bottom_width_nm" },
        { "width out of range", Csv(new SiteRow { TopWidthNm = "150" }), 2, "top_width_nm" },
        { "height out of range", Csv(new SiteRow { FinHeightNm = "301" }), 2, "fin_height_nm" },
        { "radius out of range", Csv(new SiteRow { CornerRadiusNm = "50.5" }), 2, "corner_radius_nm" },
        { "liner out of range", Csv(new SiteRow { LinerThicknessNm = "21" }), 2, "liner_thickness_nm" },
        { "zero width", Csv(new SiteRow { TopWidthNm = "0" }), 2, "top_width_nm" },
        { "wafer slot 0", Csv(new SiteRow { WaferSlot = "0" }), 2, "wafer_slot" },
        { "wafer slot 26", Csv(new SiteRow { WaferSlot = "26" }), 2, "wafer_slot" },
        { "wafer slot not whole", Csv(new SiteRow { WaferSlot = "2.5" }), 2, "wafer_slot" },
        { "site off the wafer", Csv(new SiteRow { SiteXMm = "120", SiteYMm = "120" }), 2, "site_x_mm" },
        { "unknown product", Csv(new SiteRow { Product = "NO-SUCH" }), 2, "product" },
        { "far-future time", Csv(new SiteRow { MeasuredAt = "2027-06-01T00:00:00Z" }), 2, "measured_at" },
        { "time without zone", Csv(new SiteRow { MeasuredAt = "2026-11-20T10:00:00" }), 2, "measured_at" },
        { "not a time", Csv(new SiteRow { MeasuredAt = "yesterday" }), 2, "measured_at" },
        { "impossible date", Csv(new SiteRow { MeasuredAt = "2026-02-30T10:00:00Z" }), 2, "measured_at" },
        { "hour 24", Csv(new SiteRow { MeasuredAt = "2026-11-20T24:00:00Z" }), 2, "measured_at" },
        { "empty lot id", Csv(new SiteRow { LotId = "" }), 2, "lot_id" },
        { "no value at all", Csv(new SiteRow { TopWidthNm = null, BottomWidthNm = null, FinHeightNm = null, CornerRadiusNm = null, LinerThicknessNm = null }), 2, null },
        { "duplicate rows inside one file", Csv(new SiteRow(), new SiteRow { SiteId = "S02" }, new SiteRow()), 4, null },
        { "truncated last line", Csv(new SiteRow(), new SiteRow { SiteId = "S02" }) + "T0001,1,S03,0,0,TP-TRI", 4, null },
        { "unclosed quote at end", Csv(new SiteRow()) + "\"T0002,1,S01", 3, null },
        { "quote inside a field", Csv(new SiteRow()) + "T0\"002,1,S01\n", 3, null },
    };

    [Theory]
    [MemberData(nameof(Corpus))]
    public async Task PostCsv_BadFile_Returns400WithRowAndColumnAndLeavesTheDatabaseUnchanged(string name, string csv, int row, string? column)
    {
        // A lot stored before: the rejected file must change nothing, not even the summaries of lots it shares.
        var earlier = SiteRow.Csv(SiteRow.Wafers("T0001", 1, 3, new DateTimeOffset(2026, 11, 19, 0, 0, 0, TimeSpan.Zero)));
        (await PostCsvAsync(earlier)).EnsureSuccessStatusCode();
        var before = await Factory.CountsAsync();
        var lotBefore = await Client.GetStringAsync("/api/lots/T0001");

        var errors = await AssertRejectedAsync(await PostCsvAsync(csv));
        Assert.True(HasError(errors, row, column), $"{name}: expected an error at row {row}, column {column ?? "(row)"}; got\n{Describe(errors)}");
        Assert.Equal(before, await Factory.CountsAsync());
        Assert.Equal(lotBefore, await Client.GetStringAsync("/api/lots/T0001"));
    }

    [Fact]
    public async Task PostCsv_WrongDelimiter_SaysWhichDelimiterItFound()
    {
        var errors = await AssertRejectedAsync(await PostCsvAsync(Csv(new SiteRow()).Replace(',', ';')));
        Assert.Contains("';'", errors[0].GetProperty("reason").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task PostCsv_InvalidUtf8InRow3_ReportsRow3()
    {
        var good = Encoding.UTF8.GetBytes(Csv(new SiteRow(), new SiteRow { SiteId = "S02" }));
        byte[] bad = [.. Encoding.ASCII.GetBytes("T0001,1,S"), 0xC3, 0x28, .. Encoding.ASCII.GetBytes("3,0,0,TP-TRI\n")];
        var errors = await AssertRejectedAsync(await PostCsvAsync([.. good, .. bad]));
        Assert.True(HasError(errors, 4, null), Describe(errors));
        Assert.Contains("UTF-8", errors[0].GetProperty("reason").GetString(), StringComparison.Ordinal);
        await AssertNothingStoredAsync();
    }

    [Fact]
    public async Task PostCsv_50MegabytesOfGarbage_Returns400AndStoresNothing()
    {
        var random = new Random(3);
        var garbage = new byte[50 * 1024 * 1024];
        random.NextBytes(garbage);
        var errors = await AssertRejectedAsync(await PostCsvAsync(garbage));
        Assert.Equal(1, errors[0].GetProperty("row").GetInt32());
        await AssertNothingStoredAsync();
    }

    [Fact]
    public async Task PostCsv_50MegabytesOfPrintableGarbageWithoutLineBreaks_Returns400()
    {
        var garbage = Encoding.ASCII.GetBytes(new string('x', 50 * 1024 * 1024));
        var errors = await AssertRejectedAsync(await PostCsvAsync(garbage));
        Assert.Contains("longer than", errors[0].GetProperty("reason").GetString(), StringComparison.Ordinal);
        await AssertNothingStoredAsync();
    }

    [Fact]
    public async Task PostCsv_ValidRowsBeforeABadOne_StoresNothing()
    {
        var rows = SiteRow.Wafers("L1", 4, 10, new DateTimeOffset(2026, 11, 1, 0, 0, 0, TimeSpan.Zero)).ToList();
        rows.Add(new SiteRow { LotId = "L1", SiteId = "X", TopWidthNm = "-1" });
        var errors = await AssertRejectedAsync(await PostCsvAsync(SiteRow.Csv(rows)));
        Assert.True(HasError(errors, 42, "top_width_nm"), Describe(errors));
        await AssertNothingStoredAsync();
    }

    [Fact]
    public async Task PostCsv_150BadRows_ListsTheFirst100AndCountsAll()
    {
        var rows = Enumerable.Range(0, 150).Select(i => new SiteRow { SiteId = $"S{i:000}", TopWidthNm = "wide" });
        var response = await PostCsvAsync(SiteRow.Csv(rows));
        var errors = await AssertRejectedAsync(response);
        var problem = await ReadJsonAsync(response);
        Assert.Equal(100, errors.Length);
        Assert.Equal(150, problem.GetProperty("error_count").GetInt32());
        Assert.Equal(150, problem.GetProperty("rows_read").GetInt32());
        await AssertNothingStoredAsync();
    }

    [Fact]
    public async Task PostCsv_ErrorEntry_CarriesRowColumnValueAndReason()
    {
        var errors = await AssertRejectedAsync(await PostCsvAsync(Csv(new SiteRow { LinerThicknessNm = "25" })));
        var e = Assert.Single(errors);
        Assert.Equal(2, e.GetProperty("row").GetInt32());
        Assert.Equal("liner_thickness_nm", e.GetProperty("column").GetString());
        Assert.Equal("25", e.GetProperty("value").GetString());
        Assert.Contains("20 nm", e.GetProperty("reason").GetString(), StringComparison.Ordinal);
    }
}
