using System.Net;
using System.Net.Http.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Model;

/// <summary>
/// The test product's nominal (6/10/42 nm, r 2 nm) with the default model inputs (EOT 0.9 nm, L 20 nm, N_A 1e17 cm⁻³) is
/// exactly the nominal of the design note's sensitivity example (docs/model.md §G.4), so the note's table applies.
/// </summary>
public class PredictEndpointsTests : IntegrationTest
{
    [Fact]
    public async Task Predict_NominalProfile_ShiftsByExactlyZero()
    {
        // G.2 step 6: shifts are differences from the nominal computed with the same code, so the nominal gives 0.
        var r = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/predict",
            new { product = TestProducts.TriGate, top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0, corner_radius_nm = 2.0 }));
        Assert.Equal(0, r.GetProperty("delta_vt_lin_mv").GetDouble());
        Assert.Equal(0, r.GetProperty("delta_vt_sat_mv").GetDouble());
        Assert.Equal(0, r.GetProperty("contributions_sat_mv").GetProperty("linear_total").GetDouble());
        Assert.Contains("electrical test", r.GetProperty("note").GetString(), StringComparison.Ordinal);
        Assert.StartsWith("FinWatch.Physics.Analytic/", r.GetProperty("code_version").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Predict_NarrowerFin_RaisesTheThresholdAsTheSensitivitySays()
    {
        // 0.2 nm narrower at both top and bottom (mid width −0.2 nm, same taper): G.4 gives dVT,lin/dw_mid ≈ −14.8 mV/nm and
        // dVT,sat/dw_mid ≈ −26.5 mV/nm ([D] prototype values of the note), so about +3.0 and +5.3 mV.
        var r = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/predict",
            new { product = TestProducts.TriGate, top_width_nm = 5.8, bottom_width_nm = 9.8, height_nm = 42.0, corner_radius_nm = 2.0 }));
        Assert.Equal(2.96, r.GetProperty("delta_vt_lin_mv").GetDouble(), 0.3);
        Assert.Equal(5.3, r.GetProperty("delta_vt_sat_mv").GetDouble(), 0.5);
        var c = r.GetProperty("contributions_lin_mv");
        Assert.True(c.GetProperty("mid_width").GetDouble() > 2);
        Assert.Equal(c.GetProperty("linear_total").GetDouble(), c.GetProperty("mid_width").GetDouble() + c.GetProperty("taper").GetDouble()
            + c.GetProperty("height").GetDouble() + c.GetProperty("corner_radius").GetDouble() + c.GetProperty("dielectric").GetDouble(), 9);
    }

    [Fact]
    public async Task Predict_WithMetrologySd_PropagatesItToTheShift()
    {
        // Only a height error: σ(ΔVT) = |dVT/dH|·σ_H (G.4 propagation), with dVT,sat/dH from the sensitivities endpoint.
        var r = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/predict", new
        {
            product = TestProducts.TriGate, top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0, corner_radius_nm = 2.0,
            metrology_sd = new { height_nm = 1.5 },
        }));
        var s = await ReadJsonAsync(await Client.GetAsync($"/api/model/sensitivities?product={TestProducts.TriGate}"));
        var dH = s.GetProperty("rows").EnumerateArray().Single(x => x.GetProperty("input").GetString() == "height").GetProperty("delta_vt_sat_mv").GetDouble();
        Assert.Equal(Math.Abs(dH) * 1.5, r.GetProperty("uncertainty").GetProperty("delta_vt_sat_sd_mv").GetDouble(), 1e-9);

        var bad = await Client.PostAsJsonAsync("/api/model/predict", new
        {
            product = TestProducts.TriGate, top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0, metrology_sd = new { top_width_nm = -1.0 },
        });
        Assert.Equal(HttpStatusCode.BadRequest, bad.StatusCode);
        Assert.True((await ReadJsonAsync(bad)).GetProperty("errors").TryGetProperty("metrology_sd.top_width_nm", out _));
    }

    [Fact]
    public async Task Predict_RadiusLargerThanTheTopAllows_Warns()
    {
        var r = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/predict",
            new { product = TestProducts.TriGate, top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0, corner_radius_nm = 4.5 }));
        Assert.Contains(r.GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("larger than the top allows", StringComparison.Ordinal));
    }

    [Fact]
    public async Task Predict_UnknownProduct_Returns400()
    {
        var response = await Client.PostAsJsonAsync("/api/model/predict", new { product = "NOPE", top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0 });
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Fact]
    public async Task Sensitivities_NoteNominal_ReproduceTheG4Table()
    {
        // docs/model.md §G.4 example table ([D] this model's prototype, uncalibrated): w_mid −14.8 / −26.5 mV per nm,
        // EOT −37 / −93 mV per nm, L_eff +5.7 / +14.0 mV per nm.
        var r = await ReadJsonAsync(await Client.GetAsync($"/api/model/sensitivities?product={TestProducts.TriGate}"));
        var rows = r.GetProperty("rows").EnumerateArray().ToDictionary(x => x.GetProperty("input").GetString()!);
        Assert.Equal(-14.8, rows["mid_width"].GetProperty("delta_vt_lin_mv").GetDouble(), 0.1);
        Assert.Equal(-26.5, rows["mid_width"].GetProperty("delta_vt_sat_mv").GetDouble(), 0.1);
        Assert.Equal(-37, rows["eot"].GetProperty("delta_vt_lin_mv").GetDouble(), 1.0);
        Assert.Equal(5.7, rows["gate_length"].GetProperty("delta_vt_lin_mv").GetDouble(), 0.1);
    }

    [Fact]
    public async Task Product_ModelInputs_RoundTrip()
    {
        var p = await ReadJsonAsync(await Client.GetAsync($"/api/products/{TestProducts.TriGate}"));
        var model = p.GetProperty("model");
        Assert.Equal(0.9, model.GetProperty("eot_nm").GetDouble());
        Assert.Equal(20, model.GetProperty("gate_length_nm").GetDouble());
        Assert.Equal("110", model.GetProperty("sidewall_orientation").GetString());
    }

    [Fact]
    public async Task Ingest_StoresThePredictedShiftsWithTheirStamp()
    {
        // Wiring: every ingested site with a whole profile carries the shifts /api/model/predict gives for it.
        var csv = SiteRow.Csv([new SiteRow { TopWidthNm = "5.8", BottomWidthNm = "9.8", CornerRadiusNm = "2" }, new SiteRow { SiteId = "S02", CornerRadiusNm = null }]);
        (await PostCsvAsync(csv)).EnsureSuccessStatusCode();
        var stored = await Factory.QueryAsync(db => Microsoft.EntityFrameworkCore.EntityFrameworkQueryableExtensions.ToListAsync(
            db.Measurements.OrderBy(m => m.SiteId)));
        var predicted = await ReadJsonAsync(await Client.PostAsJsonAsync("/api/model/predict",
            new { product = TestProducts.TriGate, top_width_nm = 5.8, bottom_width_nm = 9.8, height_nm = 42.0, corner_radius_nm = 2.0 }));
        Assert.Equal(predicted.GetProperty("delta_vt_sat_mv").GetDouble(), stored[0].DeltaVtSatMv!.Value, 9);
        Assert.Equal(predicted.GetProperty("delta_vt_lin_mv").GetDouble(), stored[0].DeltaVtLinMv!.Value, 9);
        Assert.NotNull(stored[0].ModelStampId);
        Assert.Null(stored[1].DeltaVtSatMv); // no radius measured: no prediction
        var stamp = await Factory.QueryAsync(db => Microsoft.EntityFrameworkCore.EntityFrameworkQueryableExtensions.SingleAsync(db.ModelStamps));
        Assert.Equal(predicted.GetProperty("code_version").GetString(), stamp.CodeVersion);

        var series = await ReadJsonAsync(await Client.GetAsync($"/api/series?product={TestProducts.TriGate}&step=FIN-PROFILE&parameter=delta_vt_sat_mv"));
        Assert.Equal(1, series.GetProperty("count").GetInt32());
        Assert.Equal("mV", series.GetProperty("unit").GetString());
    }
}
