using System.Globalization;
using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Server.Features.Reports;
using FinWatch.Statistics.Shewhart;
using FinWatch.Testing;
using Microsoft.Extensions.Configuration;
using static FinWatch.Testing.MonitorFixture;
using static FinWatch.Testing.ShiftFixture;
using FinWatch.Server.Infrastructure.Csv;

namespace FinWatch.Server.Tests.Features.Reports;

/// <summary>
/// The shift report over a hand-built history (default pattern, zone UTC; the fake clock starts 2026-12-01 08:00Z):
/// ShiftFixture's late shift (baseline B0001 and P0001 at 6.0 nm, lot L0001 with wafer means 6.02, 5.98, 6.02, 5.98 and
/// 7.5 nm firing WE1 only, acknowledged at 16:00), dispositioned and closed after midnight in the night shift, and lot N0001 after
/// midnight (6.0, 6.0, 7.6 nm: a new WE1 alert that belongs to the night shift of 2026-12-01).
/// </summary>
public class ShiftReportTests : IntegrationTest
{
    // σ_within = s̄/c4(5): every wafer has the sites 5.9…6.1 nm + offset, s = 0.0790569 nm (MonitorFixture), c4(5) from
    // the project's constants (0.9400, Montgomery, Appendix VI).
    private static readonly double SigmaWithin = 0.0790569415 / SummaryLimits.C4(5);

    private long lateAlert;
    private long nightAlert;

    private async Task HistoryAsync()
    {
        lateAlert = await ShiftFixture.LateShiftAsync(Client, Factory.Clock, "seen at the tool");

        Factory.Clock.SetUtcNow(Day.AddHours(25.5)); // 2026-12-02 01:30, still the night shift of 2026-12-01
        (await Client.PostAsJsonAsync($"/api/alerts/{lateAlert}/disposition", new
        {
            steps = new object[] { new { step = "Hold the lot", done = true }, new { step = "Check the etch chamber log", done = false, note = "log unavailable" } },
            comment = "held",
        })).EnsureSuccessStatusCode();
        Factory.Clock.SetUtcNow(Day.AddHours(26));
        (await Client.PostAsJsonAsync($"/api/alerts/{lateAlert}/close", new { comment = "chamber \"B\" recovered, re-measured" })).EnsureSuccessStatusCode();

        Factory.Clock.SetUtcNow(Day.AddHours(27));
        await IngestAsync(Client, Wafers("N0001", Day.AddHours(26.75), 0, 0, 1.6));
        nightAlert = (await ReadJsonAsync(await Client.GetAsync("/api/alerts?state=open"))).EnumerateArray().Single().GetProperty("id").GetInt64();
    }

    private async Task<JsonElement> ReportAsync(string query)
    {
        var response = await Client.GetAsync($"/api/reports/shift{query}");
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, body);
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    private static List<JsonElement> Items(JsonElement report, string section) => [.. report.GetProperty(section).EnumerateArray()];

