using System.Net;
using System.Net.Http.Json;
using System.Text.Json;

namespace FinWatch.Server.Tests.Features.Spc;

public class SpcEndpointsTests : IntegrationTest
{
    protected override bool CreateProducts => false;

    // NIST/SEMATECH e-Handbook §6.3.2.2 individuals chart example (docs/statistics.md, case 17).
    private static readonly double[] FlowRate = [49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1];

    private async Task<JsonElement> AnalyseAsync(object request)
    {
        var response = await Client.PostAsJsonAsync("/api/spc/analyses", request);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, body);
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    [Fact]
    public async Task Analyses_NistFlowRateTableMode_ReproducesThePublishedChart()
    {
        var r = await AnalyseAsync(new { values = FlowRate, chart = "I-MR", constants = "table", rules = new[] { "westernElectric" } });
        var chart = r.GetProperty("chart");
        Assert.Equal(50.81, chart.GetProperty("center").GetDouble(), 10);
        Assert.Equal(55.8041, chart.GetProperty("primary").GetProperty("ucl").GetDouble(), 4);
        Assert.Equal(45.8159, chart.GetProperty("primary").GetProperty("lcl").GetDouble(), 4);
        Assert.Equal(1.8778, chart.GetProperty("secondary").GetProperty("center").GetDouble(), 4);
        Assert.Equal(JsonValueKind.Null, chart.GetProperty("secondary").GetProperty("values")[0].ValueKind);
        Assert.Empty(chart.GetProperty("beyond_limits_primary").EnumerateArray());
        Assert.Equal("data", chart.GetProperty("limits_source").GetString());
        var flags = r.GetProperty("rules").GetProperty("flags");
        Assert.Equal(["we1", "we2", "we3", "we4"], flags.EnumerateObject().Select(p => p.Name));
        Assert.All(flags.EnumerateObject(), p => Assert.Empty(p.Value.EnumerateArray()));
        Assert.All(r.GetProperty("rules").GetProperty("first").EnumerateObject(), p => Assert.Equal(JsonValueKind.Null, p.Value.ValueKind));
    }

    [Fact]
    public async Task Analyses_MissingValue_KeepsRequestPositions()
    {
        // Known limits 0 ± 3: position 3 (after a missing position 1) is beyond; indices count the missing entry.
        var r = await AnalyseAsync(new
        {
            values = new double?[] { 0.1, null, -0.4, 3.5, 0.2 },
            limits = new { source = "known", mean = 0.0, sigma = 1.0 },
            rules = new[] { "WE1" },
        });
        Assert.Equal([3], r.GetProperty("chart").GetProperty("beyond_limits_primary").EnumerateArray().Select(e => e.GetInt32()));
        Assert.Equal(JsonValueKind.Null, r.GetProperty("chart").GetProperty("primary").GetProperty("values")[1].ValueKind);
        Assert.Equal(3, r.GetProperty("rules").GetProperty("first").GetProperty("we1").GetInt32());
        Assert.Equal("known", r.GetProperty("chart").GetProperty("limits_source").GetString());
    }

    [Fact]
    public async Task Analyses_ConstantSeries_ReportsNullNotZeroOrInfinity()
    {
        // docs/statistics.md §3.3 item 9: zero sigma makes zone rules not evaluable (null) and capability undefined (null with a reason).
        var r = await AnalyseAsync(new
        {
            values = new[] { 5.0, 5.0, 5.0, 5.0, 5.0, 5.0 },
            rules = new[] { "WE1", "N3" },
            capability = new { lsl = 4.0, usl = 6.0 },
        });
        Assert.Equal(JsonValueKind.Null, r.GetProperty("rules").GetProperty("flags").GetProperty("we1").ValueKind);
        Assert.Equal(JsonValueKind.Array, r.GetProperty("rules").GetProperty("flags").GetProperty("n3").ValueKind);
        var cap = r.GetProperty("capability");
        Assert.Equal(JsonValueKind.Null, cap.GetProperty("cp").ValueKind);
        Assert.Equal(JsonValueKind.Null, cap.GetProperty("cpk").ValueKind);
        Assert.NotEmpty(cap.GetProperty("notes").EnumerateArray());
    }

    [Fact]
    public async Task Analyses_Subgroups_UseTheTextbookFactorsInTableMode()
    {
        // x̄̄ ± A2·R̄ with A2(4) = 0.729 (Montgomery Appendix VI; docs/statistics.md §2.2).
        var groups = new[] { new[] { 1.0, 2, 3, 4 }, new[] { 2.0, 3, 4, 6 }, new[] { 0.0, 1, 2, 3 } };
        var r = await AnalyseAsync(new { subgroups = groups, chart = "Xbar-R", constants = "table" });
        var rbar = (3 + 4 + 3) / 3.0;
        var grand = groups.SelectMany(g => g).Average();
        Assert.Equal(grand + (0.729 * rbar), r.GetProperty("chart").GetProperty("primary").GetProperty("ucl").GetDouble(), 10);
        Assert.Equal(2.282 * rbar, r.GetProperty("chart").GetProperty("secondary").GetProperty("ucl").GetDouble(), 10);
    }

