using System.Net;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Measurements;

public class IngestJsonTests : IntegrationTest
{
    [Fact]
    public async Task PostJson_ValidBatch_StoresRowsAndDerivesGeometry()
    {
        var rows = SiteRow.Wafers("J100", 2, 4, new DateTimeOffset(2026, 11, 25, 0, 0, 0, TimeSpan.Zero));
        var response = await PostJsonAsync(SiteRow.Json(rows));
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(8, body.GetProperty("inserted").GetInt32());
        var stored = await Factory.QueryAsync(db => db.Measurements.FirstAsync());
        Assert.NotNull(stored.TaperDeg);
    }

    [Fact]
    public async Task PostJson_DoubleGateProduct_UsesSidewallOnlyPerimeter()
    {
        await PostJsonAsync(SiteRow.Json([new SiteRow { Product = TestProducts.TriGate, LotId = "A" }, new SiteRow { Product = TestProducts.DoubleGate, LotId = "B" }]));
        var stored = await Factory.QueryAsync(db => db.Measurements.OrderBy(m => m.LotId).ToListAsync());
        // Same profile; the hard-mask product gates only the sidewalls (docs/model.md §A.7), so its gated perimeter is shorter.
        Assert.True(stored[1].GatedPerimeterNm < stored[0].GatedPerimeterNm);
        Assert.Equal(stored[0].AreaNm2, stored[1].AreaNm2);
    }

    [Fact]
    public async Task PostJson_SameBatchTwice_ReportsAlreadyPresent()
    {
        var json = SiteRow.Json(SiteRow.Wafers("J200", 1, 3, new DateTimeOffset(2026, 11, 25, 0, 0, 0, TimeSpan.Zero)));
        await PostJsonAsync(json);
        var body = await ReadJsonAsync(await PostJsonAsync(json));
        Assert.Equal(3, body.GetProperty("already_present").GetInt32());
        Assert.Equal(3, (await Factory.CountsAsync()).Measurements);
    }

    public static TheoryData<string, string, int, string?> Corpus => new()
    {
        { "not an array", "{\"lot_id\":\"X\"}", 1, null },
        { "truncated", SiteRow.Json([new SiteRow()])[..40], 1, null },
        { "empty array", "[]", 1, null },
        { "element not an object", "[1]", 1, null },
        { "unknown field", SiteRow.Json([new SiteRow()]).Replace("\"operator\"", "\"colour\"", StringComparison.Ordinal), 1, "colour" },
        { "missing required field", SiteRow.Json([new SiteRow()]).Replace("\"measured_at\"", "\"measured\"", StringComparison.Ordinal), 1, "measured_at" },
        { "text in a number", SiteRow.Json([new SiteRow(), new SiteRow { SiteId = "S2", TopWidthNm = "six" }]), 2, "top_width_nm" },
        { "boolean value", "[" + SiteRow.Json([new SiteRow()])[1..^2] + ",\"liner_thickness_nm\":true}]", 1, "liner_thickness_nm" },
        { "out of range", SiteRow.Json([new SiteRow { CornerRadiusNm = "77" }]), 1, "corner_radius_nm" },
        { "invalid UTF-8", "[{\"lot_id\":\"\u00ff\u00fe\"}]", 1, "lot_id" },
    };

    [Theory]
    [MemberData(nameof(Corpus))]
    public async Task PostJson_BadBatch_Returns400WithRowAndColumnAndStoresNothing(string name, string json, int row, string? column)
    {
        HttpResponseMessage response;
        if (name == "invalid UTF-8")
        {
            // Latin-1 bytes 0xFF 0xFE inside a JSON string are not UTF-8.
            var bytes = System.Text.Encoding.Latin1.GetBytes(json);
            using var content = new ByteArrayContent(bytes);
            content.Headers.ContentType = new System.Net.Http.Headers.MediaTypeHeaderValue("application/json");
            response = await Client.PostAsync("/api/measurements", content);
        }
        else
        {
            response = await PostJsonAsync(json);
        }

        var errors = await AssertRejectedAsync(response);
        Assert.True(HasError(errors, row, column), $"{name}: expected row {row}, column {column ?? "(row)"}; got\n{Describe(errors)}");
        await AssertNothingStoredAsync();
    }
}
