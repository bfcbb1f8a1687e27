using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.Notify;

/// <summary>Notification rules and the roster through the API: what a save refuses and why, who may change what, the audit trail.</summary>
public sealed class RulesAndRosterTests : NotificationTestBase
{
    public RulesAndRosterTests()
    {
        WithWebhook("pager", "https://pager.fab.example/in");
    }

    [Fact]
    public async Task Rule_SavedWithItsDescription_ChangedAndRemoved_EachAudited()
    {
        var rule = await AddRuleAsync(new { channel = "browser", min_severity = "medium", product = TestProducts.TriGate, step = "FIN-PROFILE", equipment = "FX07-R" });
        Assert.Equal("test administrator", rule.GetProperty("owner").GetString());
        Assert.Equal($"Alerts of medium and above, product {TestProducts.TriGate}, step FIN-PROFILE, tool or chamber FX07-R by browser",
            rule.GetProperty("description").GetString());
        var id = rule.GetProperty("id").GetInt64();
        var changed = await Client.PutAsJsonAsync($"/api/notifications/rules/{id}", new { channel = "webhook", webhook = "PAGER", min_severity = "critical" });
        Assert.True(changed.IsSuccessStatusCode, await changed.Content.ReadAsStringAsync());
        Assert.Equal("Alerts of critical and above by webhook pager", (await ReadJsonAsync(changed)).GetProperty("description").GetString());
        Assert.Equal(HttpStatusCode.NoContent, (await Client.DeleteAsync($"/api/notifications/rules/{id}")).StatusCode);
        Assert.Empty((await Client.GetFromJsonAsync<JsonElement>("/api/notifications/rules")).EnumerateArray());
        var audit = await Client.GetFromJsonAsync<JsonElement>("/api/audit?entity=notification-rule");
        Assert.Equal(["removed", "changed", "created"], audit.EnumerateArray().Select(e => e.GetProperty("action").GetString()));
    }

