using System.Net;
using System.Net.Http.Json;
using System.Text.Json;

namespace FinWatch.Server.Tests.Features.Model;

public class ModelEndpointsTests : IntegrationTest
{
    protected override bool CreateProducts => false;

    private async Task<JsonElement> WaitAsync(string id, Func<string, bool> until)
    {
        for (var i = 0; i < 600; i++)
        {
            var job = await ReadJsonAsync(await Client.GetAsync($"/api/model/cross-section/{id}"));
            if (until(job.GetProperty("status").GetString()!))
            {
                return job;
            }

            await Task.Delay(100);
        }

        throw new TimeoutException("the solve did not reach the expected state");
    }

    [Fact]
    public async Task CrossSection_UndopedFin_SolvesInTheBackgroundWithMapsAndSweep()
    {
        var response = await Client.PostAsJsonAsync("/api/model/cross-section", new
        {
            topWidthNm = 8.0, bottomWidthNm = 8.0, heightNm = 20.0, cornerRadiusNm = 0.0, eotNm = 1.0, dopingCm3 = 0.0, gates = "tri", gridNm = 0.5,
        });
        Assert.Equal(HttpStatusCode.Accepted, response.StatusCode);
        var started = await ReadJsonAsync(response);
        Assert.Contains("not replace electrical test", started.GetProperty("note").GetString(), StringComparison.Ordinal);

        var job = await WaitAsync(started.GetProperty("id").GetString()!, s => s is "done" or "failed");
        Assert.Equal("done", job.GetProperty("status").GetString());
        var result = job.GetProperty("result");
        // An undoped fin with a mid-gap gate turns on near the volume-inversion potential v_t·ln(n_th/nᵢ) ≈ 0.44 V
        // (fin-model.md B.5 and F.6); the coarse test mesh moves it by a few mV.
        Assert.InRange(result.GetProperty("vtV").GetDouble(), 0.35, 0.55);
        // Ideal long-channel swing (kT/q)·ln 10 = 59.5 mV/dec at 300 K (Sze & Ng); the 2-D solve is long-channel.
        Assert.InRange(result.GetProperty("swingMvPerDec").GetDouble(), 58.5, 62);
        var maps = result.GetProperty("maps");
        Assert.Equal(maps.GetProperty("yNm").GetArrayLength(), maps.GetProperty("potentialV").GetArrayLength());
        Assert.Equal(maps.GetProperty("xNm").GetArrayLength(), maps.GetProperty("electronDensityCm3")[0].GetArrayLength());
        var sweep = result.GetProperty("sweep");
        Assert.Equal(sweep.GetProperty("vgV").GetArrayLength(), sweep.GetProperty("electronsPerCm").GetArrayLength());

        // The same shape again comes from the cache.
        var again = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/cross-section", new
        {
            topWidthNm = 8.0, bottomWidthNm = 8.0, heightNm = 20.0, cornerRadiusNm = 0.0, eotNm = 1.0, dopingCm3 = 0.0, gates = "tri", gridNm = 0.5,
        }));
        Assert.True(again.GetProperty("fromCache").GetBoolean());
        Assert.Equal("done", again.GetProperty("status").GetString());
    }

    [Fact]
    public async Task CrossSection_Cancelled_StopsAndSaysSo()
    {
        var started = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/cross-section", new
        {
            topWidthNm = 10.0, bottomWidthNm = 14.0, heightNm = 60.0, cornerRadiusNm = 2.0, eotNm = 1.0, dopingCm3 = 1e18, gridNm = 0.1,
        }));
        var id = started.GetProperty("id").GetString()!;
        var cancel = await Client.DeleteAsync($"/api/model/cross-section/{id}");
        Assert.Equal(HttpStatusCode.OK, cancel.StatusCode);
        var job = await WaitAsync(id, s => s is "cancelled" or "done" or "failed");
        Assert.Equal("cancelled", job.GetProperty("status").GetString());
    }

    [Theory]
    [InlineData("{\"bottomWidthNm\":8,\"heightNm\":40,\"eotNm\":1}", "topWidthNm")]
    [InlineData("{\"topWidthNm\":8,\"bottomWidthNm\":8,\"heightNm\":40,\"eotNm\":1,\"gates\":\"quad\"}", "gates")]
    [InlineData("{\"topWidthNm\":8,\"bottomWidthNm\":8,\"heightNm\":40}", "eotNm")]
    [InlineData("{\"topWidthNm\":8,\"bottomWidthNm\":8,\"heightNm\":40,\"eotNm\":1,\"gridNm\":0.01}", "gridNm")]
    public async Task CrossSection_BadRequest_Returns400NamingTheField(string json, string field)
    {
        using var content = new StringContent(json, System.Text.Encoding.UTF8, "application/json");
        var response = await Client.PostAsync("/api/model/cross-section", content);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.True((await ReadJsonAsync(response)).GetProperty("errors").TryGetProperty(field, out _));
    }

    [Fact]
    public async Task CrossSection_UnknownJob_Returns404Problem()
    {
        var response = await Client.GetAsync("/api/model/cross-section/nope");
        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }
}
