using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Maintenance;

/// <summary>Recording, importing and listing maintenance events: validation, all-or-nothing imports, rights and the audit trail.</summary>
public class MaintenanceEndpointsTests : IntegrationTest
{
    private static object Event(string chamber = "ETA-1", string kind = "wet_clean", string at = "2026-11-22T12:00:00Z", string by = "Crew Amber",
        string? note = "chamber opened after 1200 RF hours") => new { chamber, kind, occurred_at = at, performed_by = by, note };

    private async Task<HttpResponseMessage> RecordAsync(object body, string? who = null)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, "/api/maintenance") { Content = JsonContent.Create(body) };
        if (who is not null)
        {
            request.Headers.Add(TestAuthHandler.Header, who);
        }

        return await Client.SendAsync(request);
    }

    private async Task<HttpResponseMessage> ImportAsync(string csv)
    {
        using var content = new StringContent(csv, Encoding.UTF8, "text/csv");
        return await Client.PostAsync("/api/maintenance/import", content);
    }

    private Task<int> StoredAsync() => Factory.QueryAsync(db => db.MaintenanceEvents.CountAsync());

    private Task<int> AuditedAsync() => Factory.QueryAsync(db => db.AuditEntries.CountAsync(a => a.Entity == "maintenance"));

    [Fact]
    public async Task Record_ValidEvent_Returns201AndTheListShowsItNewestFirst()
    {
        var first = await RecordAsync(Event(at: "2026-11-22T12:00:00Z"));
        var second = await RecordAsync(Event(kind: "seasoning", at: "2026-11-22T14:30:00+01:00", note: null));
        Assert.Equal(HttpStatusCode.Created, first.StatusCode);
        Assert.Equal(HttpStatusCode.Created, second.StatusCode);

        var list = (await ReadJsonAsync(await Client.GetAsync("/api/maintenance?chamber=ETA-1"))).EnumerateArray().ToList();

        Assert.Equal(["seasoning", "wet_clean"], list.Select(e => e.GetProperty("kind").GetString()));
        // Stored in UTC: 14:30 at +01:00 is 13:30Z.
        Assert.Equal(new DateTimeOffset(2026, 11, 22, 13, 30, 0, TimeSpan.Zero), list[0].GetProperty("occurred_at").GetDateTimeOffset());
        Assert.Equal("Crew Amber", list[1].GetProperty("performed_by").GetString());
        Assert.Equal("chamber opened after 1200 RF hours", list[1].GetProperty("note").GetString());
        Assert.Equal("", list[0].GetProperty("note").GetString());
        Assert.Equal("test administrator", list[1].GetProperty("recorded_by").GetString());
        Assert.Equal(FinWatchAppFactory.Now, list[1].GetProperty("recorded_at").GetDateTimeOffset());
        Assert.Equal("api", list[1].GetProperty("source").GetString());
        Assert.Empty((await ReadJsonAsync(await Client.GetAsync("/api/maintenance?chamber=ETA-2"))).EnumerateArray());
        Assert.Single((await ReadJsonAsync(await Client.GetAsync("/api/maintenance?from=2026-11-22T13:00:00Z"))).EnumerateArray());
    }

    [Fact]
    public async Task Record_BadFields_Returns400NamingEachFieldAndValue_AndStoresNothing()
    {
        var response = await RecordAsync(new { chamber = "  ", kind = "wetclean", occurred_at = "yesterday", note = new string('n', 2001) });

        var problem = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var errors = problem.GetProperty("errors");
        Assert.Equal(["chamber", "kind", "note", "occurred_at", "performed_by"], errors.EnumerateObject().Select(e => e.Name).Order(StringComparer.Ordinal));
        Assert.Contains("'wetclean'", errors.GetProperty("kind")[0].GetString(), StringComparison.Ordinal);
        Assert.Contains("wet_clean", errors.GetProperty("kind")[0].GetString(), StringComparison.Ordinal);
        Assert.Contains("'yesterday'", errors.GetProperty("occurred_at")[0].GetString(), StringComparison.Ordinal);
        Assert.Contains("ISO 8601", errors.GetProperty("occurred_at")[0].GetString(), StringComparison.Ordinal);
        Assert.Equal(0, await StoredAsync());
        Assert.Equal(0, await AuditedAsync());
    }

    [Theory]
    [InlineData("2026-12-01T09:00:00Z")] // an hour past the test clock (2026-12-01 08:00 UTC)
    [InlineData("1999-12-31T23:00:00Z")]
    [InlineData("2026-11-22T12:00:00")] // no zone: ambiguous
    public async Task Record_TimeNotInThePastOrWithoutZone_Returns400OnOccurredAt(string at)
    {
        var response = await RecordAsync(Event(at: at));

        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        var message = (await ReadJsonAsync(response)).GetProperty("errors").GetProperty("occurred_at")[0].GetString();
        Assert.Contains($"'{at}'", message, StringComparison.Ordinal);
        Assert.Equal(0, await StoredAsync());
    }

    [Fact]
    public async Task Record_SameEventTwice_SecondIsRefusedNamingTheFirst()
    {
        var first = await ReadJsonAsync(await RecordAsync(Event()));

        var again = await RecordAsync(Event(by: "someone else"));

        Assert.Equal(HttpStatusCode.BadRequest, again.StatusCode);
        var message = (await ReadJsonAsync(again)).GetProperty("errors").GetProperty("occurred_at")[0].GetString();
        Assert.Contains($"event {first.GetProperty("id").GetInt64()}", message, StringComparison.Ordinal);
        Assert.Equal(1, await StoredAsync());
    }

    [Fact]
    public async Task Record_EachEvent_GoesIntoTheAuditTrail()
    {
        var saved = await ReadJsonAsync(await RecordAsync(Event(), who: "supervisor"));

        var audit = (await ReadJsonAsync(await Client.GetAsync("/api/audit?entity=maintenance"))).EnumerateArray().Single();

        Assert.Equal("test supervisor", audit.GetProperty("by").GetString());
        Assert.Equal("recorded", audit.GetProperty("action").GetString());
        Assert.Equal(saved.GetProperty("id").GetInt64().ToString(System.Globalization.CultureInfo.InvariantCulture), audit.GetProperty("key").GetString());
        var after = JsonDocument.Parse(audit.GetProperty("after").GetString()!).RootElement;
        Assert.Equal("ETA-1", after.GetProperty("chamber").GetString());
        Assert.Equal("wet_clean", after.GetProperty("kind").GetString());
        Assert.Equal("test supervisor", after.GetProperty("recorded_by").GetString());
    }

    // The rights of the issue: supervisors and engineers record, a technician reads only.
    [Theory]
    [InlineData("technician", HttpStatusCode.Forbidden)]
    [InlineData("supervisor", HttpStatusCode.Created)]
    [InlineData("engineer", HttpStatusCode.Created)]
    public async Task Record_ByRole_FollowsTheRights(string who, HttpStatusCode expected)
    {
        Assert.Equal(expected, (await RecordAsync(Event(), who)).StatusCode);

        using var read = new HttpRequestMessage(HttpMethod.Get, "/api/maintenance");
        read.Headers.Add(TestAuthHandler.Header, "technician");
        Assert.Equal(HttpStatusCode.OK, (await Client.SendAsync(read)).StatusCode);
        Assert.Equal(expected == HttpStatusCode.Created ? 1 : 0, await StoredAsync());
    }

    [Fact]
    public async Task List_BadQuery_Returns400WithTheParameter()
    {
        var range = await Client.GetAsync("/api/maintenance?from=2026-11-23T00:00:00Z&to=2026-11-22T00:00:00Z");
        var limit = await Client.GetAsync("/api/maintenance?limit=0");

        Assert.Equal(HttpStatusCode.BadRequest, range.StatusCode);
        Assert.True((await ReadJsonAsync(range)).GetProperty("errors").TryGetProperty("from", out _));
        Assert.Equal(HttpStatusCode.BadRequest, limit.StatusCode);
        Assert.Contains("0", (await ReadJsonAsync(limit)).GetProperty("errors").GetProperty("limit")[0].GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Import_GoodFile_RecordsEveryRowWithAnAuditEntryEach()
    {
        const string csv = """
            occurred_at,chamber,kind,performed_by,note
            2026-11-10T07:00:00Z,ETA-1,preventive_maintenance,Crew Amber,"quarterly, tool-wide"
            2026-11-10T09:00:00Z,ETA-1,seasoning,Crew Amber,
            2026-11-12T16:00:00Z,LNA-1,part_replacement,Crew Slate,showerhead
            """;

        var response = await ImportAsync(csv);

        var body = await ReadJsonAsync(response);
        Assert.Equal(HttpStatusCode.Created, response.StatusCode);
        Assert.Equal(3, body.GetProperty("recorded").GetInt32());
        Assert.Equal("quarterly, tool-wide", body.GetProperty("events")[0].GetProperty("note").GetString());
        Assert.Equal("import", body.GetProperty("events")[0].GetProperty("source").GetString());
        Assert.Equal(3, await StoredAsync());
        Assert.Equal(3, await AuditedAsync());
    }

    [Fact]
    public async Task Import_OneBadRow_RejectsTheWholeFileWithRowColumnAndValue()
    {
        const string csv = """
            chamber,kind,occurred_at,performed_by
            ETA-1,wet_clean,2026-11-10T07:00:00Z,Crew Amber
            ETA-1,wet clean,2026-11-11T07:00:00Z,Crew Amber
            ETA-1,seasoning,11/12/2026 07:00,Crew Amber
            ETA-1,wet_clean,2026-11-10T07:00:00Z,Crew Amber
            """;

        var errors = await AssertRejectedAsync(await ImportAsync(csv));

        Assert.True(HasError(errors, 3, "kind"), Describe(errors));
        Assert.Equal("wet clean", errors.Single(e => e.GetProperty("row").GetInt32() == 3).GetProperty("value").GetString());
        Assert.True(HasError(errors, 4, "occurred_at"), Describe(errors));
        Assert.Equal("11/12/2026 07:00", errors.Single(e => e.GetProperty("row").GetInt32() == 4).GetProperty("value").GetString());
        // Row 5 repeats row 2.
        Assert.Contains("row 2", errors.Single(e => e.GetProperty("row").GetInt32() == 5).GetProperty("reason").GetString(), StringComparison.Ordinal);
        Assert.Equal(3, errors.Length);
        Assert.Equal(0, await StoredAsync());
        Assert.Equal(0, await AuditedAsync());
    }

    [Fact]
    public async Task Import_EventRecordedAlready_RejectsTheFileAndNamesTheEvent()
    {
        var stored = await ReadJsonAsync(await RecordAsync(Event(at: "2026-11-10T07:00:00Z")));

        var errors = await AssertRejectedAsync(await ImportAsync("""
            chamber,kind,occurred_at,performed_by
            ETA-2,seasoning,2026-11-09T07:00:00Z,Crew Amber
            ETA-1,wet_clean,2026-11-10T07:00:00Z,Crew Amber
            """));

        var error = Assert.Single(errors);
        Assert.Equal((3, "occurred_at", "2026-11-10T07:00:00Z"), (error.GetProperty("row").GetInt32(), error.GetProperty("column").GetString(), error.GetProperty("value").GetString()));
        Assert.Contains($"event {stored.GetProperty("id").GetInt64()}", error.GetProperty("reason").GetString(), StringComparison.Ordinal);
        Assert.Equal(1, await StoredAsync());
    }

    [Theory]
    [InlineData("chamber,kind,occurred_at\nETA-1,wet_clean,2026-11-10T07:00:00Z\n", 1, "performed_by")]
    [InlineData("chamber,kind,occurred_at,performed_by,shift\nETA-1,wet_clean,2026-11-10T07:00:00Z,Crew,day\n", 1, "shift")]
    [InlineData("chamber,kind,occurred_at,performed_by\n", 1, null)]
    [InlineData("", 1, null)]
    [InlineData("chamber,kind,occurred_at,performed_by\nETA-1,wet_clean,2026-11-10T07:00:00Z\n", 2, null)]
    public async Task Import_BadShape_IsRejectedAtItsRow(string csv, int row, string? column)
    {
        var errors = await AssertRejectedAsync(await ImportAsync(csv));

        Assert.True(HasError(errors, row, column), Describe(errors));
        Assert.Equal(0, await StoredAsync());
    }
}