    [Fact]
    public async Task LateShift_HasItsLotAlertAcknowledgementAndCapabilityChange()
    {
        await HistoryAsync();
        var r = await ReportAsync("?date=2026-12-01&shift=late");

        // Default pattern: late 14:00 for 8 h, UTC.
        Assert.Equal("late", r.GetProperty("shift").GetString());
        Assert.Equal(Day.AddHours(14), r.GetProperty("start").GetDateTimeOffset());
        Assert.Equal(Day.AddHours(22), r.GetProperty("end").GetDateTimeOffset());
        Assert.Equal("finished", r.GetProperty("status").GetString()); // the clock is at 2026-12-02 03:00

        // Only L0001 was measured 14:00–22:00: 5 wafers of 5 sites, wafer w at 14:30 + (w−1) min, site s at + (s−1) s.
        var lot = Assert.Single(Items(r, "lots_measured"));
        Assert.Equal("L0001", lot.GetProperty("lot_id").GetString());
        Assert.Equal(5, lot.GetProperty("wafer_count").GetInt32());
        Assert.Equal(25, lot.GetProperty("site_count").GetInt32());
        Assert.Equal(["ETA-1", "LNA-1"], lot.GetProperty("chambers").EnumerateArray().Select(c => c.GetString())); // SiteRow defaults
        Assert.Equal(Day.AddHours(14.5), lot.GetProperty("first_measured_at").GetDateTimeOffset());
        Assert.Equal(Day.AddHours(14.5).AddMinutes(4).AddSeconds(4), lot.GetProperty("last_measured_at").GetDateTimeOffset());

        // The WE1 alert raised at 15:00 on wafer 5 (7.5 nm), acknowledged at 16:00: acknowledged at the shift's end.
        var alertApi = await ReadJsonAsync(await Client.GetAsync($"/api/alerts/{lateAlert}"));
        var raised = Assert.Single(Items(r, "alerts_raised"));
        Assert.Equal(lateAlert, raised.GetProperty("id").GetInt64());
        Assert.Equal("WE1", raised.GetProperty("rule").GetString());
        Assert.Equal("TRI-TOP", raised.GetProperty("context").GetString());
        Assert.Equal(5, raised.GetProperty("wafer_slot").GetInt32());
        Assert.Equal("acknowledged", raised.GetProperty("state_at_shift_end").GetString());
        Assert.Equal(alertApi.GetProperty("alert").GetProperty("severity").GetString(), raised.GetProperty("severity").GetString());
        Assert.Equal(alertApi.GetProperty("alert").GetProperty("predicted_dvt_sat_mv").GetDouble(), raised.GetProperty("predicted_dvt_sat_mv").GetDouble(), 1e-9);
        Assert.True(raised.GetProperty("predicted_dvt_sat_mv").GetDouble() < -10, "a 1.5 nm wider top lowers VT,sat by well over 10 mV (G.4)");

        var action = Assert.Single(Items(r, "alert_actions"));
        Assert.Equal(("acknowledged", "seen at the tool", "test administrator"),
            (action.GetProperty("action").GetString(), action.GetProperty("comment").GetString(), action.GetProperty("by").GetString()));
        Assert.Equal(Day.AddHours(16), action.GetProperty("at").GetDateTimeOffset());

        var open = Assert.Single(Items(r, "alerts_open_at_end"));
        Assert.Equal(lateAlert, open.GetProperty("id").GetInt64());
        var ooc = Assert.Single(Items(r, "contexts_out_of_control"));
        Assert.Equal(("TRI-TOP", 1), (ooc.GetProperty("context").GetString(), ooc.GetProperty("alerts_not_closed").GetInt32()));

        // Five wafers with a prediction; the largest |ΔVT sat| is the 7.5 nm wafer, the alert's own value.
        var risks = Items(r, "dvt_risks");
        Assert.Equal(5, risks.Count);
        Assert.Equal(("L0001", 5), (risks[0].GetProperty("lot_id").GetString(), risks[0].GetProperty("wafer_slot").GetInt32()));
        Assert.Equal(raised.GetProperty("predicted_dvt_sat_mv").GetDouble(), risks[0].GetProperty("predicted_dvt_sat_mv").GetDouble(), 1e-9);
        Assert.Equal("ETA-1", risks[0].GetProperty("chamber").GetString());
        Assert.Contains("electrical test", r.GetProperty("prediction_caution").GetString(), StringComparison.Ordinal);

        // Cpk = min(USL − μ, μ − LSL)/(3σ) with LSL 5.5, USL 6.5 nm, σ = s̄/c4(5) = 0.08410 nm (hand computation):
        // shift μ = (6.02 + 5.98 + 6.02 + 5.98 + 7.5)/5 = 6.3 → 0.2/(3σ) = 0.7927; previous 7 days (2026-11-24 14:00 to
        // the start) only P0001, μ = 6.0 → 0.5/(3σ) = 1.9817. The baseline of 2026-11-20 is older than 7 days.
        var cap = Assert.Single(Items(r, "capability_changes"));
        Assert.Equal("nm", cap.GetProperty("unit").GetString());
        var shift = cap.GetProperty("shift");
        var previous = cap.GetProperty("previous_seven_days");
        Assert.Equal(5, shift.GetProperty("points").GetInt32());
        Assert.Equal(5, previous.GetProperty("points").GetInt32());
        Assert.Equal(6.3, shift.GetProperty("mean").GetDouble(), 1e-9);
        Assert.Equal(SigmaWithin, shift.GetProperty("sigma_within").GetDouble(), 1e-9);
        Assert.Equal(0.2 / (3 * SigmaWithin), shift.GetProperty("cpk").GetDouble(), 1e-9);
        Assert.Equal(0.5 / (3 * SigmaWithin), previous.GetProperty("cpk").GetDouble(), 1e-9);
        Assert.Equal(0.7927, shift.GetProperty("cpk").GetDouble(), 4);
        Assert.Equal((0.2 - 0.5) / (3 * SigmaWithin), cap.GetProperty("cpk_change").GetDouble(), 1e-9);
        Assert.Equal(Day.AddDays(-7).AddHours(14), previous.GetProperty("from").GetDateTimeOffset());

        // The 7 days to the shift's end (2026-11-24 22:00 to 2026-12-01 22:00): P0001 and L0001, μ = (5·6.0 + 31.5)/10
        // = 6.15 → Cpk = 0.35/(3σ) = 1.387 (hand computation); the chart is out of control at the end, so not stable.
        var week = cap.GetProperty("last_seven_days");
        Assert.Equal((10, Day.AddDays(-7).AddHours(22), Day.AddHours(22)),
            (week.GetProperty("points").GetInt32(), week.GetProperty("from").GetDateTimeOffset(), week.GetProperty("to").GetDateTimeOffset()));
        Assert.Equal(6.15, week.GetProperty("mean").GetDouble(), 1e-9);
        Assert.Equal(0.35 / (3 * SigmaWithin), week.GetProperty("cpk").GetDouble(), 1e-9);
        Assert.Equal("out_of_control", cap.GetProperty("state_at_shift_end").GetString());

        // Titles beside the codes, and what needs action at the end: one alert not closed (acknowledged), one chart.
        var title = ooc.GetProperty("title").GetString();
        Assert.Equal("TP-TRI FIN-PROFILE top_width_nm", title); // made from product, step and parameter (no title given)
        Assert.Equal(title, cap.GetProperty("context_title").GetString());
        Assert.Equal(title, action.GetProperty("context_title").GetString());
        Assert.Equal(title, risks[0].GetProperty("context_title").GetString());
        Assert.Equal(["one point beyond a 3σ limit"], Assert.Single(Items(r, "signals_measured")).GetProperty("rule_texts").EnumerateArray().Select(t => t.GetString()));
        var needs = r.GetProperty("needs_action");
        Assert.Equal((1, 0, 1), (needs.GetProperty("alerts_not_closed").GetInt32(), needs.GetProperty("alerts_not_acknowledged").GetInt32(),
            needs.GetProperty("charts_out_of_control").GetInt32()));
    }

