using System.Net.Http.Json;
using System.Text.Json;
using Microsoft.Extensions.Time.Testing;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Testing;

/// <summary>
/// The late shift of 2026-12-01 (default pattern, UTC) for the shift-report tests, on the MonitorFixture's data: a
/// top-width spec of 5.5 … 6.5 nm, baseline B0001 (20 wafers at 6.0 nm) with limits approved at the clock's start,
/// lot P0001 on 2026-11-30 (5 wafers at 6.0 nm), lot L0001 at 14:30 (wafer means 6.02, 5.98, 6.02, 5.98 and 7.5 nm: the
/// last fires WE1 only) ingested at 15:00, and its alert acknowledged at 16:00 with the comment given.
/// </summary>
public static class ShiftFixture
{
    public static readonly DateTimeOffset Day = new(2026, 12, 1, 0, 0, 0, TimeSpan.Zero);

    /// <summary>Builds the history (products must exist); returns the id of the late shift's alert. The clock ends at 16:00.</summary>
    public static async Task<long> LateShiftAsync(HttpClient client, FakeTimeProvider clock, string comment)
    {
        (await client.PutAsJsonAsync($"/api/products/{TestProducts.TriGate}", TestProducts.Request(TestProducts.TriGate,
            specs: new[] { new { parameter = "top_width_nm", lower = (double?)5.5, target = (double?)null, upper = (double?)6.5 } }))).EnsureSuccessStatusCode();
        await IngestAsync(client, Wafers("B0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(client, "TRI-TOP");
        await IngestAsync(client, Wafers("P0001", new DateTimeOffset(2026, 11, 30, 10, 0, 0, TimeSpan.Zero), new double[5]));

        clock.SetUtcNow(Day.AddHours(15));
        await IngestAsync(client, Wafers("L0001", Day.AddHours(14.5), 0.02, -0.02, 0.02, -0.02, 1.5));
        var id = (await client.GetFromJsonAsync<JsonElement>("/api/alerts?state=open")).EnumerateArray().Single().GetProperty("id").GetInt64();
        clock.SetUtcNow(Day.AddHours(16));
        (await client.PostAsJsonAsync($"/api/alerts/{id}/acknowledge", new { comment })).EnsureSuccessStatusCode();
        return id;
    }
}
