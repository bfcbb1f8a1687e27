using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Server.Features.Monitor;
using FinWatch.Statistics.Shewhart;
using Microsoft.Extensions.DependencyInjection;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Monitor;

public class MonitorEndpointsTests : IntegrationTest
{
    private async Task<JsonElement> BaselineAndContextAsync(string code = "TRI-TOP", double concernMv = 10)
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, code, concernMv);
        return await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{code}"));
    }

    [Fact]
    public async Task Limits_FromTheBaseline_AreTheHandComputedXbarLimits()
    {
        var c = await BaselineAndContextAsync();
        // Xbar-S from summaries (docs/statistics.md §2.3): every wafer mean is 6.0 nm; s = 0.0790569 nm of 5 sites; σ̂ = s/c4(5) with
        // c4(5) = 0.9400 (Montgomery, Appendix VI); σ of a point σ̂/√5; UCL = 6 + 3·σ̂/√5.
        var sigma = 0.0790569415 / SummaryLimits.C4(5);
        var limits = c.GetProperty("limits");
        Assert.Equal(6.0, limits.GetProperty("centre").GetDouble(), 1e-9);
        Assert.Equal(sigma, limits.GetProperty("sigma").GetDouble(), 1e-6);
        Assert.Equal(6.0 + (3 * sigma / Math.Sqrt(5)), limits.GetProperty("ucl").GetDouble(), 1e-6);
        Assert.Equal("nm", limits.GetProperty("unit").GetString());
        Assert.Equal("approved", limits.GetProperty("status").GetString());
        Assert.Equal("in_control", c.GetProperty("state").GetString());
        Assert.Equal(20, c.GetProperty("points").GetInt64());
        // The baseline points were measured before the limits were in force: not judged.
        var points = await ReadJsonAsync(await Client.GetAsync("/api/contexts/TRI-TOP/points"));
        Assert.All(points.EnumerateArray(), p => Assert.Equal(JsonValueKind.Null, p.GetProperty("z").ValueKind));
    }

    [Fact]
    public async Task Points_AfterSeq_GivesOnlyTheLaterPoints()
    {
        await BaselineAndContextAsync();
        var points = await ReadJsonAsync(await Client.GetAsync("/api/contexts/TRI-TOP/points?after_seq=15"));
        Assert.Equal([16L, 17L, 18L, 19L, 20L], points.EnumerateArray().Select(p => p.GetProperty("seq").GetInt64()));
    }

    [Fact]
    public async Task PointBeyondTheLimit_OpensOneExcursion_LaterSignalsOfAnyRuleJoinIt()
    {
        await BaselineAndContextAsync();
        // The test clock stands days after the monitor day: raised now, measured then.
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0, 0, 1.5));
        var alerts = (await ReadJsonAsync(await Client.GetAsync("/api/alerts?state=open"))).EnumerateArray().ToList();
        var alert = Assert.Single(alerts);
        Assert.Equal("WE1", alert.GetProperty("rule").GetString());
        Assert.Equal("M0001", alert.GetProperty("lot_id").GetString());
        Assert.Equal(3, alert.GetProperty("wafer_slot").GetInt32());
        Assert.Equal(23, alert.GetProperty("first_point_seq").GetInt64());
        Assert.Equal(23, alert.GetProperty("last_point_seq").GetInt64());
        Assert.Equal("signalling", alert.GetProperty("condition").GetString());
        // Wafer 3's last site: the fixture measures wafer w at minute w and site s at second s.
        Assert.Equal(MonitorDay.AddMinutes(2).AddSeconds(4), alert.GetProperty("first_signal_measured_at").GetDateTimeOffset());
        Assert.Equal(FinWatch.Testing.FinWatchAppFactory.Now, alert.GetProperty("raised_at").GetDateTimeOffset());
        Assert.True(alert.GetProperty("predicted_dvt_sat_mv").GetDouble() < -10, "a 1.5 nm wider top lowers VT,sat by well over 10 mV (docs/model.md)");

        await IngestAsync(Client, Wafers("M0002", MonitorDay.AddHours(2), 1.6));
        // 1.5 and 1.6 nm in a row: WE1 again and two of three beyond 2σ (WE2), both in the one open excursion.
        alert = Assert.Single((await ReadJsonAsync(await Client.GetAsync("/api/alerts?state=active"))).EnumerateArray());
        Assert.Equal(["WE1", "WE2"], alert.GetProperty("rules").EnumerateArray().Select(r => r.GetString()));
        Assert.Equal(2, alert.GetProperty("point_count").GetInt32());
        Assert.Equal(2, alert.GetProperty("signal_count").GetInt32());
        Assert.Equal(2, alert.GetProperty("lot_count").GetInt32());
        Assert.Equal(2, alert.GetProperty("wafer_count").GetInt32());
        Assert.Equal(MonitorDay.AddHours(2).AddSeconds(4), alert.GetProperty("last_signal_measured_at").GetDateTimeOffset());
        var c = await ReadJsonAsync(await Client.GetAsync("/api/contexts/TRI-TOP"));
        Assert.Equal("out_of_control", c.GetProperty("state").GetString());
        Assert.Equal(1, c.GetProperty("unacknowledged_alerts").GetInt32());
    }

    [Fact]
    public async Task Excursion_QuietPoints_MarkItBackInControl_OnlyAPersonClosesIt_ThenANewSignalOpensAnother()
    {
        await BaselineAndContextAsync();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5));
        var id = (await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray().Single().GetProperty("id").GetInt64();

        // Seven quiet wafers: still signalling; the eighth (the default setting) marks it back in control, still open.
        await IngestAsync(Client, Wafers("M0002", MonitorDay.AddHours(1), new double[7]));
        Assert.Equal("signalling", (await AlertAsync(id)).GetProperty("alert").GetProperty("condition").GetString());
        await IngestAsync(Client, Wafers("M0003", MonitorDay.AddHours(2), 0));
        var detail = await AlertAsync(id);
        Assert.Equal("back in control", detail.GetProperty("alert").GetProperty("condition").GetString());
        Assert.Equal("open", detail.GetProperty("alert").GetProperty("state").GetString());
        Assert.Equal(9, detail.GetProperty("alert").GetProperty("point_count").GetInt32());
        Assert.Equal(9, detail.GetProperty("points").GetArrayLength()); // the detail gives every point of the excursion
        Assert.Equal(["M0001", "M0002", "M0003"], detail.GetProperty("lots").EnumerateArray().Select(l => l.GetProperty("lot_id").GetString()));
        Assert.Equal(7, detail.GetProperty("lots")[1].GetProperty("wafers").GetArrayLength());
        Assert.Contains(detail.GetProperty("history").EnumerateArray(), e => e.GetProperty("kind").GetString() == "back-in-control");

        // A signal while it is not closed joins it again; after a person closes it, the next signal opens a new one.
        await IngestAsync(Client, Wafers("M0004", MonitorDay.AddHours(3), -1.5));
        Assert.Single((await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray());
        Assert.Equal("signalling", (await AlertAsync(id)).GetProperty("alert").GetProperty("condition").GetString());
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment = "looking" })).EnsureSuccessStatusCode();
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/disposition", new
        {
            steps = new[] { new { step = "Hold the lot", done = true }, new { step = "Check the etch chamber log", done = true } },
        })).EnsureSuccessStatusCode();
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/close", new { comment = "chamber recovered" })).EnsureSuccessStatusCode();
        await IngestAsync(Client, Wafers("M0005", MonitorDay.AddHours(4), 1.5));
        var all = (await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray().ToList();
        Assert.Equal(2, all.Count);
        Assert.Equal(1, all.Single(a => a.GetProperty("id").GetInt64() != id).GetProperty("point_count").GetInt32());
    }

    private async Task<JsonElement> AlertAsync(long id) => await ReadJsonAsync(await Client.GetAsync($"/api/alerts/{id}"));

    [Fact]
    public async Task Severity_ElectricallyLargeRanksAboveStatisticallyLarge()
    {
        // The same signal under two electrical concerns: 5 mV (the predicted shift is far above it) and 1000 mV (far below).
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP-TIGHT", concernMv: 5);
        await ApprovedContextAsync(Client, "TRI-TOP-LOOSE", concernMv: 1000);
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5));
        var alerts = (await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray().ToList();
        Assert.Equal("critical", alerts.Single(a => a.GetProperty("context").GetString() == "TRI-TOP-TIGHT").GetProperty("severity").GetString());
        Assert.Equal("medium", alerts.Single(a => a.GetProperty("context").GetString() == "TRI-TOP-LOOSE").GetProperty("severity").GetString());
        Assert.Equal("TRI-TOP-TIGHT", alerts[0].GetProperty("context").GetString()); // most severe first
        var overview = (await ReadJsonAsync(await Client.GetAsync("/api/contexts"))).EnumerateArray().ToList();
        Assert.Equal("TRI-TOP-TIGHT", overview[0].GetProperty("code").GetString());
    }

    [Fact]
    public async Task AlertCounts_FollowAcknowledgementEscalationAndClosing()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(Client, "TRI-TOP-A");
        await ApprovedContextAsync(Client, "TRI-TOP-B");
        async Task<(int, int, int)> CountsAsync()
        {
            var c = await ReadJsonAsync(await Client.GetAsync("/api/alerts/counts"));
            return (c.GetProperty("unacknowledged").GetInt32(), c.GetProperty("active").GetInt32(), c.GetProperty("escalated").GetInt32());
        }

        Assert.Equal((0, 0, 0), await CountsAsync());
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5)); // one excursion on each chart
        Assert.Equal((2, 2, 0), await CountsAsync());

        // The floor's summary of a chart: out of control since its excursion's first signal, and its latest points for a
        // sparkline, each with the limits it was judged by (none for the baseline) and whether a rule fired.
        var summary = await ReadJsonAsync(await Client.GetAsync("/api/contexts/TRI-TOP-A"));
        var alert = (await ReadJsonAsync(await Client.GetAsync("/api/alerts?context=TRI-TOP-A"))).EnumerateArray().Single();
        Assert.Equal(alert.GetProperty("first_signal_measured_at").GetDateTimeOffset(), summary.GetProperty("out_of_control_since").GetDateTimeOffset());
        var recent = summary.GetProperty("recent").EnumerateArray().ToList();
        var points = summary.GetProperty("points").GetInt64();
        Assert.Equal(Math.Min(30, points), recent.Count);
        Assert.Equal(Enumerable.Range((int)(points - recent.Count + 1), recent.Count).Select(i => (long)i), recent.Select(r => r.GetProperty("seq").GetInt64()));
        Assert.True(recent[^1].GetProperty("signal").GetBoolean());
        Assert.True(recent[^1].GetProperty("ucl").GetDouble() > recent[^1].GetProperty("centre").GetDouble());
        Assert.Equal(JsonValueKind.Null, recent[0].GetProperty("ucl").ValueKind); // a baseline point: judged by no limits
        var listed = (await ReadJsonAsync(await Client.GetAsync("/api/contexts"))).EnumerateArray().Single(c => c.GetProperty("code").GetString() == "TRI-TOP-A");
        Assert.Equal(summary.GetProperty("out_of_control_since").GetDateTimeOffset(), listed.GetProperty("out_of_control_since").GetDateTimeOffset());

        // A lot's alerts: the excursions that collected one of its points (both charts for M0001, none for the baseline lot).
        Assert.Equal(2, (await ReadJsonAsync(await Client.GetAsync("/api/alerts?lot=M0001"))).GetArrayLength());
        Assert.Equal(0, (await ReadJsonAsync(await Client.GetAsync("/api/alerts?lot=B0001"))).GetArrayLength());

        var listedAlerts = (await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray().ToList();
        var ids = listedAlerts.Select(a => a.GetProperty("id").GetInt64()).ToList();
        var alerts0Context = listedAlerts[0].GetProperty("context").GetString();
        (await Client.PostAsJsonAsync($"/api/alerts/{ids[0]}/acknowledge", new { comment = "looking" })).EnsureSuccessStatusCode();
        Assert.Equal((1, 2, 0), await CountsAsync());

        // The other is not acknowledged within the escalation time (30 min by default) and escalates.
        Factory.Clock.Advance(TimeSpan.FromMinutes(31)); // the worker's own timer may escalate it first
        await Factory.Services.GetRequiredService<MonitorWorker>().EscalateAsync(CancellationToken.None);
        Assert.Equal((1, 2, 1), await CountsAsync());

        (await Client.PostAsJsonAsync($"/api/alerts/{ids[0]}/disposition", new
        {
            steps = new[] { new { step = "Hold the lot", done = true }, new { step = "Check the etch chamber log", done = true } },
        })).EnsureSuccessStatusCode();
        (await Client.PostAsJsonAsync($"/api/alerts/{ids[0]}/close", new { comment = "chamber recovered" })).EnsureSuccessStatusCode();
        Assert.Equal((1, 1, 1), await CountsAsync());
        var closedChart = alerts0Context;
        Assert.Equal(JsonValueKind.Null, (await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{closedChart}"))).GetProperty("out_of_control_since").ValueKind);
    }

    [Fact]
    public async Task Alert_Lifecycle_AcknowledgeDispositionClose_KeepsEveryStep()
    {
        await BaselineAndContextAsync();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5));
        var id = (await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray().Single().GetProperty("id").GetInt64();

        var early = await Client.PostAsJsonAsync($"/api/alerts/{id}/close", new { comment = "too soon" });
        Assert.Equal(HttpStatusCode.BadRequest, early.StatusCode);
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment = "looking" })).EnsureSuccessStatusCode();
        var partial = await Client.PostAsJsonAsync($"/api/alerts/{id}/disposition", new { steps = new[] { new { step = "Hold the lot", done = true } } });
        Assert.Equal(HttpStatusCode.BadRequest, partial.StatusCode);
        Assert.Contains("Check the etch chamber log", await partial.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/disposition", new
        {
            steps = new object[] { new { step = "Hold the lot", done = true }, new { step = "Check the etch chamber log", done = false, note = "log unavailable" } },
            comment = "held",
        })).EnsureSuccessStatusCode();
        (await Client.PostAsJsonAsync($"/api/alerts/{id}/close", new { comment = "chamber recovered" })).EnsureSuccessStatusCode();

        var detail = await ReadJsonAsync(await Client.GetAsync($"/api/alerts/{id}"));
        Assert.Equal("closed", detail.GetProperty("alert").GetProperty("state").GetString());
        Assert.Equal(["raised", "acknowledged", "dispositioned", "closed"], detail.GetProperty("history").EnumerateArray().Select(e => e.GetProperty("kind").GetString()));
        Assert.Equal("log unavailable", detail.GetProperty("history")[2].GetProperty("steps")[1].GetProperty("note").GetString());
        Assert.Contains("electrical test", detail.GetProperty("caution").GetString(), StringComparison.Ordinal);

        // A new signal after the close opens a new alert.
        await IngestAsync(Client, Wafers("M0002", MonitorDay.AddHours(1), 1.5));
        var we1 = (await ReadJsonAsync(await Client.GetAsync("/api/alerts"))).EnumerateArray().Where(a => a.GetProperty("rule").GetString() == "WE1").ToList();
        Assert.Equal(["closed", "open"], we1.Select(a => a.GetProperty("state").GetString()).Order());
    }

    [Fact]
    public async Task UnacknowledgedAlert_EscalatesAfterTheConfiguredTime()
    {
        await BaselineAndContextAsync();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 1.5));
        var worker = Factory.Services.GetRequiredService<MonitorWorker>();
        Assert.Equal(0, await worker.EscalateAsync(CancellationToken.None));
        Factory.Clock.Advance(TimeSpan.FromMinutes(31)); // default 30 min; the worker's own timer fires as well
        await worker.EscalateAsync(CancellationToken.None);
        var a = (await ReadJsonAsync(await Client.GetAsync("/api/alerts?escalated=true"))).EnumerateArray().Single();
        Assert.True(a.GetProperty("escalated").GetBoolean());
        Assert.Equal(0, await worker.EscalateAsync(CancellationToken.None)); // once only
        var history = await ReadJsonAsync(await Client.GetAsync($"/api/alerts/{a.GetProperty("id").GetInt64()}"));
        Assert.Single(history.GetProperty("history").EnumerateArray(), e => e.GetProperty("kind").GetString() == "escalated");
    }

    [Fact]
    public async Task Feed_NumbersEveryPointAndAlertChangeInOrder()
    {
        await BaselineAndContextAsync();
        await IngestAsync(Client, Wafers("M0001", MonitorDay, 0, 1.5));
        var all = (await ReadJsonAsync(await Client.GetAsync("/api/feed?after=0"))).EnumerateArray().ToList();
        Assert.Equal(23, all.Count); // 22 points and one alert
        var seqs = all.Select(e => e.GetProperty("seq").GetInt64()).ToList();
        Assert.Equal(seqs.Order(), seqs);
        Assert.Equal(seqs.Distinct().Count(), seqs.Count);
        var after = (await ReadJsonAsync(await Client.GetAsync($"/api/feed?after={seqs[20]}"))).EnumerateArray().ToList();
        Assert.Equal(["point", "alert"], after.Select(e => e.GetProperty("kind").GetString()));
    }

    [Fact]
    public async Task Context_BadRequest_SaysWhichFieldIsWrong()
    {
        var r = await Client.PostAsJsonAsync("/api/contexts", new { code = "x y", product = "NOPE", step = "", parameter = "width", rules = "WE9", chart_type = "pie" });
        Assert.Equal(HttpStatusCode.BadRequest, r.StatusCode);
        var errors = (await ReadJsonAsync(r)).GetProperty("errors");
        foreach (var field in new[] { "code", "product", "step", "parameter", "rules", "chart_type" })
        {
            Assert.True(errors.TryGetProperty(field, out _), field);
        }
    }

    [Fact]
    public async Task ApprovedLimits_AreFrozen_RevisionsAreNewVersions()
    {
        await BaselineAndContextAsync();
        var again = await Client.PostAsJsonAsync("/api/contexts/TRI-TOP/limits/1/approve", new { comment = "again" });
        Assert.Equal(HttpStatusCode.BadRequest, again.StatusCode);
        var v2 = await Client.PostAsJsonAsync("/api/contexts/TRI-TOP/limits", new { to_seq = 10, exclude = new[] { new { seq = 3, reason = "re-measured" } }, reason = "tighter window" });
        Assert.Equal(HttpStatusCode.Created, v2.StatusCode);
        var history = (await ReadJsonAsync(await Client.GetAsync("/api/contexts/TRI-TOP/limits"))).EnumerateArray().ToList();
        Assert.Equal([2, 1], history.Select(h => h.GetProperty("version").GetInt32()));
        Assert.Equal(9, history[0].GetProperty("points_used").GetInt32());
        Assert.Equal("draft", history[0].GetProperty("status").GetString());
        Assert.Contains(history[0].GetProperty("warnings").EnumerateArray(), w => w.GetString()!.Contains("common practice", StringComparison.Ordinal));
    }
    [Fact]
    public async Task Context_ForAChamberOrATool_TakesOnlyTheirSites()
    {
        // The fixture's sites are etched on tool ETA, chamber ETA-1 (SiteRow's defaults).
        await IngestAsync(Client, Wafers("B0001", BaselineDay, new double[20]));
        foreach (var (code, chamber) in new[] { ("BY-CHAMBER", "ETA-1"), ("BY-TOOL", "ETA"), ("OTHER-CHAMBER", "ETA-2") })
        {
            var created = await Client.PostAsJsonAsync("/api/contexts", new
            {
                code, product = FinWatch.Testing.TestProducts.TriGate, step = "FIN-PROFILE", parameter = "top_width_nm", chamber, chart_type = "xbar",
            });
            Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        }

        async Task<long> PointsAsync(string code) => (await Client.GetFromJsonAsync<JsonElement>($"/api/contexts/{code}")).GetProperty("points").GetInt64();
        Assert.Equal(20, await PointsAsync("BY-CHAMBER"));
        Assert.Equal(20, await PointsAsync("BY-TOOL"));
        Assert.Equal(0, await PointsAsync("OTHER-CHAMBER"));
    }
}
