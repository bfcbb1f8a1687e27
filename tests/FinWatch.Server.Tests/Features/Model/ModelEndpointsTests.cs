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
            top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 20.0, corner_radius_nm = 0.0, eot_nm = 1.0, doping_cm3 = 0.0, gate_faces = "tri-gate", grid_nm = 0.5,
        });
        Assert.Equal(HttpStatusCode.Accepted, response.StatusCode);
        var started = await ReadJsonAsync(response);
        Assert.Contains("not replace electrical test", started.GetProperty("note").GetString(), StringComparison.Ordinal);

        var job = await WaitAsync(started.GetProperty("id").GetString()!, s => s is "done" or "failed");
        Assert.Equal("done", job.GetProperty("status").GetString());
        var result = job.GetProperty("result");
        // An undoped fin with a mid-gap gate turns on near the volume-inversion potential v_t·ln(n_th/nᵢ) ≈ 0.44 V
        // (docs/model.md §B.5 and F.6); the coarse test mesh moves it by a few mV.
        Assert.InRange(result.GetProperty("vt_v").GetDouble(), 0.35, 0.55);
        // Ideal long-channel swing (kT/q)·ln 10 = 59.5 mV/dec at 300 K (Sze & Ng); the 2-D solve is long-channel.
        Assert.InRange(result.GetProperty("swing_mv_per_dec").GetDouble(), 58.5, 62);
        var maps = result.GetProperty("maps");
        Assert.Equal(maps.GetProperty("y_nm").GetArrayLength(), maps.GetProperty("potential_v").GetArrayLength());
        Assert.Equal(maps.GetProperty("x_nm").GetArrayLength(), maps.GetProperty("electron_density_cm3")[0].GetArrayLength());
        var sweep = result.GetProperty("sweep");
        Assert.Equal(sweep.GetProperty("vg_v").GetArrayLength(), sweep.GetProperty("electrons_per_cm").GetArrayLength());

        // The same shape again comes from the cache.
        var again = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/cross-section", new
        {
            top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 20.0, corner_radius_nm = 0.0, eot_nm = 1.0, doping_cm3 = 0.0, gate_faces = "tri-gate", grid_nm = 0.5,
        }));
        Assert.True(again.GetProperty("from_cache").GetBoolean());
        Assert.Equal("done", again.GetProperty("status").GetString());
    }

    [Fact]
    public async Task CrossSection_Cancelled_StopsAndSaysSo()
    {
        var started = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/cross-section", new
        {
            top_width_nm = 10.0, bottom_width_nm = 14.0, height_nm = 60.0, corner_radius_nm = 2.0, eot_nm = 1.0, doping_cm3 = 1e18, grid_nm = 0.1,
        }));
        var id = started.GetProperty("id").GetString()!;
        var cancel = await Client.DeleteAsync($"/api/model/cross-section/{id}");
        Assert.Equal(HttpStatusCode.OK, cancel.StatusCode);
        var job = await WaitAsync(id, s => s is "cancelled" or "done" or "failed");
        Assert.Equal("cancelled", job.GetProperty("status").GetString());
    }

    [Theory]
    [InlineData("{\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1}", "top_width_nm")]
    [InlineData("{\"top_width_nm\":8,\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1,\"gate_faces\":\"quad-gate\"}", "gate_faces")]
    [InlineData("{\"top_width_nm\":8,\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1,\"gate_faces\":\"double\"}", "gate_faces")]
    [InlineData("{\"top_width_nm\":8,\"bottom_width_nm\":8,\"height_nm\":40}", "eot_nm")]
    [InlineData("{\"top_width_nm\":8,\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1,\"grid_nm\":0.01}", "grid_nm")]
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