    [Fact]
    public async Task SignalsCountByTheirMeasuredTime_AsWellAsByWhenTheyWereRaised()
    {
        // The late alert is handled and closed by 17:00; lot L0002, measured at 21:00 (late shift), is uploaded at 23:00
        // (night shift) with a wafer 1.5 nm wide: a new excursion raised in the night for a signal measured in the late shift.
        lateAlert = await ShiftFixture.LateShiftAsync(Client, Factory.Clock, "seen at the tool");
        Factory.Clock.SetUtcNow(Day.AddHours(16.5));
        (await Client.PostAsJsonAsync($"/api/alerts/{lateAlert}/disposition", new
        {
            steps = new object[] { new { step = "Hold the lot", done = true }, new { step = "Check the etch chamber log", done = true } },
        })).EnsureSuccessStatusCode();
        Factory.Clock.SetUtcNow(Day.AddHours(17));
        (await Client.PostAsJsonAsync($"/api/alerts/{lateAlert}/close", new { comment = "re-measured" })).EnsureSuccessStatusCode();
        Factory.Clock.SetUtcNow(Day.AddHours(23));
        await IngestAsync(Client, Wafers("L0002", Day.AddHours(21), 1.5));
        var later = (await ReadJsonAsync(await Client.GetAsync("/api/alerts?state=open"))).EnumerateArray().Single().GetProperty("id").GetInt64();
        Factory.Clock.SetUtcNow(Day.AddHours(31));

        var late = await ReportAsync("?date=2026-12-01&shift=late");
        Assert.Equal([lateAlert], Items(late, "alerts_raised").Select(a => a.GetProperty("id").GetInt64()));
        var measured = Items(late, "signals_measured");
        Assert.Equal([lateAlert, later], measured.Select(m => m.GetProperty("alert_id").GetInt64()));
        Assert.True(measured[0].GetProperty("raised_in_shift").GetBoolean());
        Assert.False(measured[1].GetProperty("raised_in_shift").GetBoolean());
        Assert.Equal(Day.AddHours(23), measured[1].GetProperty("raised_at").GetDateTimeOffset());
        Assert.Equal(Day.AddHours(21).AddSeconds(4), measured[1].GetProperty("first_measured_at").GetDateTimeOffset()); // wafer 1, last site
        Assert.Equal(1, measured[1].GetProperty("signal_points").GetInt32());

        var night = await ReportAsync("?date=2026-12-01&shift=night");
        var raised = Assert.Single(Items(night, "alerts_raised"));
        Assert.Equal(later, raised.GetProperty("id").GetInt64());
        Assert.Equal(Day.AddHours(21).AddSeconds(4), raised.GetProperty("first_signal_measured_at").GetDateTimeOffset());
        Assert.Empty(Items(night, "signals_measured")); // nothing was measured in the night
    }

