using System.Net;
using FinWatch.Data;
using FinWatch.Testing;
using Microsoft.Extensions.DependencyInjection;

namespace FinWatch.Server.Tests.Features.Lots;

public class LotsEndpointsTests : IntegrationTest
{
    private static readonly DateTimeOffset Day1 = new(2026, 11, 10, 8, 0, 0, TimeSpan.Zero);

    private async Task SeedAsync()
    {
        var rows = SiteRow.Wafers("LA", 2, 3, Day1)
            .Concat(SiteRow.Wafers("LB", 1, 3, Day1.AddDays(1)).Select(r => r with { EtchChamber = "ETB-2" }))
            .Concat(SiteRow.Wafers("LC", 1, 2, Day1.AddDays(2), TestProducts.DoubleGate));
        (await PostCsvAsync(SiteRow.Csv(rows))).EnsureSuccessStatusCode();
    }

    [Fact]
    public async Task GetLots_NewestFirstWithCounts()
    {
        await SeedAsync();
        var page = await ReadJsonAsync(await Client.GetAsync("/api/lots"));
        Assert.Equal(3, page.GetProperty("total").GetInt32());
        var items = page.GetProperty("items").EnumerateArray().ToList();
        Assert.Equal(["LC", "LB", "LA"], items.Select(i => i.GetProperty("lot_id").GetString()));
        Assert.Equal(2, items[2].GetProperty("wafer_count").GetInt32());
        Assert.Equal(6, items[2].GetProperty("site_count").GetInt32());
        Assert.Equal(["ETA-1", "LNA-1"], items[2].GetProperty("chambers").EnumerateArray().Select(c => c.GetString()));
    }

    [Theory]
    [InlineData("?product=TP-DG", new[] { "LC" })]
    [InlineData("?chamber=ETB-2", new[] { "LB" })]
    [InlineData("?chamber=LNA-1&product=TP-TRI", new[] { "LB", "LA" })]
    [InlineData("?from=2026-11-11T00:00:00Z&to=2026-11-11T23:59:59Z", new[] { "LB" })]
    [InlineData("?step=NONE", new string[0])]
    [InlineData("?page=2&page_size=2", new[] { "LA" })]
    public async Task GetLots_Filters_SelectTheRightLots(string query, string[] expected)
    {
        await SeedAsync();
        var page = await ReadJsonAsync(await Client.GetAsync("/api/lots" + query));
        Assert.Equal(expected, page.GetProperty("items").EnumerateArray().Select(i => i.GetProperty("lot_id").GetString()));
    }

    [Fact]
    public async Task GetLots_BadPaging_Returns400()
    {
        var response = await Client.GetAsync("/api/lots?page_size=100000");
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Fact]
    public async Task GetLot_ReturnsWafersSitesAndDerivedValues()
    {
        await SeedAsync();
        var lot = await ReadJsonAsync(await Client.GetAsync("/api/lots/LA"));
        Assert.Equal("TP-TRI", lot.GetProperty("product").GetString());
        var step = Assert.Single(lot.GetProperty("steps").EnumerateArray());
        var wafers = step.GetProperty("wafers").EnumerateArray().ToList();
        Assert.Equal([1, 2], wafers.Select(w => w.GetProperty("wafer_slot").GetInt32()));
        var site = wafers[0].GetProperty("sites")[0];
        Assert.Equal("S01", site.GetProperty("site_id").GetString());
        Assert.Equal(10.0, site.GetProperty("site_x_mm").GetDouble());
        Assert.True(site.GetProperty("taper_deg").GetDouble() > 0);
        Assert.Equal("2026-11-10T08:01:01Z", site.GetProperty("measured_at").GetString());
        Assert.Empty(site.GetProperty("flags").EnumerateArray());
        // The predicted shifts are the ones stored with the site (an estimate under the parameters then in force).
        using var scope = Factory.Services.CreateScope();
        var stored = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>().Measurements
            .Single(m => m.LotId == "LA" && m.WaferSlot == 1 && m.SiteId == "S01");
        Assert.NotNull(stored.DeltaVtSatMv);
        Assert.Equal(stored.DeltaVtSatMv!.Value, site.GetProperty("delta_vt_sat_mv").GetDouble());
        Assert.Equal(stored.DeltaVtLinMv!.Value, site.GetProperty("delta_vt_lin_mv").GetDouble());
    }

    [Fact]
    public async Task GetLot_Unknown_Returns404Problem()
    {
        var response = await Client.GetAsync("/api/lots/NOPE");
        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }
}
