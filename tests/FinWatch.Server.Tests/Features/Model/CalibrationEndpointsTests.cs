using System.Net;
using System.Text;
using System.Text.Json;
using FinWatch.Physics.Analytic;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Model;

/// <summary>
/// POST /api/model/calibrations (docs/model.md §G.3). The electrical tests are synthetic with a known truth: they are made
/// with the model itself under chosen (L_eff, barrier height, offset), so a correct fit must recover that truth within
/// its stated posterior uncertainty (a known-answer check of the estimator, as for any regression).
/// </summary>
public class CalibrationEndpointsTests : IntegrationTest
{
    private async Task IngestFinsAsync() => (await PostCsvAsync(CalibrationFixture.FinsCsv())).EnsureSuccessStatusCode();

    private static CalibrationParameters Defaults() => CalibrationFixture.Defaults();

    private static string ElectricalCsv(double[] theta, string product = TestProducts.TriGate) => CalibrationFixture.ElectricalCsv(theta, product);

    private static double[] TruthTheta() => CalibrationFixture.TruthTheta();

    private Task<HttpResponseMessage> PostCalibrationAsync(string csv, string query = "reason=first%20e-test%20lots") =>
        Client.PostAsync($"/api/model/calibrations?{query}", new StringContent(csv, Encoding.UTF8, "text/csv"));

    [Fact]
    public async Task Calibrate_SyntheticTestsOfKnownTruth_RecoversItAndStoresVersion1()
    {
        await IngestFinsAsync();
        var theta = TruthTheta();
        var response = await PostCalibrationAsync(ElectricalCsv(theta));
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        var r = await ReadJsonAsync(response);
        Assert.Equal(1, r.GetProperty("version").GetInt32());
        Assert.Equal(6, r.GetProperty("observations").GetInt32());
        var p = r.GetProperty("parameters").EnumerateArray().ToDictionary(x => x.GetProperty("name").GetString()!);
        // Noise-free data: the ridge prior pulls the estimate a little towards the defaults, by less than its posterior sd.
        foreach (var (name, i) in new[] { ("gate_length", 0), ("barrier_height", 1), ("threshold_offset", 2) })
        {
            Assert.Equal(theta[i], p[name].GetProperty("value").GetDouble(), 2 * p[name].GetProperty("sd").GetDouble());
        }

        Assert.Equal(20, p["gate_length"].GetProperty("prior").GetDouble());
        Assert.True(r.GetProperty("rms_residual_after_mv").GetDouble() < 1.0);
        Assert.True(r.GetProperty("rms_residual_before_mv").GetDouble() > 50);
        Assert.Equal(6, r.GetProperty("wafers").GetArrayLength());
        Assert.Equal(2, r.GetProperty("wafers")[0].GetProperty("sites").GetInt32());
        Assert.Equal("first e-test lots", r.GetProperty("reason").GetString());
        Assert.Contains("electrical test", r.GetProperty("caution").GetString(), StringComparison.Ordinal);
        Assert.Equal(6, await Factory.QueryAsync(db => db.ElectricalTests.CountAsync()));
    }

    [Fact]
    public async Task Calibrate_ThenPredictionsUseAndStampTheNewSet()
    {
        await IngestFinsAsync();
        var before = await ReadJsonAsync(await Client.GetAsync($"/api/model/sensitivities?product={TestProducts.TriGate}"));
        (await PostCalibrationAsync(ElectricalCsv(TruthTheta()))).EnsureSuccessStatusCode();

        var after = await ReadJsonAsync(await Client.GetAsync($"/api/model/sensitivities?product={TestProducts.TriGate}"));
        Assert.Equal("TP-TRI calibration", after.GetProperty("parameter_set").GetString());
        Assert.StartsWith("v1 of ", after.GetProperty("parameter_set_version").GetString(), StringComparison.Ordinal);
        // A longer L_eff (22 against 20 nm) weakens the roll-off, so the width sensitivity is smaller in size (B.5, G.4).
        static double Width(JsonElement s) => s.GetProperty("rows").EnumerateArray().Single(x => x.GetProperty("input").GetString() == "mid_width")
            .GetProperty("delta_vt_sat_mv").GetDouble();
        Assert.True(Math.Abs(Width(after)) < Math.Abs(Width(before)));

        (await PostCsvAsync(SiteRow.Csv([new SiteRow { LotId = "C0009", TopWidthNm = "5.8", BottomWidthNm = "9.8" }]))).EnsureSuccessStatusCode();
        var stamp = await Factory.QueryAsync(db => db.Measurements.Where(m => m.LotId == "C0009")
            .Join(db.ModelStamps, m => m.ModelStampId, s => s.Id, (m, s) => s).SingleAsync());
        Assert.Equal("TP-TRI calibration", stamp.ParameterSet);
        Assert.StartsWith("v1 of ", stamp.ParameterSetVersion, StringComparison.Ordinal);
    }