    private async Task RecordMaintenanceAsync(string chamber, string kind, DateTimeOffset at, string note)
    {
        var response = await Client.PostAsJsonAsync("/api/maintenance", new { chamber, kind, occurred_at = at, performed_by = "Crew Amber", note });
        Assert.True(response.IsSuccessStatusCode, await response.Content.ReadAsStringAsync());
    }

    [Fact]
    public async Task Maintenance_FinishedInTheShift_IsListedInTimeOrder_WithTheChartsOfItsChamber()
    {
        // The late shift runs [14:00, 22:00). A chart of ETA-1 only beside TRI-TOP (every chamber); four events recorded at
        // 23:00: one a millisecond before the start (early shift), one at the start, one a millisecond before the end, one
        // at the end (night shift).
        await ShiftFixture.LateShiftAsync(Client, Factory.Clock, "seen at the tool");
        (await Client.PostAsJsonAsync("/api/contexts", new
        {
            code = "TRI-TOP-ETA1", title = "Top width, etch chamber ETA-1", product = TestProducts.TriGate, step = "FIN-PROFILE",
            parameter = "top_width_nm", chamber = "ETA-1", chart_type = "xbar", subgroup = "wafer", rules = "westernElectric",
        })).EnsureSuccessStatusCode();
        Factory.Clock.SetUtcNow(Day.AddHours(23));
        await RecordMaintenanceAsync("ETA-1", "part_replacement", Day.AddHours(14).AddMilliseconds(-1), "edge ring");
        await RecordMaintenanceAsync("LNA-1", "seasoning", Day.AddHours(22).AddMilliseconds(-1), "");
        await RecordMaintenanceAsync("ETA-1", "wet_clean", Day.AddHours(14), "opened after 1200 RF hours, \"B\" side");
        await RecordMaintenanceAsync("ETA-1", "repair", Day.AddHours(22), "RF match");

        var late = Items(await ReportAsync("?date=2026-12-01&shift=late"), "maintenance_performed");
        Assert.Equal([("ETA-1", "wet_clean"), ("LNA-1", "seasoning")], late.Select(m => (m.GetProperty("chamber").GetString(), m.GetProperty("kind").GetString())));
        Assert.Equal([Day.AddHours(14), Day.AddHours(22).AddMilliseconds(-1)], late.Select(m => m.GetProperty("occurred_at").GetDateTimeOffset()));
        Assert.Equal(("Crew Amber", "opened after 1200 RF hours, \"B\" side", "test administrator"),
            (late[0].GetProperty("performed_by").GetString(), late[0].GetProperty("note").GetString(), late[0].GetProperty("recorded_by").GetString()));
        var chart = Assert.Single(late[0].GetProperty("contexts").EnumerateArray());
        Assert.Equal(("TRI-TOP-ETA1", "Top width, etch chamber ETA-1"), (chart.GetProperty("context").GetString(), chart.GetProperty("context_title").GetString()));
        Assert.Empty(late[1].GetProperty("contexts").EnumerateArray()); // TRI-TOP watches every chamber, so names none

        // The events at the edges belong to the neighbouring shifts.
        var early = Assert.Single(Items(await ReportAsync("?date=2026-12-01&shift=early"), "maintenance_performed"));
        Assert.Equal(("part_replacement", Day.AddHours(14).AddMilliseconds(-1)), (early.GetProperty("kind").GetString(), early.GetProperty("occurred_at").GetDateTimeOffset()));
        var night = Assert.Single(Items(await ReportAsync("?date=2026-12-01&shift=night"), "maintenance_performed"));
        Assert.Equal(("repair", Day.AddHours(22)), (night.GetProperty("kind").GetString(), night.GetProperty("occurred_at").GetDateTimeOffset()));

        // The CSV has the same rows.
        var sections = await CsvSectionsAsync("/api/reports/shift.csv?date=2026-12-01&shift=late");
        var rows = sections["maintenance_performed"];
        Assert.Equal(2, rows.Count);
        Assert.Equal(late[0].GetProperty("id").GetInt64().ToString(CultureInfo.InvariantCulture), rows[0]["maintenance_id"]);
        Assert.Equal(("ETA-1", "wet_clean", "2026-12-01T14:00:00.000Z", "Crew Amber"), (rows[0]["chamber"], rows[0]["kind"], rows[0]["occurred_at"], rows[0]["performed_by"]));
        Assert.Equal(("opened after 1200 RF hours, \"B\" side", "test administrator"), (rows[0]["note"], rows[0]["recorded_by"]));
        Assert.Equal(("TRI-TOP-ETA1", "Top width, etch chamber ETA-1"), (rows[0]["contexts"], rows[0]["context_titles"]));
        Assert.Equal(("LNA-1", "seasoning", "2026-12-01T21:59:59.999Z"), (rows[1]["chamber"], rows[1]["kind"], rows[1]["occurred_at"]));
        Assert.Equal(("", ""), (rows[1]["note"], rows[1]["contexts"]));
    }