    [Fact]
    public async Task Rule_BadFields_EachNamedWithTheValue()
    {
        var r = await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "pager", min_severity = "urgent", product = "NOPE", context = "NO-CHART" });
        Assert.Equal(HttpStatusCode.BadRequest, r.StatusCode);
        var errors = (await ReadJsonAsync(r)).GetProperty("errors");
        Assert.Equal("channel 'pager' is not one of browser, email, webhook", errors.GetProperty("channel")[0].GetString());
        Assert.Equal("min_severity 'urgent' is not one of low, medium, high, critical", errors.GetProperty("min_severity")[0].GetString());
        Assert.Equal("'NOPE' is not a product code", errors.GetProperty("product")[0].GetString());
        Assert.Equal("'NO-CHART' is not a chart", errors.GetProperty("context")[0].GetString());

        // A webhook rule names a configured webhook, never an address: anything else is refused on save.
        var unknown = await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "webhook", webhook = "https://elsewhere.example/x" });
        Assert.Equal("webhook 'https://elsewhere.example/x' is not configured; configured: pager",
            (await ReadJsonAsync(unknown)).GetProperty("errors").GetProperty("webhook")[0].GetString());
        var email = await Client.PostAsJsonAsync("/api/notifications/rules", new { channel = "email" });
        Assert.Equal("e-mail is not configured on this FinWatch; an administrator sets up the mail server",
            (await ReadJsonAsync(email)).GetProperty("errors").GetProperty("channel")[0].GetString());
    }

    [Fact]
    public async Task Rules_WhoMayDoWhat()
    {
        using var technicianWebhook = As("technician", HttpMethod.Post, "/api/notifications/rules", new { channel = "webhook", webhook = "pager" });
        var r = await Client.SendAsync(technicianWebhook);
        Assert.Equal("webhook rules are set by engineers and administrators", (await ReadJsonAsync(r)).GetProperty("errors").GetProperty("channel")[0].GetString());

        using var forSomeoneElse = As("supervisor", HttpMethod.Post, "/api/notifications/rules", new { channel = "browser", owner = "test administrator" });
        Assert.Equal(HttpStatusCode.Forbidden, (await Client.SendAsync(forSomeoneElse)).StatusCode);

        var mine = await AddRuleAsync(new { channel = "browser" }); // the administrator's
        using var removeOthers = As("supervisor", HttpMethod.Delete, $"/api/notifications/rules/{mine.GetProperty("id").GetInt64()}", null);
        Assert.Equal(HttpStatusCode.Forbidden, (await Client.SendAsync(removeOthers)).StatusCode);
        using var own = As("supervisor", HttpMethod.Post, "/api/notifications/rules", new { channel = "browser", min_severity = "low" });
        Assert.Equal(HttpStatusCode.Created, (await Client.SendAsync(own)).StatusCode);
        Assert.Single((await Client.GetFromJsonAsync<JsonElement>("/api/notifications/rules?owner=test%20supervisor")).EnumerateArray());
    }

    [Fact]
    public async Task Roster_BadLinesNamed_GoodRosterSaysWhoIsOnShift_ByTheShiftsDate()
    {
        await AddPersonAsync("ana.sup", "supervisor");
        await AddPersonAsync("nik.tech", "technician");
        var bad = await Client.PutAsJsonAsync("/api/roster", new
        {
            entries = new[]
            {
                new { shift = "noon", person = "ana.sup", from = "2026-11-01", to = (string?)null },
                new { shift = "night", person = "ghost", from = "2026-13-01", to = (string?)null },
                new { shift = "night", person = "nik.tech", from = "2026-12-05", to = (string?)"2026-12-01" },
            },
        });
        Assert.Equal(HttpStatusCode.BadRequest, bad.StatusCode);
        var errors = (await ReadJsonAsync(bad)).GetProperty("errors");
        Assert.Equal("line 1: 'noon' is not a shift of the pattern (early, late, night)", errors.GetProperty("entries[0].shift")[0].GetString());
        Assert.Equal("line 2: 'ghost' is not a person in FinWatch", errors.GetProperty("entries[1].person")[0].GetString());
        Assert.Equal("line 2: from '2026-13-01' is not a date YYYY-MM-DD", errors.GetProperty("entries[1].from")[0].GetString());
        Assert.Equal("line 3: to 2026-12-01 is before from 2026-12-05", errors.GetProperty("entries[2].to")[0].GetString());
        Assert.Empty((await Client.GetFromJsonAsync<JsonElement>("/api/roster")).GetProperty("entries").EnumerateArray()); // nothing written

        using var technician = As("technician", HttpMethod.Put, "/api/roster", new { entries = Array.Empty<object>() });
        Assert.Equal(HttpStatusCode.Forbidden, (await Client.SendAsync(technician)).StatusCode);

        var good = await Client.PutAsJsonAsync("/api/roster", new
        {
            entries = new[]
            {
                new { shift = "Night", person = "ana.sup", from = "2026-11-01", to = (string?)"2026-12-01" },
                new { shift = "night", person = "nik.tech", from = "2026-12-01", to = (string?)null },
            },
        });
        Assert.True(good.IsSuccessStatusCode, await good.Content.ReadAsStringAsync());
        Assert.Equal("night", (await ReadJsonAsync(good)).GetProperty("entries")[0].GetProperty("shift").GetString());

        // The night shift of 1 Dec runs 22:00 to 06:00 UTC and belongs to 1 Dec: Ana's last day, Nik's first.
        var night = await Client.GetFromJsonAsync<JsonElement>("/api/roster/on-shift?at=2026-12-02T03:00:00Z");
        Assert.Equal("night", night.GetProperty("shift").GetString());
        Assert.Equal("2026-12-01", night.GetProperty("date").GetString());
        Assert.Equal(["ana.sup", "nik.tech"], night.GetProperty("people").EnumerateArray().Select(p => p.GetProperty("name").GetString()));
        Assert.Equal(["ana.sup"], night.GetProperty("supervisors").EnumerateArray().Select(p => p.GetString()));
        var next = await Client.GetFromJsonAsync<JsonElement>("/api/roster/on-shift?at=2026-12-02T23:00:00Z");
        Assert.Equal(["nik.tech"], next.GetProperty("people").EnumerateArray().Select(p => p.GetProperty("name").GetString()));
        Assert.Empty(next.GetProperty("supervisors").EnumerateArray());
        var audit = await Client.GetFromJsonAsync<JsonElement>("/api/audit?entity=roster");
        Assert.Single(audit.EnumerateArray());
    }

    private static HttpRequestMessage As(string who, HttpMethod method, string path, object? body)
    {
        var m = new HttpRequestMessage(method, path) { Content = body is null ? null : JsonContent.Create(body) };
        m.Headers.Add(TestAuthHandler.Header, who);
        return m;
    }
}
