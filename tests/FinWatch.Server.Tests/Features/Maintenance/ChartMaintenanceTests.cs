using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Statistics.Comparison;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Maintenance;

/// <summary>
/// What charts know of maintenance: markers on a context's points and on stored series, the lots and hours since the
/// last maintenance with the baseline suggestion on the context, and the forecast's time since maintenance.
/// </summary>
public class ChartMaintenanceTests : IntegrationTest
{
    private const string Code = "TRI-TOP";

    // Every wafer of the fixture has the mean 6.0 nm + its offset (MonitorFixture); a small pattern gives each side a spread.
    private static readonly double[] Before = [.. Enumerable.Range(0, 20).Select(i => 0.01 * (((i * 7) % 5) - 2))];

    private static readonly DateTimeOffset CleanedAt = new(2026, 11, 22, 12, 0, 0, TimeSpan.Zero);
    private static readonly DateTimeOffset AfterLotAt = new(2026, 11, 24, 6, 0, 0, TimeSpan.Zero);

    private async Task<long> RecordAsync(string kind, DateTimeOffset at, string chamber = "ETA-1")
    {
        var response = await Client.PostAsJsonAsync("/api/maintenance", new { chamber, kind, occurred_at = at, performed_by = "Crew Amber" });
        response.EnsureSuccessStatusCode();
        return (await ReadJsonAsync(response)).GetProperty("id").GetInt64();
    }