    [Fact]
    public async Task NightShift_RunsAcrossMidnight_AndBelongsToTheDateItStartsOn()
    {
        await HistoryAsync();
        var r = await ReportAsync("?date=2026-12-01&shift=night");
        Assert.Equal(Day.AddHours(22), r.GetProperty("start").GetDateTimeOffset());
        Assert.Equal(Day.AddHours(30), r.GetProperty("end").GetDateTimeOffset()); // 2026-12-02 06:00
        Assert.Equal("in_progress", r.GetProperty("status").GetString()); // the clock is at 03:00

        // N0001 measured at 02:45 on 2026-12-02 and its WE1 alert raised at 03:00 belong to the night of 2026-12-01.
        Assert.Equal(["N0001"], Items(r, "lots_measured").Select(l => l.GetProperty("lot_id").GetString()));
        var raised = Assert.Single(Items(r, "alerts_raised"));
        Assert.Equal((nightAlert, 3, "open"), (raised.GetProperty("id").GetInt64(), raised.GetProperty("wafer_slot").GetInt32(), raised.GetProperty("state_at_shift_end").GetString()));

        // The late shift's alert was dispositioned at 01:30 (with the steps) and closed at 02:00.
        var actions = Items(r, "alert_actions");
        Assert.Equal(["dispositioned", "closed"], actions.Select(a => a.GetProperty("action").GetString()));
        Assert.All(actions, a => Assert.Equal(lateAlert, a.GetProperty("alert_id").GetInt64()));
        var steps = actions[0].GetProperty("steps").EnumerateArray().ToList();
        Assert.Equal(("Hold the lot", true), (steps[0].GetProperty("step").GetString(), steps[0].GetProperty("done").GetBoolean()));
        Assert.Equal("log unavailable", steps[1].GetProperty("note").GetString());
        Assert.Equal("chamber \"B\" recovered, re-measured", actions[1].GetProperty("comment").GetString());
        Assert.Equal(Day.AddHours(26), actions[1].GetProperty("at").GetDateTimeOffset());

        // At the end only the night alert is not closed; the context is still out of control.
        Assert.Equal([nightAlert], Items(r, "alerts_open_at_end").Select(a => a.GetProperty("id").GetInt64()));
        Assert.Equal(["TRI-TOP"], Items(r, "contexts_out_of_control").Select(c => c.GetProperty("context").GetString()));

        // Three points in the shift: fewer than the 5 needed, so no Cpk and the reason says so. Previous 7 days
        // (2026-11-24 22:00 to 2026-12-01 22:00): P0001 and L0001, μ = (5·6.0 + 31.5)/10 = 6.15 → Cpk = 0.35/(3σ) (hand computation).
        var cap = Assert.Single(Items(r, "capability_changes"));
        var shift = cap.GetProperty("shift");
        Assert.Equal(3, shift.GetProperty("points").GetInt32());
        Assert.Equal(JsonValueKind.Null, shift.GetProperty("cpk").ValueKind);
        Assert.Equal("3 points; Cpk needs at least 5", shift.GetProperty("reason").GetString()); // in words, no configuration key
        Assert.Equal(10, cap.GetProperty("previous_seven_days").GetProperty("points").GetInt32());
        Assert.Equal(0.35 / (3 * SigmaWithin), cap.GetProperty("previous_seven_days").GetProperty("cpk").GetDouble(), 1e-9);
        Assert.Equal(JsonValueKind.Null, cap.GetProperty("cpk_change").ValueKind);
    }

