using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Infrastructure;

/// <summary>
/// One JSON dialect for the whole API: field names, map keys, enum values and query and path parameters are snake_case
/// in every answer and request, and the OpenAPI document names them as the endpoints write them.
/// </summary>
public sealed partial class JsonDialectTests : IntegrationTest
{
    private const string Series = "product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm";

    [GeneratedRegex("^[a-z][a-z0-9]*(_[a-z0-9]+)*$")]
    private static partial Regex SnakeCase();

    private async Task SeedAsync()
    {
        var rows = Enumerable.Range(0, 12).SelectMany(l =>
            SiteRow.Wafers($"J{l:00}", 2, 5, new DateTimeOffset(2026, 11, 1, 0, 0, 0, TimeSpan.Zero).AddHours(l)));
        (await PostCsvAsync(SiteRow.Csv(rows))).EnsureSuccessStatusCode();
    }

    private static void AssertSnakeCase(IEnumerable<(string Where, string Name)> names)
    {
        var bad = names.Where(n => !SnakeCase().IsMatch(n.Name)).Select(n => $"{n.Where}: {n.Name}").Distinct().ToList();
        Assert.True(bad.Count == 0, $"{bad.Count} names are not snake_case:\n{string.Join("\n", bad)}");
    }

    [Fact]
    public async Task OpenApi_EverySchemaPropertyAndParameter_IsSnakeCase()
    {
        var document = await ReadJsonAsync(await Client.GetAsync("/openapi/v1.json"));
        var names = new List<(string Where, string Name)>();
        var schemas = document.GetProperty("components").GetProperty("schemas").EnumerateObject().ToList();
        foreach (var schema in schemas)
        {
            SchemaNames(schema.Value, $"schema {schema.Name}", names);
        }

        foreach (var path in document.GetProperty("paths").EnumerateObject())
        {
            foreach (var operation in path.Value.EnumerateObject().Where(o => o.Value.ValueKind == JsonValueKind.Object))
            {
                var where = $"{operation.Name.ToUpperInvariant()} {path.Name}";
                var parameters = operation.Value.TryGetProperty("parameters", out var list) ? list.EnumerateArray().ToList() : [];
                foreach (var p in parameters.Where(p => p.GetProperty("in").GetString() is "query" or "path"))
                {
                    names.Add(($"{where} {p.GetProperty("in").GetString()} parameter", p.GetProperty("name").GetString()!));
                }

                foreach (var body in Contents(operation.Value))
                {
                    SchemaNames(body, $"{where} body", names);
                }
            }
        }

        // The walk reaches fields, nested parts, enum values and the parameters of paths and queries.
        Assert.Subset(names.Select(n => n.Name).ToHashSet(),
            new HashSet<string> { "beyond_limits_primary", "delta_vt_lin_mv", "previous_seven_days", "no_trend", "code", "after_seq", "measurement_sd_mv" });
        AssertSnakeCase(names);
    }

    [Fact]
    public async Task SeriesAndSeriesChart_NameTheSameFieldsAlike()
    {
        await SeedAsync();
        var series = await ReadJsonAsync(await Client.GetAsync($"/api/series?{Series}&level=site"));
        var chart = await ReadJsonAsync(await Client.GetAsync(
            $"/api/series/chart?{Series}&level=site&rules=WE1,N3&ewma_lambda=0.2&ewma_l=3&cusum_k=0.5&cusum_h=4"));

        // A chart point says what a series point says about the same site (measured_at, lot_id, wafer_slot, site_id, …),
        // and the chart's context repeats the series' product, step, parameter and unit, under the same names.
        Assert.Subset(Names(series.GetProperty("points")[0]), Names(chart.GetProperty("points")[0]));
        Assert.Subset(Names(series), Names(chart.GetProperty("context")));
        Assert.Equal(series.GetProperty("points")[0].GetProperty("lot_id").GetString(), chart.GetProperty("points")[0].GetProperty("lot_id").GetString());
        AssertSnakeCase(AnswerNames(series, "/api/series").Concat(AnswerNames(chart, "/api/series/chart")));
    }

    [Fact]
    public async Task OpenApi_NamesWhatTheEndpointsWrite()
    {
        await SeedAsync();
        var document = await ReadJsonAsync(await Client.GetAsync("/openapi/v1.json"));
        var schemas = document.GetProperty("components").GetProperty("schemas");
        ISet<string> Properties(string schema) => Names(schemas.GetProperty(schema).GetProperty("properties"));

        var series = await ReadJsonAsync(await Client.GetAsync($"/api/series?{Series}&level=site"));
        var chart = await ReadJsonAsync(await Client.GetAsync($"/api/series/chart?{Series}&level=site"));
        var forecast = await ReadJsonAsync(await Client.GetAsync($"/api/series/forecast?{Series}"));
        AssertSameNames(Properties("SeriesPoint"), Names(series.GetProperty("points")[0]));
        AssertSameNames(Properties("StoredPoint"), Names(chart.GetProperty("points")[0]));
        AssertSameNames(Properties("ChartResponse"), Names(chart.GetProperty("analysis").GetProperty("chart")));
        AssertSameNames(Properties("ForecastResponse"), Names(forecast.GetProperty("in_lots")));

        // Enum values, too, come from the endpoints' converter.
        var statuses = schemas.GetProperty("DriftForecastStatus").GetProperty("enum").EnumerateArray().Select(e => e.GetString()).ToList();
        Assert.Contains(forecast.GetProperty("in_lots").GetProperty("status").GetString(), statuses);
        Assert.Contains("not_approaching_any_limit", statuses);
        Assert.Contains(chart.GetProperty("analysis").GetProperty("chart").GetProperty("limits_source").GetString(),
            schemas.GetProperty("LimitSource").GetProperty("enum").EnumerateArray().Select(e => e.GetString()));
    }

