using System.Net;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Spc;

public class StoredSeriesEndpointsTests : IntegrationTest
{
    private async Task SeedAsync()
    {
        var rows = Enumerable.Range(0, 12).SelectMany(l =>
            SiteRow.Wafers($"C{l:00}", 2, 5, new DateTimeOffset(2026, 11, 1, 0, 0, 0, TimeSpan.Zero).AddHours(l)));
        (await PostCsvAsync(SiteRow.Csv(rows))).EnsureSuccessStatusCode();
    }

    [Fact]
    public async Task Chart_XbarR_TakesTheSitesOfEachWaferAsASubgroup()
    {
        await SeedAsync();
        var response = await Client.GetAsync("/api/series/chart?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm&chart=Xbar-R&rules=WE1,WE2");
        var r = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(24, r.GetProperty("points").GetArrayLength());
        Assert.Equal(5, r.GetProperty("points")[0].GetProperty("n").GetInt32());
        var chart = r.GetProperty("analysis").GetProperty("chart");
        // Every wafer has sites 6.01 … 6.05: each mean is 6.03 and each range 0.04.
        Assert.Equal(6.03, chart.GetProperty("center").GetDouble(), 10);
        Assert.Equal(0.04, chart.GetProperty("secondary").GetProperty("center").GetDouble(), 10);
        Assert.True(r.GetProperty("analysis").GetProperty("rules").GetProperty("flags").TryGetProperty("we2", out _));
    }

    [Fact]
    public async Task Chart_WaferLevelIndividuals_ChartsWaferMeans()
    {
        await SeedAsync();
        var r = await ReadJsonAsync(await Client.GetAsync("/api/series/chart?product=TP-TRI&step=FIN-PROFILE&parameter=taper_deg&level=wafer"));
        Assert.Equal("I-MR", r.GetProperty("analysis").GetProperty("chart").GetProperty("type").GetString());
        Assert.Equal(24, r.GetProperty("analysis").GetProperty("chart").GetProperty("primary").GetProperty("values").GetArrayLength());
    }

    [Fact]
    public async Task Capability_UsesTheProductSpecification()
    {
        await SeedAsync();
        // The test product's taper spec is upper 4.0° only (TestProducts): Cp is undefined, Cpk = Cpu.
        var r = await ReadJsonAsync(await Client.GetAsync("/api/series/capability?product=TP-TRI&step=FIN-PROFILE&parameter=taper_deg"));
        var cap = r.GetProperty("analysis").GetProperty("capability");
        Assert.Equal(System.Text.Json.JsonValueKind.Null, cap.GetProperty("cp").ValueKind);
        Assert.Equal(cap.GetProperty("cpu").GetDouble(), cap.GetProperty("cpk").GetDouble(), 12);
        Assert.Equal(120, cap.GetProperty("n").GetInt32());
    }

    [Fact]
    public async Task Chart_UnknownParameter_Returns400()
    {
        var response = await Client.GetAsync("/api/series/chart?product=TP-TRI&step=FIN-PROFILE&parameter=colour");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Theory]
    [InlineData("&ewma_lambda=2&ewma_l=3", "ewma_lambda")]
    [InlineData("&sigma_multiplier=0", "sigma_multiplier")]
    [InlineData("&baseline_count=100000", "baseline_count")]
    public async Task Chart_BadAnalysisSetting_Returns400NamingTheQueryParameter(string setting, string field)
    {
        await SeedAsync();
        var response = await Client.GetAsync("/api/series/chart?product=TP-TRI&step=FIN-PROFILE&parameter=taper_deg" + setting);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var keys = (await ReadJsonAsync(response)).GetProperty("errors").EnumerateObject().Select(p => p.Name).ToList();
        Assert.Equal([field], keys);
    }

    [Fact]
    public async Task ThreeWay_GivesOnePointPerLotAndPerWafer()
    {
        await SeedAsync();
        var response = await Client.GetAsync("/api/series/three-way?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm");
        var r = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(12, r.GetProperty("lots").GetArrayLength());
        Assert.Equal(12, r.GetProperty("between_lots").GetProperty("primary").GetProperty("values").GetArrayLength());
        Assert.Equal(24, r.GetProperty("within_wafer").GetProperty("values").GetArrayLength());
        // Every wafer has the same sites, so the wafer means within a lot do not differ: range 0.
        Assert.Equal(0, r.GetProperty("within_lot").GetProperty("values")[0].GetDouble(), 12);
    }
}