    [Fact]
    public async Task EarlyShift_BeforeTheLateLot_HasEmptySections()
    {
        await HistoryAsync();
        var r = await ReportAsync("?date=2026-12-01&shift=early");
        Assert.Equal(Day.AddHours(6), r.GetProperty("start").GetDateTimeOffset());
        foreach (var section in new[] { "lots_measured", "alerts_raised", "signals_measured", "alert_actions", "maintenance_performed", "alerts_open_at_end",
            "contexts_out_of_control", "dvt_risks" })
        {
            Assert.True(Items(r, section).Count == 0, $"{section} should be empty before 14:00: {r.GetProperty(section)}");
        }

        // The capability row is there, with no points in the shift.
        Assert.Equal(0, Assert.Single(Items(r, "capability_changes")).GetProperty("shift").GetProperty("points").GetInt32());
    }

    [Fact]
    public async Task NoDateOrShift_GivesTheLastFinishedShift()
    {
        await HistoryAsync();
        var r = await ReportAsync(""); // the clock is at 2026-12-02 03:00, in the night shift: the late one finished last
        Assert.Equal(("late", "2026-12-01"), (r.GetProperty("shift").GetString(), r.GetProperty("date").GetString()));
        Assert.Equal(["early", "late", "night"], r.GetProperty("shifts").EnumerateArray().Select(s => s.GetString()));
    }

