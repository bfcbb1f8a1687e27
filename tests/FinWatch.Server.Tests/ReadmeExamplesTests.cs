using FinWatch.Testing;
using System.Net;
using System.Text;
using System.Text.RegularExpressions;

namespace FinWatch.Server.Tests;

/// <summary>The examples in README.md and docs/ work as printed: the product is created, the CSV and the JSON are accepted.</summary>
public partial class ReadmeExamplesTests : IntegrationTest
{
    protected override bool CreateProducts => false;

    [GeneratedRegex("```(?<lang>csv|json)\\n(?<body>.*?)```", RegexOptions.Singleline)]
    private static partial Regex CodeBlock();

    private static List<(string Lang, string Body)> Blocks()
    {
        return CodeBlock().Matches(TestPaths.DocumentationText()).Select(m => (m.Groups["lang"].Value, m.Groups["body"].Value)).ToList();
    }

    [Fact]
    public async Task ReadmeExamples_ProductCsvAndJson_AreAccepted()
    {
        var blocks = Blocks();
        var product = blocks.Single(b => b.Lang == "json" && b.Body.Contains("\"gate_faces\"", StringComparison.Ordinal)).Body;
        var created = await Client.PostAsync("/api/products", new StringContent(product, Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);

        var csv = blocks.Single(b => b.Lang == "csv" && b.Body.StartsWith("lot_id,wafer_slot,site_id", StringComparison.Ordinal)).Body;
        var csvResponse = await PostCsvAsync(csv);
        var csvBody = await ReadJsonAsync(csvResponse);
        Assert.Equal(HttpStatusCode.OK, csvResponse.StatusCode);
        Assert.Equal(3, csvBody.GetProperty("inserted").GetInt32());

        // The JSON example is the CSV's first row again, so it is reported as already present.
        var json = blocks.Single(b => b.Lang == "json" && b.Body.TrimStart().StartsWith('[')).Body;
        var jsonBody = await ReadJsonAsync(await PostJsonAsync(json));
        Assert.Equal(1, jsonBody.GetProperty("already_present").GetInt32());
    }

    [Fact]
    public async Task ReadmeExample_ChartContext_IsCreatedInItsBaselinePhase()
    {
        var blocks = Blocks();
        var product = blocks.Single(b => b.Lang == "json" && b.Body.Contains("\"gate_faces\"", StringComparison.Ordinal)).Body;
        Assert.Equal(HttpStatusCode.Created, (await Client.PostAsync("/api/products", new StringContent(product, Encoding.UTF8, "application/json"))).StatusCode);
        await PostCsvAsync(blocks.Single(b => b.Lang == "csv" && b.Body.StartsWith("lot_id,wafer_slot,site_id", StringComparison.Ordinal)).Body);

        var context = blocks.Single(b => b.Lang == "json" && b.Body.Contains("\"reaction_plan\"", StringComparison.Ordinal)).Body;
        var created = await Client.PostAsync("/api/contexts", new StringContent(context, Encoding.UTF8, "application/json"));
        var body = await ReadJsonAsync(created);
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        Assert.Equal("baseline", body.GetProperty("phase").GetString());
        Assert.Equal(2, body.GetProperty("reaction_plan").GetArrayLength());
        Assert.Equal(1, body.GetProperty("points").GetInt64()); // the README CSV's two FX07-L sites of one lot at FIN-PROFILE
    }

    [Fact]
    public async Task ReadmeExample_ElectricalTestCsv_IsReadAndJoinedToMetrology()
    {
        // The calibration example parses cell by cell; with no metrology of its wafer stored, the one error left is the join.
        (await Client.PostAsync("/api/products", new StringContent(
            Blocks().Single(b => b.Lang == "json" && b.Body.Contains("\"gate_faces\"", StringComparison.Ordinal)).Body,
            Encoding.UTF8, "application/json"))).EnsureSuccessStatusCode();
        var csv = Blocks().Single(b => b.Lang == "csv" && b.Body.StartsWith("lot_id,wafer_slot,product,vt_lin_v", StringComparison.Ordinal)).Body;
        var response = await Client.PostAsync("/api/model/calibrations?preview=true", new StringContent(csv, Encoding.UTF8, "text/csv"));
        var errors = (await ReadJsonAsync(response)).GetProperty("errors").EnumerateArray().ToList();
        var only = Assert.Single(errors);
        Assert.Contains("no measured fin profile", only.GetProperty("reason").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task ReadmeExample_AnalysisRequest_IsAccepted()
    {
        var analysis = Blocks().Single(b => b.Lang == "json" && b.Body.Contains("\"sigma_multiplier\"", StringComparison.Ordinal)).Body;
        var response = await Client.PostAsync("/api/spc/analyses", new StringContent(analysis, Encoding.UTF8, "application/json"));
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal("baseline", body.GetProperty("chart").GetProperty("limits_source").GetString());
        Assert.Equal(10, body.GetProperty("ewma").GetProperty("z").GetArrayLength());
    }

    [Fact]
    public async Task ReadmeExample_Prediction_IsAccepted()
    {
        var product = Blocks().Single(b => b.Lang == "json" && b.Body.Contains("\"gate_faces\"", StringComparison.Ordinal)).Body;
        (await Client.PostAsync("/api/products", new StringContent(product, Encoding.UTF8, "application/json"))).EnsureSuccessStatusCode();
        var predict = Blocks().Single(b => b.Lang == "json" && b.Body.TrimStart().StartsWith("{ \"product\"", StringComparison.Ordinal)).Body;
        var response = await Client.PostAsync("/api/model/predict", new StringContent(predict, Encoding.UTF8, "application/json"));
        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        // Mid width 7.8 nm against 8.0 nm nominal: a narrower fin raises the threshold (G.4: dVT,sat/dw_mid < 0).
        Assert.True(body.GetProperty("delta_vt_sat_mv").GetDouble() > 0);
    }
}
