using System.Net;
using System.Net.Http.Json;
using System.Text.Json;

namespace FinWatch.Server.Tests.Features.Model;

public class EvaluateEndpointTests : IntegrationTest
{
    protected override bool CreateProducts => false;

    private async Task<JsonElement> EvaluateAsync(object request)
    {
        var response = await Client.PostAsJsonAsync("/api/model/evaluate", request);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, body);
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    [Fact]
    public async Task Evaluate_VeryLongGate_GivesTheIdealSwingAndNoRollOff()
    {
        // Ideal long-channel swing (kT/q)·ln 10 = 59.5 mV/dec at 300 K (Sze & Ng, Physics of Semiconductor Devices).
        var r = await EvaluateAsync(new { top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 40.0, corner_radius_nm = 0.0, eot_nm = 1.0, gate_length_nm = 1000.0, doping_cm3 = 0.0, gate_faces = "double-gate", sidewall_orientation = "110" });
        Assert.Equal(59.5, r.GetProperty("swing_lin_mv_per_dec").GetDouble(), 0.2);
        Assert.Equal(0, r.GetProperty("sce_shift_lin_mv").GetDouble(), 0.01);
        Assert.Equal(0, r.GetProperty("dibl_mv_per_v").GetDouble(), 0.01);
        Assert.Contains("not use it in place of electrical test", r.GetProperty("note").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Evaluate_DoubleGateScaleLength_LiesBetweenThinOxideAndSuzukiForms()
    {
        // Double gate: the exact lowest mode lies above the thin-oxide form √(ε_Si·t_si·t_ox/(2ε_ox)) (Yan, Ourmazd & Lee 1992)
        // and below the Suzuki et al. (1993) form with its (1 + ε_ox·t_si/(4ε_Si·t_ox)) factor (docs/model.md §B.2).
        var r = await EvaluateAsync(new { top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 40.0, eot_nm = 1.0, gate_length_nm = 20.0, gate_faces = "double-gate" });
        const double w = 8, tox = 1, eSi = 11.7, eOx = 3.9;
        var thin = Math.Sqrt(eSi * w * tox / (2 * eOx));
        var suzuki = Math.Sqrt(eSi * w * tox / (2 * eOx) * (1 + (eOx * w / (4 * eSi * tox))));
        Assert.InRange(r.GetProperty("scale_length_nm").GetDouble(), thin, suzuki);
    }

    [Fact]
    public async Task Evaluate_ConfinementShift_FollowsTheWidth()
    {
        // Particle in a box: E₁ = ħ²π²/(2 m_z w²) falls as 1/w², so narrower fins shift more (docs/model.md §C.1); the DOS form
        // of C.3 gives 42.6 mV at 5 nm and 19.3 mV at 8 nm for (110) sidewalls ([D] prototype values of the note).
        var narrow = await EvaluateAsync(new { top_width_nm = 5.0, bottom_width_nm = 5.0, height_nm = 40.0, eot_nm = 1.0, gate_length_nm = 20.0 });
        var wide = await EvaluateAsync(new { top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 40.0, eot_nm = 1.0, gate_length_nm = 20.0 });
        Assert.Equal(42.6, narrow.GetProperty("qc_shift_mv").GetDouble(), 0.1);
        Assert.Equal(19.3, wide.GetProperty("qc_shift_mv").GetDouble(), 0.1);
    }

    [Fact]
    public async Task Evaluate_TaperedFin_ReportsGeometryAndSlices()
    {
        var r = await EvaluateAsync(new { top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0, corner_radius_nm = 2.0, eot_nm = 0.9, gate_length_nm = 20.0, doping_cm3 = 1e17 });
        // Taper atan((Wb − Wt)/(2H)) = atan(4/84) (docs/model.md §A.1, elementary).
        Assert.Equal(Math.Atan(4.0 / 84) * 180 / Math.PI, r.GetProperty("geometry").GetProperty("taper_deg").GetDouble(), 9);
        Assert.Equal(8.0, r.GetProperty("geometry").GetProperty("mid_width_nm").GetDouble(), 12);
        var slices = r.GetProperty("slices").EnumerateArray().ToList();
        Assert.Equal(1.0, slices.Sum(s => s.GetProperty("current_share").GetDouble()), 1e-9);
        Assert.True(slices[^1].GetProperty("corner").GetBoolean());
        // Saturation lowers the threshold (DIBL > 0), as the quasi-2-D model gives for any finite L/λ (B.5).
        Assert.True(r.GetProperty("vt_sat_v").GetDouble() < r.GetProperty("vt_lin_v").GetDouble());
        Assert.True(r.GetProperty("dibl_mv_per_v").GetDouble() > 0);
    }

    [Fact]
    public async Task Evaluate_OutsideTheValidityRange_WarnsInsteadOfStayingSilent()
    {
        var r = await EvaluateAsync(new { top_width_nm = 20.0, bottom_width_nm = 20.0, height_nm = 20.0, eot_nm = 2.0, gate_length_nm = 15.0 });
        var warnings = r.GetProperty("warnings").EnumerateArray().Select(w => w.GetString()).ToList();
        Assert.Contains(warnings, w => w!.Contains("5–10 nm", StringComparison.Ordinal));
        Assert.Contains(warnings, w => w!.Contains("EOT", StringComparison.Ordinal));
    }

    [Theory]
    [InlineData("{\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1,\"gate_length_nm\":20}", "top_width_nm")]
    [InlineData("{\"top_width_nm\":8,\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1}", "gate_length_nm")]
    [InlineData("{\"top_width_nm\":8,\"bottom_width_nm\":8,\"height_nm\":40,\"eot_nm\":1,\"gate_length_nm\":20,\"sidewall_orientation\":\"111\"}", "sidewall_orientation")]
    public async Task Evaluate_BadRequest_Returns400NamingTheField(string json, string field)
    {
        using var content = new StringContent(json, System.Text.Encoding.UTF8, "application/json");
        var response = await Client.PostAsync("/api/model/evaluate", content);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.True((await ReadJsonAsync(response)).GetProperty("errors").TryGetProperty(field, out _));
    }

    [Fact]
    public async Task Evaluate_GateFacesNotOneOfTheProductSpellings_Returns400ListingThem()
    {
        var response = await Client.PostAsJsonAsync("/api/model/evaluate",
            new { top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 40.0, eot_nm = 1.0, gate_length_nm = 20.0, gate_faces = "tri" });
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var message = (await ReadJsonAsync(response)).GetProperty("errors").GetProperty("gate_faces")[0].GetString();
        Assert.Contains("'tri'", message, StringComparison.Ordinal);
        Assert.Contains("tri-gate", message, StringComparison.Ordinal);
        Assert.Contains("double-gate (hard mask on top", message, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Evaluate_GateFacesAbsent_IsTriGate()
    {
        var fin = new { top_width_nm = 8.0, bottom_width_nm = 8.0, height_nm = 40.0, eot_nm = 1.0, gate_length_nm = 20.0 };
        var absent = await EvaluateAsync(fin);
        var tri = await EvaluateAsync(new { fin.top_width_nm, fin.bottom_width_nm, fin.height_nm, fin.eot_nm, fin.gate_length_nm, gate_faces = "tri-gate" });
        var dbl = await EvaluateAsync(new { fin.top_width_nm, fin.bottom_width_nm, fin.height_nm, fin.eot_nm, fin.gate_length_nm, gate_faces = "double-gate" });
        Assert.Equal(tri.GetProperty("scale_length_nm").GetDouble(), absent.GetProperty("scale_length_nm").GetDouble());
        Assert.NotEqual(dbl.GetProperty("scale_length_nm").GetDouble(), absent.GetProperty("scale_length_nm").GetDouble());
    }
}