    /// <summary>20 baseline wafers on 20 Nov, a context over them, a wet clean on 22 Nov, then 10 wafers of lot A0001 on 24 Nov.</summary>
    private async Task<(long Cleaned, double[] After)> ChartWithMaintenanceAsync(double shiftNm)
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, Before));
        await CreateContextAsync(Client, Code);
        var cleaned = await RecordAsync("wet_clean", CleanedAt);
        var after = Before.Take(10).Select(o => o + shiftNm).ToArray();
        await IngestAsync(Client, Wafers("A0001", AfterLotAt, after));
        return (cleaned, after);
    }

    [Fact]
    public async Task ContextMarkers_GiveEachEventWithTheFirstPointAfterIt()
    {
        await RecordAsync("preventive_maintenance", new DateTimeOffset(2026, 11, 10, 7, 0, 0, TimeSpan.Zero));
        var seasoned = await RecordAsync("seasoning", new DateTimeOffset(2026, 11, 19, 7, 0, 0, TimeSpan.Zero));
        await RecordAsync("repair", CleanedAt, chamber: "ETA-2"); // another chamber: not on this chart
        var (cleaned, _) = await ChartWithMaintenanceAsync(0.3);

        var answer = await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}/maintenance"));

        // The 10 Nov maintenance is followed by the 19 Nov one before any point, so only the last before the first point shows.
        var markers = answer.GetProperty("markers").EnumerateArray().ToList();
        Assert.Equal([seasoned, cleaned], markers.Select(m => m.GetProperty("id").GetInt64()));
        Assert.Equal(["seasoning", "wet_clean"], markers.Select(m => m.GetProperty("kind").GetString()));
        Assert.Equal([1L, 21L], markers.Select(m => m.GetProperty("first_point").GetInt64())); // points 1–20 are B0001, 21–30 A0001
        Assert.Equal(CleanedAt, markers[1].GetProperty("at").GetDateTimeOffset());

        var inRange = await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}/maintenance?from=2026-11-23T00:00:00Z"));
        Assert.Equal([cleaned], inRange.GetProperty("markers").EnumerateArray().Select(m => m.GetProperty("id").GetInt64()));
        Assert.Equal(HttpStatusCode.NotFound, (await Client.GetAsync("/api/contexts/NO-SUCH/maintenance")).StatusCode);
    }

    [Fact]
    public async Task Context_ShiftAfterTheMaintenance_SaysLotsAndHoursSinceAndSuggestsANewBaseline()
    {
        var (cleaned, after) = await ChartWithMaintenanceAsync(0.3);

        var maintenance = (await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}"))).GetProperty("maintenance");

        Assert.Equal("ETA-1", maintenance.GetProperty("chamber").GetString());
        Assert.Equal(cleaned, maintenance.GetProperty("last").GetProperty("id").GetInt64());
        Assert.Equal(1, maintenance.GetProperty("lots_since").GetInt32());
        Assert.Equal(10, maintenance.GetProperty("points_since").GetInt32());
        // The last wafer of A0001 is measured 9 min 4 s after the lot's start (MonitorFixture: a minute a wafer, a second a site).
        var lastPoint = AfterLotAt.AddMinutes(9).AddSeconds(4);
        Assert.Equal((lastPoint - CleanedAt).TotalHours, maintenance.GetProperty("hours_since").GetDouble(), 1e-9);
        var baseline = maintenance.GetProperty("baseline");
        Assert.True(baseline.GetProperty("suggest_new_baseline").GetBoolean());
        Assert.Equal((20, 10), (baseline.GetProperty("n_before").GetInt32(), baseline.GetProperty("n_after").GetInt32()));
        Assert.Equal("nm", baseline.GetProperty("unit").GetString());
        // The same test on the same wafer means, straight from the library (wafer mean = 6.0 nm + offset, by construction).
        var expected = WelchTest.Compare([.. Before.Select(o => 6.0 + o)], [.. after.Select(o => 6.0 + o)]);
        Assert.Equal(expected.FirstMean, baseline.GetProperty("mean_before").GetDouble(), 1e-9);
        Assert.Equal(expected.SecondMean, baseline.GetProperty("mean_after").GetDouble(), 1e-9);
        Assert.Equal(expected.PValue, baseline.GetProperty("p_value").GetDouble(), 1e-9);
        Assert.True(expected.PValue < 1e-6);
        Assert.Contains("wet clean of ETA-1", baseline.GetProperty("message").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Context_NewLimitsFromThePointsAfterTheMaintenance_TheSuggestionIsFollowed()
    {
        await ChartWithMaintenanceAsync(0.3);
        await ApproveBaselineAsync(Client, Code); // v1 from the 20 points before the wet clean: the suggestion stands
        var suggested = (await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}"))).GetProperty("maintenance").GetProperty("baseline");
        Assert.True(suggested.GetProperty("suggest_new_baseline").GetBoolean());

        // v2 from points 21–30 (lot A0001, after the clean), approved by the second engineer.
        var computed = await Client.PostAsJsonAsync($"/api/contexts/{Code}/limits", new { from_seq = 21, to_seq = 30, reason = "after the wet clean" });
        computed.EnsureSuccessStatusCode();
        using var approve = new HttpRequestMessage(HttpMethod.Post, $"/api/contexts/{Code}/limits/2/approve")
        {
            Content = JsonContent.Create(new { comment = "new baseline", effective_from = AfterLotAt.AddHours(1), justification = "10 wafers after the clean" }),
        };
        approve.Headers.Add(FinWatch.Testing.TestAuthHandler.Header, SecondApprover);
        (await Client.SendAsync(approve)).EnsureSuccessStatusCode();

        var followed = (await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}"))).GetProperty("maintenance").GetProperty("baseline");
        Assert.False(followed.GetProperty("suggest_new_baseline").GetBoolean());
        Assert.Equal(suggested.GetProperty("p_value").GetDouble(), followed.GetProperty("p_value").GetDouble());
        Assert.EndsWith("New limits (v2) computed from the points after it are approved.", followed.GetProperty("message").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Context_NoShiftAfterTheMaintenance_SuggestsNothing()
    {
        await ChartWithMaintenanceAsync(0.0);

        var baseline = (await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}"))).GetProperty("maintenance").GetProperty("baseline");

        Assert.False(baseline.GetProperty("suggest_new_baseline").GetBoolean());
        Assert.True(baseline.GetProperty("p_value").GetDouble() > 0.01);
    }

    [Fact]
    public async Task Context_TooFewPointsAfter_SaysSoAndSuggestsNothing()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, Before));
        await CreateContextAsync(Client, Code);
        await RecordAsync("wet_clean", CleanedAt);
        await IngestAsync(Client, Wafers("A0001", AfterLotAt, 0.3, 0.31, 0.29));

        var baseline = (await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}"))).GetProperty("maintenance").GetProperty("baseline");

        Assert.False(baseline.GetProperty("suggest_new_baseline").GetBoolean());
        Assert.Equal(JsonValueKind.Null, baseline.GetProperty("p_value").ValueKind);
        Assert.Contains("5 are needed", baseline.GetProperty("message").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Context_WithoutMaintenance_HasNone()
    {
        await IngestAsync(Client, Wafers("B0001", BaselineDay, Before));
        await CreateContextAsync(Client, Code);

        var context = await ReadJsonAsync(await Client.GetAsync($"/api/contexts/{Code}"));

        Assert.Equal(JsonValueKind.Null, context.GetProperty("maintenance").ValueKind);
    }

    [Fact]
    public async Task SeriesChart_MarkersGiveThePositionOfTheFirstPointAfterEachEvent()
    {
        var seasoned = await RecordAsync("seasoning", new DateTimeOffset(2026, 11, 19, 7, 0, 0, TimeSpan.Zero));
        var (cleaned, _) = await ChartWithMaintenanceAsync(0.3);
        const string query = "product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm&level=wafer";

        var chart = await ReadJsonAsync(await Client.GetAsync($"/api/series/chart?{query}&chamber=ETA-1"));
        var series = await ReadJsonAsync(await Client.GetAsync($"/api/series?{query}"));

        foreach (var answer in new[] { chart, series })
        {
            var markers = answer.GetProperty("maintenance").EnumerateArray().ToList();
            Assert.Equal([seasoned, cleaned], markers.Select(m => m.GetProperty("id").GetInt64()));
            Assert.Equal([0, 20], markers.Select(m => m.GetProperty("first_point").GetInt32())); // positions in points
            Assert.Equal("ETA-1", markers[1].GetProperty("chamber").GetString());
        }
    }

    [Fact]
    public async Task Forecast_WithAChamber_ReportsTheTimeSinceItsLastMaintenance()
    {
        var (cleaned, _) = await ChartWithMaintenanceAsync(0.3);
        const string query = "/api/series/forecast?product=TP-TRI&step=FIN-PROFILE&parameter=top_width_nm";

        var withChamber = await ReadJsonAsync(await Client.GetAsync(query + "&chamber=ETA-1"));
        var without = await ReadJsonAsync(await Client.GetAsync(query));

        var maintenance = withChamber.GetProperty("maintenance");
        Assert.Equal(cleaned, maintenance.GetProperty("last").GetProperty("id").GetInt64());
        Assert.Equal(1, maintenance.GetProperty("lots_since").GetInt32());
        // From the clean to the last lot's first site (A0001, 24 Nov 06:00): 42 h.
        Assert.Equal(42.0, maintenance.GetProperty("hours_since").GetDouble(), 1e-9);
        Assert.Contains("1 lot and 42 h before the last lot", maintenance.GetProperty("message").GetString(), StringComparison.Ordinal);
        Assert.True(withChamber.TryGetProperty("in_lots", out _));
        Assert.Equal(JsonValueKind.Null, without.GetProperty("maintenance").ValueKind);
    }
}
