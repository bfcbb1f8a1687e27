using System.Net;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Series;

public class SeriesEndpointsTests : IntegrationTest
{
    private static readonly DateTimeOffset Day1 = new(2026, 11, 10, 8, 0, 0, TimeSpan.Zero);

    private async Task SeedAsync()
    {
        // Lot SA in chamber ETA-1, lot SB in ETB-2; top widths 6.01 … 6.04 across the four sites of each wafer.
        var rows = SiteRow.Wafers("SA", 2, 4, Day1)
            .Concat(SiteRow.Wafers("SB", 1, 4, Day1.AddHours(5)).Select(r => r with { EtchChamber = "ETB-2" }));
        (await PostCsvAsync(SiteRow.Csv(rows))).EnsureSuccessStatusCode();
    }

    [Fact]
    public async Task GetSeries_SiteLevel_ReturnsEveryValueInTimeOrder()
    {
        await SeedAsync();
        var s = await ReadJsonAsync(await Client.GetAsync("/api/series?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm"));
        Assert.Equal("nm", s.GetProperty("unit").GetString());
        Assert.Equal(12, s.GetProperty("count").GetInt32());
        var points = s.GetProperty("points").EnumerateArray().ToList();
        var times = points.Select(p => p.GetProperty("measured_at").GetString()).ToList();
        Assert.Equal(times.Order(StringComparer.Ordinal), times);
        Assert.Equal(6.01, points[0].GetProperty("value").GetDouble(), 12);
    }

    [Fact]
    public async Task GetSeries_WaferLevel_ReturnsMeansAndSampleSd()
    {
        await SeedAsync();
        var s = await ReadJsonAsync(await Client.GetAsync("/api/series?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm&level=wafer"));
        var points = s.GetProperty("points").EnumerateArray().ToList();
        Assert.Equal(3, points.Count);
        var w = points[0];
        Assert.Equal(4, w.GetProperty("n").GetInt32());
        // Mean of 6.01, 6.02, 6.03, 6.04 is 6.025; sample sd (n − 1) is 0.01·sqrt(5/3) ≈ 0.0129099 (elementary arithmetic).
        Assert.Equal(6.025, w.GetProperty("value").GetDouble(), 12);
        Assert.Equal(0.01 * Math.Sqrt(5.0 / 3.0), w.GetProperty("sd").GetDouble(), 12);
    }

    [Fact]
    public async Task GetSeries_ChamberFilterAndDerivedParameter()
    {
        await SeedAsync();
        var s = await ReadJsonAsync(await Client.GetAsync("/api/series?product=TP-TRI&step=FIN-PROFILE&parameter=taper_deg&chamber=ETB-2"));
        Assert.Equal(4, s.GetProperty("count").GetInt32());
        Assert.All(s.GetProperty("points").EnumerateArray(), p => Assert.Equal("ETB-2", p.GetProperty("etch_chamber").GetString()));
        Assert.Equal("°", s.GetProperty("unit").GetString());
    }

    [Fact]
    public async Task GetSeries_Limit_TruncatesAndSaysSo()
    {
        await SeedAsync();
        var s = await ReadJsonAsync(await Client.GetAsync("/api/series?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm&limit=5"));
        Assert.Equal(5, s.GetProperty("count").GetInt32());
        Assert.True(s.GetProperty("truncated").GetBoolean());
    }

    [Theory]
    [InlineData("?step=FIN-PROFILE&parameter=taper_deg", "product")]
    [InlineData("?product=TP-TRI&step=FIN-PROFILE&parameter=colour", "parameter")]
    [InlineData("?product=NOPE&step=FIN-PROFILE&parameter=taper_deg", "product")]
    [InlineData("?product=TP-TRI&step=FIN-PROFILE&parameter=taper_deg&level=lot", "level")]
    public async Task GetSeries_BadQuery_Returns400NamingTheField(string query, string field)
    {
        var response = await Client.GetAsync("/api/series" + query);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = await ReadJsonAsync(response);
        Assert.True(problem.GetProperty("errors").TryGetProperty(field, out _));
    }
}
