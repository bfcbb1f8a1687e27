using System.Globalization;
using System.Net.Http.Json;
using System.Text.Json;

namespace FinWatch.Testing;

/// <summary>
/// Rows and steps shared by the monitor tests. Every wafer has the same five top widths 5.9, 5.95, 6.0, 6.05 and
/// 6.1 nm (plus an optional offset), so each wafer mean is exactly 6.0 nm + offset and its standard deviation 0.0791 nm:
/// the limits and every z are known by hand.
/// </summary>
public static class MonitorFixture
{
    public static readonly double[] Pattern = [5.9, 5.95, 6.0, 6.05, 6.1];

    public static readonly DateTimeOffset BaselineDay = new(2026, 11, 20, 6, 0, 0, TimeSpan.Zero);
    public static readonly DateTimeOffset EffectiveFrom = new(2026, 11, 25, 0, 0, 0, TimeSpan.Zero);
    public static readonly DateTimeOffset MonitorDay = new(2026, 11, 26, 6, 0, 0, TimeSpan.Zero);

    public static string Wafers(string lot, DateTimeOffset start, params double[] offsets) =>
        SiteRow.Csv(offsets.SelectMany((offset, w) => Pattern.Select((v, s) => new SiteRow
        {
            LotId = lot,
            WaferSlot = (w + 1).ToString(CultureInfo.InvariantCulture),
            SiteId = $"S{s + 1:00}",
            SiteXMm = ((s * 20) - 40).ToString(CultureInfo.InvariantCulture),
            MeasuredAt = start.AddMinutes(w).AddSeconds(s).ToString("yyyy-MM-ddTHH:mm:ssZ", CultureInfo.InvariantCulture),
            TopWidthNm = (v + offset).ToString("0.####", CultureInfo.InvariantCulture),
        })));

    public static async Task IngestAsync(HttpClient client, string csv)
    {
        var response = await client.PostAsync("/api/measurements/csv", new StringContent(csv, System.Text.Encoding.UTF8, "text/csv"));
        response.EnsureSuccessStatusCode();
    }

    public static async Task CreateContextAsync(HttpClient client, string code, double concernMv = 10, string rules = "westernElectric")
    {
        var response = await client.PostAsJsonAsync("/api/contexts", new
        {
            code, product = TestProducts.TriGate, step = "FIN-PROFILE", parameter = "top_width_nm", chart_type = "xbar", subgroup = "wafer",
            rules, reaction_plan = new[] { "Hold the lot", "Check the etch chamber log" }, electrical_concern_mv = concernMv,
        });
        response.EnsureSuccessStatusCode();
    }

    /// <summary>Context with 20 baseline wafers, limits computed from them and approved from <see cref="EffectiveFrom"/>.</summary>
    public static async Task ApprovedContextAsync(HttpClient client, string code, double concernMv = 10)
    {
        await CreateContextAsync(client, code, concernMv);
        await ApproveBaselineAsync(client, code);
    }

    /// <summary>
    /// Computes the draft (as the client's identity) and has a second engineer approve it. The 20-wafer baseline is
    /// below the usual 25 subgroups, so its verdict is "not stable" and the approval carries a justification.
    /// </summary>
    public static async Task ApproveBaselineAsync(HttpClient client, string code)
    {
        var computed = await client.PostAsJsonAsync($"/api/contexts/{code}/limits", new { reason = "baseline lot" });
        computed.EnsureSuccessStatusCode();
        var version = (await computed.Content.ReadFromJsonAsync<JsonElement>()).GetProperty("version").GetInt32();
        using var approve = new HttpRequestMessage(HttpMethod.Post, $"/api/contexts/{code}/limits/{version}/approve")
        {
            Content = JsonContent.Create(new { comment = "reviewed", effective_from = EffectiveFrom, justification = "test baseline of 20 identical wafers" }),
        };
        approve.Headers.Add(TestAuthHandler.Header, SecondApprover);
        var approved = await client.SendAsync(approve);
        approved.EnsureSuccessStatusCode();
    }

    /// <summary>The identity that approves limits in the tests: not the default administrator who computes them.</summary>
    public const string SecondApprover = "engineer";
}