    [Fact]
    public async Task Answers_FieldsAndMapKeys_AreSnakeCase()
    {
        var analysis = await Client.PostAsJsonAsync("/api/spc/analyses", new
        {
            values = new[] { 49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1 },
            rules = new[] { "westernElectric", "N3" },
            ewma = new { lambda = 0.2, l = 3.0 },
            cusum = new { k = 0.5, h = 4.0, head_start = 1.0 },
            capability = new { lsl = 44.0, usl = 58.0 },
            percentile_capability = new { lsl = 44.0, usl = 58.0 },
            normality = true,
        });
        var arl = await Client.PostAsJsonAsync("/api/spc/arl", new
        {
            shifts = new[] { 0.0, 1.0 },
            shewhart = new[] { 3.0 },
            cusum = new[] { new { k = 0.5, h = 4.0, head_start = 2.0 } },
            ewma = new[] { new { lambda = 0.1, l = 2.814 } },
            rules = new[] { "WE1", "WE2" },
        });
        var evaluate = await Client.PostAsJsonAsync("/api/model/evaluate", new
        {
            top_width_nm = 6.0, bottom_width_nm = 10.0, height_nm = 42.0, corner_radius_nm = 2.0, eot_nm = 0.9, gate_length_nm = 20.0,
        });
        var constants = await Client.GetAsync("/api/spc/constants");
        var answers = new[] { ("POST /api/spc/analyses", analysis), ("POST /api/spc/arl", arl), ("POST /api/model/evaluate", evaluate), ("GET /api/spc/constants", constants) };
        var names = new List<(string Where, string Name)>();
        foreach (var (where, response) in answers)
        {
            Assert.True(response.StatusCode == HttpStatusCode.OK, $"{where}: {(int)response.StatusCode} {await response.Content.ReadAsStringAsync()}");
            names.AddRange(AnswerNames(await ReadJsonAsync(response), where));
        }

        AssertSnakeCase(names);
        var a = await ReadJsonAsync(analysis);
        Assert.Equal(["we1", "we2", "we3", "we4", "n3"], a.GetProperty("rules").GetProperty("flags").EnumerateObject().Select(p => p.Name));
        Assert.Equal(["cp", "cpk", "pp", "ppk"], a.GetProperty("capability").GetProperty("ci").EnumerateObject().Select(p => p.Name));
        Assert.Equal(["k", "h", "head_start"], (await ReadJsonAsync(arl)).GetProperty("cusum")[0].GetProperty("design").EnumerateObject().Select(p => p.Name));

        // d2 and D2 (d3 and D3) differ only in case: every symbol keeps a key of its own.
        var row = (await ReadJsonAsync(constants)).GetProperty("table")[0].EnumerateObject().Select(p => p.Name).ToList();
        Assert.Equal(14, row.Distinct().Count());
        Assert.Equal(row.Count, row.Distinct().Count());
    }

    private static void AssertSameNames(ISet<string> documented, ISet<string> written) =>
        Assert.True(documented.SetEquals(written), $"documented: {string.Join(", ", documented.Order())}\nwritten: {string.Join(", ", written.Order())}");

    private static HashSet<string> Names(JsonElement element) => [.. element.EnumerateObject().Select(p => p.Name)];

    /// <summary>Every property name of an answer, at any depth, map keys included.</summary>
    private static IEnumerable<(string Where, string Name)> AnswerNames(JsonElement element, string where) => element.ValueKind switch
    {
        JsonValueKind.Object => element.EnumerateObject().SelectMany(p => AnswerNames(p.Value, $"{where}.{p.Name}").Prepend((where, p.Name))),
        JsonValueKind.Array => element.EnumerateArray().SelectMany(e => AnswerNames(e, $"{where}[]")),
        _ => [],
    };

    /// <summary>The schemas of an operation's request body and answers.</summary>
    private static IEnumerable<JsonElement> Contents(JsonElement operation)
    {
        var holders = new List<JsonElement>();
        if (operation.TryGetProperty("requestBody", out var body))
        {
            holders.Add(body);
        }

        if (operation.TryGetProperty("responses", out var responses))
        {
            holders.AddRange(responses.EnumerateObject().Select(r => r.Value));
        }

        return holders.Where(h => h.TryGetProperty("content", out _))
            .SelectMany(h => h.GetProperty("content").EnumerateObject())
            .Where(m => m.Value.TryGetProperty("schema", out _))
            .Select(m => m.Value.GetProperty("schema"));
    }

    /// <summary>The property names and enum values of a schema and of the schemas inside it.</summary>
    private static void SchemaNames(JsonElement schema, string where, List<(string Where, string Name)> names)
    {
        if (schema.ValueKind != JsonValueKind.Object)
        {
            return;
        }

        if (schema.TryGetProperty("properties", out var properties))
        {
            foreach (var p in properties.EnumerateObject())
            {
                names.Add((where, p.Name));
                SchemaNames(p.Value, $"{where}.{p.Name}", names);
            }
        }

        if (schema.TryGetProperty("enum", out var values))
        {
            names.AddRange(values.EnumerateArray().Where(v => v.ValueKind == JsonValueKind.String).Select(v => ($"{where} enum value", v.GetString()!)));
        }

        foreach (var inner in new[] { "items", "additionalProperties", "not" })
        {
            if (schema.TryGetProperty(inner, out var child))
            {
                SchemaNames(child, $"{where} {inner}", names);
            }
        }

        foreach (var combined in new[] { "allOf", "oneOf", "anyOf" })
        {
            if (schema.TryGetProperty(combined, out var list))
            {
                foreach (var child in list.EnumerateArray())
                {
                    SchemaNames(child, $"{where} {combined}", names);
                }
            }
        }
    }
}