    [Fact]
    public async Task Rules_ListsTheTwelveRulesInOrder_WithTheirSetAndWords()
    {
        var rules = await Client.GetFromJsonAsync<JsonElement>("/api/spc/rules");
        Assert.Equal(["WE1", "WE2", "WE3", "WE4", "N1", "N2", "N3", "N4", "N5", "N6", "N7", "N8"], rules.EnumerateArray().Select(r => r.GetProperty("id").GetString()));
        Assert.Equal(4, rules.EnumerateArray().Count(r => r.GetProperty("set").GetString() == "Western Electric"));
        Assert.Equal(8, rules.EnumerateArray().Count(r => r.GetProperty("set").GetString() == "Nelson"));
        Assert.Equal("one point beyond a 3σ limit", rules[0].GetProperty("text").GetString());
        Assert.Equal("six points in a row steadily rising or falling", rules[6].GetProperty("text").GetString());
    }

    [Fact]
    public async Task Analyses_UnequalSubgroups_ReturnLimitArrays()
    {
        var r = await AnalyseAsync(new { subgroups = new[] { new double?[] { 1, 2, 3 }, new double?[] { 2, null, 4, 3, 5 }, new double?[] { 5, 4, 6 } } });
        Assert.Equal(JsonValueKind.Array, r.GetProperty("chart").GetProperty("primary").GetProperty("ucl").ValueKind);
        Assert.Equal(3, r.GetProperty("chart").GetProperty("primary").GetProperty("ucl").GetArrayLength());
    }

    [Fact]
    public async Task Analyses_EwmaWithLambdaOne_FollowsTheValues()
    {
        // With λ = 1 the EWMA statistic is the value itself (Roberts 1959 recursion; docs/statistics.md §4.1).
        var r = await AnalyseAsync(new { values = FlowRate, ewma = new { lambda = 1.0, l = 3.0 } });
        Assert.Equal(FlowRate, r.GetProperty("ewma").GetProperty("z").EnumerateArray().Select(e => e.GetDouble()));
    }

    [Fact]
    public async Task Analyses_CusumAndCapabilityAndNormality_HaveTheContractFields()
    {
        var r = await AnalyseAsync(new
        {
            values = FlowRate,
            cusum = new { k = 0.5, h = 4.0 },
            capability = new { lsl = 44.0, usl = 58.0 },
            percentile_capability = new { lsl = 44.0, usl = 58.0, distribution = "lognormal" },
            normality = true,
        });
        Assert.Equal(10, r.GetProperty("cusum").GetProperty("c_plus").GetArrayLength());
        Assert.Equal(JsonValueKind.Array, r.GetProperty("cusum").GetProperty("signals_upper").ValueKind);
        var cap = r.GetProperty("capability");
        // Cp = (USL − LSL)/(6·σ_within) with σ_within = MR̄/d2 (docs/statistics.md §5.1).
        var sigmaWithin = (16.9 / 9) / (2 / Math.Sqrt(Math.PI));
        Assert.Equal(14 / (6 * sigmaWithin), cap.GetProperty("cp").GetDouble(), 10);
        Assert.Equal(2, cap.GetProperty("ci").GetProperty("cp").GetArrayLength());
        Assert.True(r.GetProperty("normality").GetProperty("p_value").GetDouble() is >= 0 and <= 1);
        Assert.True(r.GetProperty("percentile_capability").GetProperty("cpk_percentile").GetDouble() > 0);
    }

    [Theory]
    [InlineData("{\"values\":[1,2],\"chart\":\"P-chart\"}", "chart")]
    [InlineData("{\"values\":[1,1e300,2],\"ewma\":{\"lambda\":0.2,\"l\":3}}", "values")]
    [InlineData("{\"values\":[1,2],\"subgroups\":[[1,2]]}", "values")]
    [InlineData("{\"values\":[1,2,3],\"limits\":{\"source\":\"baseline\",\"count\":9}}", "limits.count")]
    [InlineData("{\"values\":[1,2,3],\"rules\":[\"WE9\"]}", "rules")]
    [InlineData("{\"values\":[1,2,3],\"ewma\":{\"lambda\":1.5,\"l\":3}}", "ewma.lambda")]
    [InlineData("{\"values\":[1,2,3],\"capability\":{\"lsl\":5,\"usl\":1}}", "capability")]
    [InlineData("{\"values\":[1,2,3],\"limits\":{\"source\":\"data\",\"exclude\":[{\"index\":1}]}}", "limits.exclude[0].reason")]
    [InlineData("{\"values\":[1,2,3],\"sigma_multiplier\":0}", "sigma_multiplier")]
    [InlineData("{\"values\":[1,2,3],\"cusum\":{\"k\":0.5,\"h\":4,\"head_start\":9}}", "cusum.head_start")]
    [InlineData("{\"values\":[1,2,3],\"percentile_capability\":{\"lsl\":1,\"usl\":5,\"distribution\":\"weibull\"}}", "percentile_capability.distribution")]
    public async Task Analyses_BadRequest_Returns400NamingTheField(string json, string field)
    {
        using var content = new StringContent(json, System.Text.Encoding.UTF8, "application/json");
        var response = await Client.PostAsync("/api/spc/analyses", content);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var problem = await ReadJsonAsync(response);
        Assert.True(problem.GetProperty("errors").TryGetProperty(field, out _), problem.ToString());
    }