    [Fact]
    public async Task Calibrate_Twice_KeepsBothVersionsNewestFirst()
    {
        await IngestFinsAsync();
        (await PostCalibrationAsync(ElectricalCsv(TruthTheta()))).EnsureSuccessStatusCode();
        (await PostCalibrationAsync(ElectricalCsv([21.0, TruthTheta()[1], 0.09]), "reason=more%20lots")).EnsureSuccessStatusCode();
        var h = await ReadJsonAsync(await Client.GetAsync($"/api/model/calibrations?product={TestProducts.TriGate}"));
        var list = h.GetProperty("calibrations").EnumerateArray().ToList();
        Assert.Equal([2, 1], list.Select(c => c.GetProperty("version").GetInt32()));
        Assert.Equal("more lots", list[0].GetProperty("reason").GetString());
        Assert.Equal("test administrator", list[0].GetProperty("created_by").GetString()); // the test identity that made the request (TestAuthHandler)
    }

    // The reason is stored in 2000 characters (a limit PostgreSQL enforces and SQLite does not): longer is a row-0 error.
    [Fact]
    public async Task Calibrate_ReasonLongerThanItsColumn_IsRejected()
    {
        await IngestFinsAsync();
        var errors = await AssertRejectedAsync(await PostCalibrationAsync(ElectricalCsv(TruthTheta()), "reason=" + new string('r', 2001)));
        Assert.True(HasError(errors, 0, "reason"), Describe(errors));
        Assert.Equal(0, await Factory.QueryAsync(db => db.ModelParameterSets.CountAsync()));
    }

    [Fact]
    public async Task Calibrate_MeasurementSdOutOfRange_IsRejectedNamingTheQueryParameter()
    {
        await IngestFinsAsync();
        var errors = await AssertRejectedAsync(await PostCalibrationAsync(ElectricalCsv(TruthTheta()), "reason=r&measurement_sd_mv=500"));
        Assert.True(HasError(errors, 0, "measurement_sd_mv"), Describe(errors));
        Assert.Equal(0, await Factory.QueryAsync(db => db.ModelParameterSets.CountAsync()));
    }

    [Fact]
    public async Task Calibrate_Preview_StoresNothing()
    {
        await IngestFinsAsync();
        var response = await PostCalibrationAsync(ElectricalCsv(TruthTheta()), "preview=true");
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var r = await ReadJsonAsync(response);
        Assert.False(r.GetProperty("stored").GetBoolean());
        Assert.Equal(JsonValueKind.Null, r.GetProperty("version").ValueKind);
        Assert.Equal(0, await Factory.QueryAsync(db => db.ModelParameterSets.CountAsync()));
    }

    [Fact]
    public async Task Calibrate_BadRows_ReportRowColumnAndValue_AndStoreNothing()
    {
        await IngestFinsAsync();
        var csv = "lot_id,wafer_slot,product,vt_lin_v,vt_sat_v,tested_at\n"
            + "C0001,1,TP-TRI,320,0.29,2026-11-28T09:00:00Z\n"         // row 2: mV typed as V
            + "C0001,2,TP-TRI,0.31,0.28,28/11/2026\n"                  // row 3: not ISO 8601
            + "C0001,2,TP-TRI,0.31,0.28,2026-11-28T09:00:00Z\n";       // row 4: valid
        var bad = await ReadJsonAsync(await PostCalibrationAsync(csv));
        var errors = bad.GetProperty("errors").EnumerateArray().ToList();
        Assert.Contains(errors, e => e.GetProperty("row").GetInt32() == 2 && e.GetProperty("column").GetString() == "vt_lin_v" && e.GetProperty("value").GetString() == "320");
        Assert.Contains(errors, e => e.GetProperty("row").GetInt32() == 3 && e.GetProperty("column").GetString() == "tested_at");

        var missing = await PostCalibrationAsync("lot_id,wafer_slot,product,vt_lin_v,vt_sat_v,tested_at\nC0042,3,TP-TRI,0.3,0.28,2026-11-28T09:00:00Z\n");
        Assert.Equal(HttpStatusCode.BadRequest, missing.StatusCode);
        var m = (await ReadJsonAsync(missing)).GetProperty("errors")[0];
        Assert.Equal("lot_id", m.GetProperty("column").GetString());
        Assert.Contains("no measured fin profile", m.GetProperty("reason").GetString(), StringComparison.Ordinal);

        var header = await ReadJsonAsync(await PostCalibrationAsync("lot,wafer_slot,product,vt_lin_v,vt_sat_v,tested_at\nC0001,1,TP-TRI,0.3,0.28,2026-11-28T09:00:00Z\n"));
        Assert.Contains(header.GetProperty("errors").EnumerateArray(), e => e.GetProperty("column").GetString() == "lot_id");

        var noReason = await PostCalibrationAsync(ElectricalCsv(TruthTheta()), "");
        Assert.Equal(HttpStatusCode.BadRequest, noReason.StatusCode);
        Assert.Equal(0, await Factory.QueryAsync(db => db.ModelParameterSets.CountAsync()));
        Assert.Equal(0, await Factory.QueryAsync(db => db.ElectricalTests.CountAsync()));
    }

    [Fact]
    public async Task Calibrate_TwoProductsInOneFile_IsRefused()
    {
        await IngestFinsAsync();
        var csv = ElectricalCsv(TruthTheta()) + $"C0001,3,{TestProducts.DoubleGate},0.3,0.28,2026-11-28T09:00:00Z\n";
        var r = await ReadJsonAsync(await PostCalibrationAsync(csv));
        Assert.Contains(r.GetProperty("errors").EnumerateArray(), e => e.GetProperty("row").GetInt32() == 8 && e.GetProperty("column").GetString() == "product");
    }
}