    [Theory]
    [InlineData("?date=2026-13-01&shift=early", "date", "'2026-13-01'")]
    [InlineData("?date=1.12.2026&shift=early", "date", "YYYY-MM-DD")]
    [InlineData("?date=2026-12-01&shift=noon", "shift", "'noon' is not a shift of the pattern; the shifts are early, late, night")]
    [InlineData("?date=2026-12-01", "shift", "shift is required")]
    [InlineData("?shift=late", "date", "date is required")]
    [InlineData("?date=2026-12-01&shift=late&format=xml", "format", "'xml'")]
    public async Task BadDateOrShift_IsA400ProblemNamingTheParameterAndValue(string query, string parameter, string message)
    {
        foreach (var path in new[] { "/api/reports/shift", "/api/reports/shift.csv" })
        {
            if (path.EndsWith(".csv", StringComparison.Ordinal) && parameter == "format")
            {
                continue;
            }

            var response = await Client.GetAsync(path + query);
            Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
            Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
            var problem = await ReadJsonAsync(response);
            Assert.Contains(message, problem.GetProperty("errors").GetProperty(parameter)[0].GetString(), StringComparison.Ordinal);
            Assert.Contains(message, problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
        }
    }

    [Fact]
    public async Task Csv_ParsesBackToTheSameSections()
    {
        await HistoryAsync();
        var json = await ReportAsync("?date=2026-12-01&shift=night");
        var response = await Client.GetAsync("/api/reports/shift.csv?date=2026-12-01&shift=night");
        response.EnsureSuccessStatusCode();
        Assert.Equal("text/csv", response.Content.Headers.ContentType?.MediaType);
        Assert.Equal("finwatch-shift-2026-12-01-night.csv", response.Content.Headers.ContentDisposition?.FileNameStar ?? response.Content.Headers.ContentDisposition?.FileName);
        var bytes = await response.Content.ReadAsByteArrayAsync();
        Assert.Equal(bytes, await Client.GetByteArrayAsync("/api/reports/shift?date=2026-12-01&shift=night&format=csv"));

        var records = await CsvRecordsAsync(bytes);
        var sections = Sections(records);
        Assert.Equal(["shift", "needs_action", "handover", "lots_measured", "alerts_raised", "signals_measured", "alert_actions", "maintenance_performed", "alerts_open_at_end",
                "contexts_out_of_control", "dvt_risks", "capability_changes"],
            records.Select(r => r[0]).Distinct());

        Assert.Equal("night", sections["shift"][0]["shift"]);
        Assert.Equal("2026-12-01T22:00:00.000Z", sections["shift"][0]["start"]);
        Assert.Equal(json.GetProperty("prediction_caution").GetString(), sections["shift"][0]["prediction_caution"]);
        Assert.Equal("N0001", Assert.Single(sections["lots_measured"])["lot_id"]);
        Assert.Equal("15", sections["lots_measured"][0]["site_count"]);
        Assert.Equal("ETA-1; LNA-1", sections["lots_measured"][0]["chambers"]);
        var raised = Assert.Single(sections["alerts_raised"]);
        Assert.Equal(json.GetProperty("alerts_raised")[0].GetProperty("predicted_dvt_sat_mv").GetDouble(), double.Parse(raised["predicted_dvt_sat_mv"], CultureInfo.InvariantCulture));
        var actions = sections["alert_actions"];
        Assert.Equal(["dispositioned", "closed"], actions.Select(a => a["action"]));
        Assert.Equal("Hold the lot: done | Check the etch chamber log: not done (log unavailable)", actions[0]["steps"]);
        Assert.Equal("chamber \"B\" recovered, re-measured", actions[1]["comment"]); // quotes and comma survive the quoting
        Assert.Equal(nightAlert.ToString(CultureInfo.InvariantCulture), Assert.Single(sections["alerts_open_at_end"])["alert_id"]);
        Assert.Equal("TRI-TOP", Assert.Single(sections["contexts_out_of_control"])["context"]);
        Assert.Equal(3, sections["dvt_risks"].Count);
        var cap = Assert.Single(sections["capability_changes"]);
        Assert.Equal("", cap["shift_cpk"]);
        Assert.Contains("3 points", cap["shift_reason"], StringComparison.Ordinal);
        Assert.Equal(0.35 / (3 * SigmaWithin), double.Parse(cap["previous_seven_days_cpk"], CultureInfo.InvariantCulture), 1e-9);
        Assert.Equal(Encoding.UTF8.GetString(bytes).Split("\r\n").Length - 1, records.Count); // CRLF after every record, no bare LF inside
    }

    // Read back with the project's RFC 4180 reader: one width throughout.
    private static async Task<List<string[]>> CsvRecordsAsync(byte[] bytes)
    {
        var records = new List<string[]>();
        using (var reader = new CsvRecordReader(new MemoryStream(bytes)))
        {
            var fields = new List<string>();
            while (await reader.ReadRecordAsync(fields, CancellationToken.None))
            {
                records.Add([.. fields]);
            }
        }

        Assert.Single(records.Select(r => r.Length).Distinct());
        return records;
    }

    // Each section's rows by column name (the padding left out), after the header row that opens the section.
    private static Dictionary<string, List<Dictionary<string, string>>> Sections(List<string[]> records) =>
        records.GroupBy(r => r[0]).ToDictionary(g => g.Key, g =>
        {
            var header = g.First();
            Assert.Equal("header", header[1]);
            return g.Skip(1).Select(r => header.Skip(2).Zip(r.Skip(2)).Where(p => p.First.Length > 0).ToDictionary(p => p.First, p => p.Second)).ToList();
        });

    private async Task<Dictionary<string, List<Dictionary<string, string>>>> CsvSectionsAsync(string path)
    {
        var response = await Client.GetAsync(path);
        response.EnsureSuccessStatusCode();
        return Sections(await CsvRecordsAsync(await response.Content.ReadAsByteArrayAsync()));
    }
}

/// <summary>A configured pattern in another zone: the pattern replaces the default one and starts follow the zone's offset.</summary>
public class ShiftZoneTests : IntegrationTest
{
    public ShiftZoneTests()
    {
        Factory.With("FinWatch:Shifts:TimeZone", "Europe/Berlin")
            .With("FinWatch:Shifts:Pattern:0:Name", "day").With("FinWatch:Shifts:Pattern:0:Start", "06:00").With("FinWatch:Shifts:Pattern:0:LengthHours", "12")
            .With("FinWatch:Shifts:Pattern:1:Name", "night").With("FinWatch:Shifts:Pattern:1:Start", "18:00").With("FinWatch:Shifts:Pattern:1:LengthHours", "12");
    }

