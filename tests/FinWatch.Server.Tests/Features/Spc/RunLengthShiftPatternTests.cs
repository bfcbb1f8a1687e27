using System.Net.Http.Json;
using System.Text.Json;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.Spc;

/// <summary>The floor's false alarms per shift follow the configured shift pattern (two 12-hour shifts here).</summary>
public class RunLengthShiftPatternTests : IntegrationTest
{
    protected override Task BeforeStartAsync()
    {
        Factory.With("FinWatch:Shifts:Pattern:0:Name", "day").With("FinWatch:Shifts:Pattern:0:Start", "07:00").With("FinWatch:Shifts:Pattern:0:LengthHours", "12")
            .With("FinWatch:Shifts:Pattern:1:Name", "night").With("FinWatch:Shifts:Pattern:1:Start", "19:00").With("FinWatch:Shifts:Pattern:1:LengthHours", "12");
        return Task.CompletedTask;
    }

    [Fact]
    public async Task GetFloor_TwelveHourShifts_EachGetHalfTheDailySum()
    {
        await RunLengthEndpointsTests.SeedAsync(Client);
        await ApprovedContextAsync(Client, "RL-A");

        var r = await Client.GetFromJsonAsync<JsonElement>("/api/run-length");

        var perDay = r.GetProperty("expected_false_alarms_per_day").GetDouble();
        var arl = r.GetProperty("charts")[0].GetProperty("false_alarm").GetProperty("points").GetDouble();
        Assert.Equal(RunLengthEndpointsTests.PointsPerDay / arl, perDay, 1e-12);
        var shifts = r.GetProperty("shifts").EnumerateArray().ToList();
        Assert.Equal(["day", "night"], shifts.Select(s => s.GetProperty("name").GetString()));
        Assert.All(shifts, s => Assert.Equal(perDay * 12 / 24, s.GetProperty("expected_false_alarms").GetDouble(), 1e-12));
    }
}
