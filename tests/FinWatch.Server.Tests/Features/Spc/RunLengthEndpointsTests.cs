using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using FinWatch.Statistics.RunLength;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Spc;

/// <summary>
/// The alarm budget endpoints (docs/statistics.md §4.5). The test clock stands at 2026-12-01 08:00 UTC; the rate window
/// of 14 days starts 2026-11-17 08:00. Each context sees 20 wafers measured on 2026-11-10 (before the window) and
/// 4 wafers on each of the 7 days 2026-11-18 to 2026-11-24: 28 points in the window, 2 points per day.
/// </summary>
public class RunLengthEndpointsTests : IntegrationTest
{
    internal const double PointsPerDay = 28 / 14.0;

    internal static async Task SeedAsync(HttpClient client)
    {
        await IngestAsync(client, Wafers("R0000", new DateTimeOffset(2026, 11, 10, 6, 0, 0, TimeSpan.Zero), new double[20]));
        for (var day = 0; day < 7; day++)
        {
            await IngestAsync(client, Wafers($"R{day + 1:0000}", new DateTimeOffset(2026, 11, 18 + day, 6, 0, 0, TimeSpan.Zero), new double[4]));
        }
    }

    private async Task<JsonElement> GetOkAsync(string url)
    {
        var response = await Client.GetAsync(url);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, body);
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    private async Task<JsonElement> PostOkAsync(object request)
    {
        var response = await Client.PostAsJsonAsync("/api/contexts/run-length", request);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, body);
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    private static async Task<JsonElement> AssertInvalidAsync(HttpResponseMessage response, string field, string value)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.BadRequest, body);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = JsonDocument.Parse(body).RootElement.Clone();
        var messages = problem.GetProperty("errors").GetProperty(field).EnumerateArray().Select(m => m.GetString()!).ToList();
        Assert.Contains(messages, m => m.Contains(value, StringComparison.Ordinal));
        return problem;
    }

    // hours = ARL / rate × 24, with the rate of the seeded points (2 per day) and the ARL of the engine: 91.75 points for
    // WE1–WE4 in control (Champ & Woodall 1987, value from memory [M], reproduced by the exact chain).
    [Fact]
    public async Task GetContext_KnownPointRate_GivesHoursAsArlOverRateTimes24()
    {
        await SeedAsync(Client);
        await ApprovedContextAsync(Client, "RL-WE");

        var r = await GetOkAsync("/api/contexts/RL-WE/run-length");

        Assert.Equal("RL-WE", r.GetProperty("context").GetString());
        Assert.Equal("monitoring", r.GetProperty("phase").GetString());
        Assert.Equal(["WE1", "WE2", "WE3", "WE4"], r.GetProperty("rules").EnumerateArray().Select(e => e.GetString()));
        Assert.Equal(28, r.GetProperty("rate").GetProperty("points").GetInt32());
        Assert.Equal(14, r.GetProperty("rate").GetProperty("days").GetDouble(), 1e-9);
        Assert.Equal("2026-11-17T08:00:00Z", r.GetProperty("rate").GetProperty("from").GetString());
        Assert.Equal(PointsPerDay, r.GetProperty("points_per_day").GetDouble(), 1e-12);
        var falseAlarm = r.GetProperty("false_alarm");
        Assert.Equal(0, falseAlarm.GetProperty("shift_sigma").GetDouble());
        Assert.Equal(91.75, falseAlarm.GetProperty("points").GetDouble(), 0.005);
        Assert.Equal(falseAlarm.GetProperty("points").GetDouble() / PointsPerDay * 24, falseAlarm.GetProperty("hours").GetDouble(), 1e-9);
        Assert.Equal("exact Markov chain", falseAlarm.GetProperty("method").GetString());
        Assert.Equal(PointsPerDay / falseAlarm.GetProperty("points").GetDouble(), r.GetProperty("false_alarms_per_day").GetDouble(), 1e-12);
        var detection = r.GetProperty("detection").EnumerateArray().ToList();
        Assert.Equal([1.0, 2.0], detection.Select(d => d.GetProperty("shift_sigma").GetDouble()));
        foreach (var d in detection)
        {
            // The exact chain's ARL at the shift (the engine itself, docs/statistics.md §4.3), converted at the same rate.
            var exact = AverageRunLength.ShewhartWithRules(["WE1", "WE2", "WE3", "WE4"], d.GetProperty("shift_sigma").GetDouble());
            Assert.Equal(exact, d.GetProperty("points").GetDouble(), 1e-9);
            Assert.Equal(exact / PointsPerDay * 24, d.GetProperty("hours").GetDouble(), 1e-9);
        }
    }

    // A chart younger than the window: its rate counts from its first point (here 4 wafers measured about 2 days before now).
    [Fact]
    public async Task GetContext_ChartYoungerThanWindow_RateCountsFromItsFirstPoint()
    {
        await IngestAsync(Client, Wafers("Y0001", new DateTimeOffset(2026, 11, 29, 8, 0, 0, TimeSpan.Zero), new double[4]));
        await CreateContextAsync(Client, "RL-YOUNG", rules: "WE1");

        var r = await GetOkAsync("/api/contexts/RL-YOUNG/run-length");

        // A wafer's point is measured at its last site, 4 s after the wafer's first: 2 days less 4 s before now.
        Assert.Equal("2026-11-29T08:00:04Z", r.GetProperty("rate").GetProperty("from").GetString());
        var days = 2 - (4 / 86_400.0);
        Assert.Equal(days, r.GetProperty("rate").GetProperty("days").GetDouble(), 1e-12);
        Assert.Equal(4 / days, r.GetProperty("points_per_day").GetDouble(), 1e-12);
        Assert.Equal("baseline", r.GetProperty("phase").GetString());
        Assert.Contains(r.GetProperty("notes").EnumerateArray(), n => n.GetString()!.Contains("no approved limits", StringComparison.Ordinal));
    }

    [Fact]
    public async Task GetContext_UnknownCode_Returns404ProblemNamingIt()
    {
        var response = await Client.GetAsync("/api/contexts/NO-SUCH/run-length");

        Assert.Equal(HttpStatusCode.NotFound, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var problem = await ReadJsonAsync(response);
        Assert.Equal("/problems/not-found", problem.GetProperty("type").GetString());
        Assert.Contains("NO-SUCH", problem.GetProperty("detail").GetString(), StringComparison.Ordinal);
    }

    // In-control ARLs through the endpoint: 370.4 for the plain 3σ chart (Montgomery, Introduction to Statistical Quality
    // Control); 225.44 for rules 1 + 2 and 91.75 for rules 1–4 (Champ & Woodall 1987, Technometrics 29(4), values from
    // memory [M]); 511 = 2⁹ − 1 for N2 alone (Feller, vol. 1, ch. XIII, run of nine equal fair-coin outcomes).
    [Theory]
    [InlineData(new[] { "WE1" }, 370.4, 0.05)]
    [InlineData(new[] { "N1" }, 370.4, 0.05)]
    [InlineData(new[] { "WE1", "WE2" }, 225.44, 0.005)]
    [InlineData(new[] { "westernElectric" }, 91.75, 0.005)]
    [InlineData(new[] { "N2" }, 511, 1e-9)]
    public async Task Post_ExactRuleSets_GivePublishedInControlArl(string[] rules, double published, double tolerance)
    {
        var r = await PostOkAsync(new { chart_type = "individuals", rules, points_per_day = 48.0 });

        var falseAlarm = r.GetProperty("false_alarm");
        Assert.Equal(published, falseAlarm.GetProperty("points").GetDouble(), tolerance);
        Assert.Equal("exact Markov chain", falseAlarm.GetProperty("method").GetString());
        Assert.Equal(0, falseAlarm.GetProperty("standard_error_points").GetDouble());
        Assert.Equal(falseAlarm.GetProperty("points").GetDouble() / 2, falseAlarm.GetProperty("hours").GetDouble(), 1e-9); // 48 per day: 2 per hour
        Assert.Equal(JsonValueKind.Null, r.GetProperty("context").ValueKind);
    }

    // Nelson's trend and alternation tests have no exact chain: the answer is simulated and says so, with its standard
    // error; the figures are those of the seeded library simulation (internal consistency, docs/statistics.md §4.5).
    [Fact]
    public async Task Post_NelsonRules_AreSimulatedAndSaySo()
    {
        var r = await PostOkAsync(new { chart_type = "xbar", rules = new[] { "nelson" } });

        var falseAlarm = r.GetProperty("false_alarm");
        var expected = RuleSetRunLength.Estimate(Statistics.Rules.RunRules.Nelson, 0);
        Assert.Equal(expected.Points, falseAlarm.GetProperty("points").GetDouble(), 1e-9);
        Assert.Equal(expected.StandardError, falseAlarm.GetProperty("standard_error_points").GetDouble(), 1e-9);
        Assert.StartsWith($"simulation, {expected.Runs} runs, standard error ", falseAlarm.GetProperty("method").GetString(), StringComparison.Ordinal);
        Assert.EndsWith(" points", falseAlarm.GetProperty("method").GetString(), StringComparison.Ordinal);
        Assert.True(falseAlarm.GetProperty("standard_error_points").GetDouble() > 0);
        Assert.Equal(JsonValueKind.Null, falseAlarm.GetProperty("hours").ValueKind); // no rate given
        Assert.Equal(JsonValueKind.Null, r.GetProperty("false_alarms_per_day").ValueKind);
        Assert.Contains(r.GetProperty("notes").EnumerateArray(), n => n.GetString()!.Contains("No point rate", StringComparison.Ordinal));
        Assert.Equal(8, r.GetProperty("rules").GetArrayLength());
    }

    [Fact]
    public async Task Post_WithContext_UsesTheContextsRateAndTheRulesSent()
    {
        await SeedAsync(Client);
        await ApprovedContextAsync(Client, "RL-TRY");

        var r = await PostOkAsync(new { chart_type = "xbar", rules = new[] { "WE1" }, context = "RL-TRY" });

        Assert.Equal(PointsPerDay, r.GetProperty("points_per_day").GetDouble(), 1e-12);
        Assert.Equal(["WE1"], r.GetProperty("rules").EnumerateArray().Select(e => e.GetString()));
        var points = r.GetProperty("false_alarm").GetProperty("points").GetDouble();
        Assert.Equal(370.4, points, 0.05); // Montgomery, 3σ Shewhart chart
        Assert.Equal(points / PointsPerDay * 24, r.GetProperty("false_alarm").GetProperty("hours").GetDouble(), 1e-9);
    }

    [Fact]
    public async Task Post_BadRuleId_Returns400NamingTheFieldAndTheValue()
    {
        var response = await Client.PostAsJsonAsync("/api/contexts/run-length", new { chart_type = "xbar", rules = new[] { "WE1", "WE9" } });

        await AssertInvalidAsync(response, "rules", "'WE9'");
    }

    [Theory]
    [InlineData("""{"chart_type":"pareto","rules":["WE1"]}""", "chart_type", "'pareto'")]
    [InlineData("""{"rules":["WE1"]}""", "chart_type", "xbar or individuals")]
    [InlineData("""{"chart_type":"xbar","rules":[]}""", "rules", "give 1 to 20 rules")]
    [InlineData("""{"chart_type":"xbar","rules":["WE1"],"points_per_day":-3}""", "points_per_day", "-3")]
    [InlineData("""{"chart_type":"xbar","rules":["WE1"],"points_per_day":5,"context":"RL"}""", "points_per_day", "not both")]
    public async Task Post_InvalidBody_Returns400NamingTheField(string json, string field, string text)
    {
        var response = await Client.PostAsync("/api/contexts/run-length", new StringContent(json, Encoding.UTF8, "application/json"));

        await AssertInvalidAsync(response, field, text);
    }

    [Fact]
    public async Task Post_UnknownContext_Returns400NamingIt()
    {
        var response = await Client.PostAsJsonAsync("/api/contexts/run-length", new { chart_type = "xbar", rules = new[] { "WE1" }, context = "NO-SUCH" });

        await AssertInvalidAsync(response, "context", "'NO-SUCH'");
    }

    [Fact]
    public async Task Post_RulesOfTheWrongJsonType_Returns400ProblemNot500()
    {
        var response = await Client.PostAsync("/api/contexts/run-length", new StringContent("""{"chart_type":"xbar","rules":"WE1"}""", Encoding.UTF8, "application/json"));

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
    }

    // The floor's sum is the sum over the charts with approved limits (a chart in its baseline phase raises no alarms),
    // per day and for each 8-hour shift of the default pattern (per day × 8/24).
    [Fact]
    public async Task GetFloor_Sum_EqualsTheSumOverTheMonitoredCharts()
    {
        await SeedAsync(Client);
        await ApprovedContextAsync(Client, "RL-A");
        await CreateContextAsync(Client, "RL-B", rules: "WE1");
        await ApproveBaselineAsync(Client, "RL-B");
        await CreateContextAsync(Client, "RL-C", rules: "WE1,WE2"); // baseline phase: not counted

        var r = await GetOkAsync("/api/run-length");

        var charts = r.GetProperty("charts").EnumerateArray().ToList();
        Assert.Equal(["RL-A", "RL-B", "RL-C"], charts.Select(c => c.GetProperty("context").GetString()));
        var monitored = charts.Where(c => c.GetProperty("phase").GetString() == "monitoring").ToList();
        Assert.Equal(2, monitored.Count);
        Assert.Equal(2, r.GetProperty("charts_counted").GetInt32());
        var perDay = monitored.Sum(c => c.GetProperty("false_alarms_per_day").GetDouble());
        Assert.Equal(perDay, r.GetProperty("expected_false_alarms_per_day").GetDouble(), 1e-12);
        // By hand: 2 points per day over 91.75 (WE1–WE4 [M]) and over 370.4 (WE1) points between false alarms.
        Assert.Equal((2 / 91.75) + (2 / 370.4), perDay, 1e-4);
        var shifts = r.GetProperty("shifts").EnumerateArray().ToList();
        Assert.Equal(["early", "late", "night"], shifts.Select(s => s.GetProperty("name").GetString()));
        Assert.All(shifts, s =>
        {
            Assert.Equal(8, s.GetProperty("length_hours").GetDouble());
            Assert.Equal(perDay * 8 / 24, s.GetProperty("expected_false_alarms").GetDouble(), 1e-12);
        });
    }
}