    [Fact]
    public async Task Zone_ShiftsStartAtTheLocalTime_WinterAndSummer()
    {
        // Europe/Berlin is UTC+1 in December and UTC+2 in July (IANA tz database).
        await IngestAsync(Client, Wafers("Z0001", new DateTimeOffset(2026, 12, 1, 5, 30, 0, TimeSpan.Zero), 0)); // 06:30 in Berlin
        var winter = await ReadJsonAsync(await Client.GetAsync("/api/reports/shift?date=2026-12-01&shift=day"));
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 5, 0, 0, TimeSpan.Zero), winter.GetProperty("start").GetDateTimeOffset());
        Assert.Equal(new DateTimeOffset(2026, 12, 1, 17, 0, 0, TimeSpan.Zero), winter.GetProperty("end").GetDateTimeOffset());
        Assert.Equal("Europe/Berlin", winter.GetProperty("time_zone").GetString());
        Assert.Equal(["day", "night"], winter.GetProperty("shifts").EnumerateArray().Select(s => s.GetString()));
        Assert.Equal(["Z0001"], winter.GetProperty("lots_measured").EnumerateArray().Select(l => l.GetProperty("lot_id").GetString()));

        var summer = await ReadJsonAsync(await Client.GetAsync("/api/reports/shift?date=2026-07-01&shift=night"));
        Assert.Equal(new DateTimeOffset(2026, 7, 1, 16, 0, 0, TimeSpan.Zero), summer.GetProperty("start").GetDateTimeOffset());

        // The default pattern's early shift is not configured here.
        Assert.Equal(HttpStatusCode.BadRequest, (await Client.GetAsync("/api/reports/shift?date=2026-12-01&shift=early")).StatusCode);

        // The clock is at 2026-12-01 08:00Z = 09:00 in Berlin: the night shift of 2026-11-30 (18:00–06:00 local) finished last.
        var last = await ReadJsonAsync(await Client.GetAsync("/api/reports/shift"));
        Assert.Equal(("night", "2026-11-30"), (last.GetProperty("shift").GetString(), last.GetProperty("date").GetString()));
    }
}

/// <summary>A wrong pattern stops the server at start with the setting named.</summary>
public class ShiftOptionsTests
{
    [Theory]
    [InlineData("FinWatch:Shifts:TimeZone", "Mars/Olympus", "TimeZone 'Mars/Olympus'")]
    [InlineData("FinWatch:Shifts:Pattern:0:Start", "25:00", "Start '25:00'")]
    public void BadPattern_FailsAtStart(string key, string value, string message)
    {
        using var factory = new FinWatchAppFactory().With(key, value);
        if (key.Contains("Pattern", StringComparison.Ordinal))
        {
            factory.With("FinWatch:Shifts:Pattern:0:Name", "day").With("FinWatch:Shifts:Pattern:0:LengthHours", "8");
        }

        var e = Assert.ThrowsAny<Exception>(() => factory.CreateClient());
        Assert.Contains(message, e.ToString(), StringComparison.Ordinal);
    }

    [Fact]
    public void DocumentedExample_IsAValidPatternThatReplacesTheDefault()
    {
        var block = Regex.Matches(TestPaths.DocumentationText(), "```json\n(?<body>.*?)```", RegexOptions.Singleline)
            .Select(m => m.Groups["body"].Value).Single(b => b.Contains("\"Shifts\"", StringComparison.Ordinal));
        var configuration = new ConfigurationBuilder().AddJsonStream(new MemoryStream(Encoding.UTF8.GetBytes(block))).Build();
        var options = new ShiftOptions();
        configuration.GetSection(ShiftOptions.Section).Bind(options);
        Assert.True(new ShiftOptionsValidator().Validate(null, options).Succeeded);
        Assert.Equal(["day", "night"], options.EffectivePattern.Select(s => s.Name));
    }
}
