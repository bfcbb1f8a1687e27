using System.Net;
using System.Net.Http.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Measurements;

/// <summary>What the data-entry page offers: the tools and chambers seen in stored rows, and ingest's own ranges.</summary>
public class EntryAidEndpointsTests : IntegrationTest
{
    [Fact]
    public async Task KnownValues_ListsToolsWithTheirChambers_PerProductAndStep()
    {
        var row = new SiteRow { MeasuredAt = "2026-11-20T10:00:00Z" };
        var csv = SiteRow.Csv([
            row,
            row with { SiteId = "S02", EtchChamber = "ETA-2", MetrologyTool = "OCD-2" },
            row with { SiteId = "S03", EtchTool = "ETB", EtchChamber = "ETB-1" },
            row with { SiteId = "S04", Step = "POST-ETCH-CD", EtchTool = "ETC", EtchChamber = "ETC-1", MetrologyTool = "CDS-1" },
            row with { LotId = "T0002", Product = TestProducts.DoubleGate, EtchTool = "ETD", EtchChamber = "ETD-1" },
            // Measured 101 days before the test clock (2026-12-01): outside the 90-day window, so not offered.
            row with { LotId = "T0003", EtchTool = "ETOLD", EtchChamber = "ETOLD-1", MeasuredAt = "2026-08-22T08:00:00Z" },
        ]);
        Assert.Equal(HttpStatusCode.OK, (await PostCsvAsync(csv)).StatusCode);
        await Client.PutAsJsonAsync($"/api/products/{TestProducts.TriGate}/site-plans",
            new { step = "PLANNED-ONLY", sites = new[] { new { site_id = "S01", site_x_mm = 0.0, site_y_mm = 0.0 } } });

        var k = await ReadJsonAsync(await Client.GetAsync($"/api/measurements/known-values?product={TestProducts.TriGate}&step=FIN-PROFILE"));
        Assert.Equal(["ETA", "ETB"], k.GetProperty("etch_tools").EnumerateArray().Select(t => t.GetProperty("tool").GetString()));
        Assert.Equal(["ETA-1", "ETA-2"], k.GetProperty("etch_tools")[0].GetProperty("chambers").EnumerateArray().Select(c => c.GetString()));
        Assert.Equal(["LNA"], k.GetProperty("liner_tools").EnumerateArray().Select(t => t.GetProperty("tool").GetString()));
        Assert.Equal(["OCD-1", "OCD-2"], k.GetProperty("metrology_tools").EnumerateArray().Select(c => c.GetString()));
        // Steps: the product's measured steps and the steps it has a plan for.
        Assert.Equal(["FIN-PROFILE", "PLANNED-ONLY", "POST-ETCH-CD"], k.GetProperty("steps").EnumerateArray().Select(c => c.GetString()));

        var everything = await ReadJsonAsync(await Client.GetAsync("/api/measurements/known-values"));
        Assert.Equal(["ETA", "ETB", "ETC", "ETD"], everything.GetProperty("etch_tools").EnumerateArray().Select(t => t.GetProperty("tool").GetString()));
    }

    [Fact]
    public async Task KnownValues_UnknownProduct_Returns400NamingIt()
    {
        var response = await Client.GetAsync("/api/measurements/known-values?product=NOPE");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = await ReadJsonAsync(response);
        Assert.Contains("NOPE", problem.GetProperty("errors").GetProperty("product")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Ranges_AreTheOnesIngestRefusesBy()
    {
        var r = await ReadJsonAsync(await Client.GetAsync("/api/measurements/ranges"));
        var top = r.GetProperty("values").EnumerateArray().Single(v => v.GetProperty("field").GetString() == "top_width_nm");
        Assert.Equal(100, top.GetProperty("high").GetDouble());
        Assert.False(top.GetProperty("low_inclusive").GetBoolean());
        Assert.Equal("nm", top.GetProperty("unit").GetString());
        Assert.Equal(150, r.GetProperty("wafer_radius_mm").GetDouble());
        Assert.Equal(25, r.GetProperty("max_wafer_slot").GetInt32());

        // The published upper bound is the one ingest applies: at it stored, just above it refused.
        var atHigh = await PostCsvAsync(SiteRow.Csv([new SiteRow { TopWidthNm = "100", BottomWidthNm = "100" }]));
        Assert.Equal(HttpStatusCode.OK, atHigh.StatusCode);
        var above = await AssertRejectedAsync(await PostCsvAsync(SiteRow.Csv([new SiteRow { LotId = "T0009", TopWidthNm = "100.01" }])));
        Assert.True(HasError(above, 2, "top_width_nm"), Describe(above));
    }
}
