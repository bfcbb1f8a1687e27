using System.Globalization;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Spc;

public class ForecastEndpointsTests : IntegrationTest
{
    private async Task SeedAsync(Func<int, double> topWidth)
    {
        var start = new DateTimeOffset(2026, 10, 1, 0, 0, 0, TimeSpan.Zero);
        var rows = Enumerable.Range(0, 20).SelectMany(l => SiteRow.Wafers($"F{l:00}", 1, 4, start.AddHours(6 * l))
            .Select(r => r with { TopWidthNm = (topWidth(l) + (0.01 * (r.SiteId[^1] - '0'))).ToString(CultureInfo.InvariantCulture) }));
        (await PostCsvAsync(SiteRow.Csv(rows))).EnsureSuccessStatusCode();
    }

    [Fact]
    public async Task Forecast_ThinningTopWidth_SeesTheTrendAndItsDirection()
    {
        // The top width loses 0.05 nm a lot, so the taper atan((Wb − Wt)/2H) grows lot by lot.
        await SeedAsync(l => 6.5 - (0.05 * l));
        var r = await ReadJsonAsync(await Client.GetAsync("/api/series/forecast?product=TP-TRI&step=FIN-PROFILE&parameter=taper_deg&window=20"));
        var inLots = r.GetProperty("in_lots");
        Assert.NotEqual("no_trend", inLots.GetProperty("status").GetString());
        Assert.True(inLots.GetProperty("slope").GetDouble() > 0);
        Assert.True(inLots.GetProperty("p_value").GetDouble() < 0.05);
        Assert.Equal(20, r.GetProperty("lots").GetInt32());
        // The hours view has the same trend at 1/6 of the per-lot slope (lots are 6 h apart).
        Assert.Equal(inLots.GetProperty("slope").GetDouble() / 6, r.GetProperty("in_hours").GetProperty("slope").GetDouble(), 9);
    }

    [Fact]
    public async Task Forecast_FlatSeries_SaysNoTrendIsSeen()
    {
        await SeedAsync(l => 6.0 + (0.03 * ((l * 7) % 5)));
        var r = await ReadJsonAsync(await Client.GetAsync("/api/series/forecast?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm"));
        Assert.Equal("no_trend", r.GetProperty("in_lots").GetProperty("status").GetString());
        Assert.Contains("trend", r.GetProperty("in_lots").GetProperty("message").GetString(), StringComparison.OrdinalIgnoreCase);
    }
}