    [Fact]
    public async Task Analyses_HugeMagnitudes_AreAnalysedWithoutOverflow()
    {
        // Edge case (docs/statistics.md §3.3): values around 1e9 with a spread of 1 give the same sigma as values around 0.
        var shifted = FlowRate.Select(v => v + 1e9).ToArray();
        var a = await AnalyseAsync(new { values = FlowRate, capability = new { lsl = 44.0, usl = 58.0 } });
        var b = await AnalyseAsync(new { values = shifted, capability = new { lsl = 44.0 + 1e9, usl = 58.0 + 1e9 } });
        Assert.Equal(a.GetProperty("chart").GetProperty("sigma").GetDouble(), b.GetProperty("chart").GetProperty("sigma").GetDouble(), 5);
        Assert.Equal(a.GetProperty("capability").GetProperty("cpk").GetDouble(), b.GetProperty("capability").GetProperty("cpk").GetDouble(), 5);
    }

    [Fact]
    public async Task Analyses_SubgroupOf26_Returns400()
    {
        var response = await Client.PostAsJsonAsync("/api/spc/analyses", new { subgroups = new[] { Enumerable.Range(0, 26).Select(i => (double)i).ToArray() } });
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Fact]
    public async Task Arl_PublishedDesigns_MatchThePrintedTables()
    {
        var response = await Client.PostAsJsonAsync("/api/spc/arl", new
        {
            shifts = new[] { 0.0, 1.0 },
            shewhart = new[] { 3.0 },
            cusum = new[] { new { k = 0.5, h = 4.0 } },
            ewma = new[] { new { lambda = 0.1, l = 2.814 } },
            rules = new[] { "westernElectric" },
        });
        var r = await ReadJsonAsync(response);
        // Shewhart 370.4 and 43.89 (NIST §6.3.2.3 column), CUSUM k 0.5 h 4: 168 and 8.38 (Montgomery Table 9.3),
        // EWMA λ 0.1 L 2.814: 500 and 10.3 (Lucas & Saccucci 1990 Table 3), WE1–4: 91.75 (Champ & Woodall 1987), as in docs/statistics.md §4.3 and 3.1.
        var shewhart = r.GetProperty("shewhart")[0].GetProperty("arl");
        Assert.Equal(370.4, shewhart[0].GetDouble(), 0.1);
        Assert.Equal(43.89, shewhart[1].GetDouble(), 0.01);
        var cusum = r.GetProperty("cusum")[0].GetProperty("arl");
        Assert.Equal(168, cusum[0].GetDouble(), 0.5);
        Assert.Equal(8.38, cusum[1].GetDouble(), 0.01);
        var ewma = r.GetProperty("ewma")[0].GetProperty("arl");
        Assert.Equal(500, ewma[0].GetDouble(), 1.0);
        Assert.Equal(10.3, ewma[1].GetDouble(), 0.05);
        Assert.Equal(91.75, r.GetProperty("shewhart_with_rules").GetProperty("arl")[0].GetDouble(), 0.1);
    }

    [Fact]
    public async Task Arl_RunLengthTooLongToResolve_IsNullNotInfinity()
    {
        // A CUSUM with k 3, h 20 in control runs far beyond 1e12 points; the answer must stay valid JSON.
        var response = await Client.PostAsJsonAsync("/api/spc/arl", new { shifts = new[] { 0.0, 3.0 }, cusum = new[] { new { k = 3.0, h = 20.0 } } });
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        var arl = (await ReadJsonAsync(response)).GetProperty("cusum")[0].GetProperty("arl");
        Assert.Equal(JsonValueKind.Null, arl[0].ValueKind);
        Assert.True(arl[1].GetDouble() > 1);
    }

    [Fact]
    public async Task Arl_NoShifts_Returns400()
    {
        var response = await Client.PostAsJsonAsync("/api/spc/arl", new { shewhart = new[] { 3.0 } });
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
    }

    [Fact]
    public async Task Constants_ListsExactAndPrintedForTwoTo25()
    {
        var r = await ReadJsonAsync(await Client.GetAsync("/api/spc/constants"));
        Assert.Equal(24, r.GetProperty("exact").GetArrayLength());
        var printed = r.GetProperty("table")[0];
        // Montgomery Appendix VI, n = 2: d2 1.128, D4 3.267, A2 1.880.
        Assert.Equal(2, printed.GetProperty("n").GetInt32());
        Assert.Equal(1.128, printed.GetProperty("d2").GetDouble());
        Assert.Equal(3.267, printed.GetProperty("d4_capital").GetDouble());
        Assert.Equal(2 / Math.Sqrt(Math.PI), r.GetProperty("exact")[0].GetProperty("d2").GetDouble(), 12);
    }
}
