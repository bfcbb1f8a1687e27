using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;
using static FinWatch.Testing.ShiftFixture;

namespace FinWatch.Server.Tests.Features.Reports;

/// <summary>
/// The handover of the early shift of 2026-12-01 (default pattern, UTC, 06:00–14:00; the fake clock starts at 08:00):
/// notes by the outgoing supervisor, locked when they sign, then the incoming supervisor's sign-off as another person,
/// each change in the audit trail. Test callers are named "test {role}" (TestAuthHandler).
/// </summary>
public sealed class HandoverTests : IntegrationTest
{
    private const string Early = "?date=2026-12-01&shift=early";

    private async Task<HttpResponseMessage> SendAsync(HttpMethod method, string path, string who, object? body)
    {
        using var request = new HttpRequestMessage(method, path);
        request.Headers.Add(TestAuthHandler.Header, who);
        if (body is not null)
        {
            request.Content = JsonContent.Create(body);
        }

        return await Client.SendAsync(request);
    }

    private Task<HttpResponseMessage> NotesAsync(string who, string? notes, string query = Early) =>
        SendAsync(HttpMethod.Put, $"/api/reports/shift/handover{query}", who, new { notes });

    private Task<HttpResponseMessage> SignAsync(string who, string role, string query = Early) =>
        SendAsync(HttpMethod.Post, $"/api/reports/shift/handover/sign-off{query}", who, new { role });

    private static async Task<JsonElement> OkAsync(HttpResponseMessage response)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.OK, $"{(int)response.StatusCode}: {body}");
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    private static async Task<JsonElement> ProblemAsync(HttpResponseMessage response, HttpStatusCode status)
    {
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == status, $"expected {(int)status}, got {(int)response.StatusCode}: {body}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        return JsonDocument.Parse(body).RootElement.Clone();
    }

    [Fact]
    public async Task Handover_NotesThenBothSignOffs_AreStoredInTheReportAndAudited()
    {
        // Nothing stored: empty notes, no sign-off.
        var empty = await OkAsync(await SendAsync(HttpMethod.Get, $"/api/reports/shift/handover{Early}", "technician", null));
        Assert.Equal(("", JsonValueKind.Null, false), (empty.GetProperty("notes").GetString(), empty.GetProperty("outgoing").ValueKind, empty.GetProperty("notes_locked").GetBoolean()));

        Factory.Clock.SetUtcNow(Day.AddHours(13.5));
        await OkAsync(await NotesAsync("supervisor", "first draft"));
        var written = await OkAsync(await NotesAsync("supervisor", "ETA-1 held after the wet clean; re-measure lot L0001 first"));
        Assert.Equal("test supervisor", written.GetProperty("notes_by").GetString());
        Assert.Equal(Day.AddHours(13.5), written.GetProperty("notes_at").GetDateTimeOffset());

        Factory.Clock.SetUtcNow(Day.AddHours(14));
        var outgoing = await OkAsync(await SignAsync("supervisor", "outgoing"));
        Assert.Equal(("test supervisor", true), (outgoing.GetProperty("outgoing").GetProperty("by").GetString(), outgoing.GetProperty("notes_locked").GetBoolean()));
        Assert.Equal(Day.AddHours(14), outgoing.GetProperty("outgoing").GetProperty("at").GetDateTimeOffset());

        Factory.Clock.SetUtcNow(Day.AddHours(14.25));
        var incoming = await OkAsync(await SignAsync("engineer", "incoming"));
        Assert.Equal("test engineer", incoming.GetProperty("incoming").GetProperty("by").GetString());

        // One row, in the shift report too (JSON and CSV).
        Assert.Equal(1, await Factory.QueryAsync(db => db.ShiftHandovers.CountAsync()));
        var report = await OkAsync(await Client.GetAsync($"/api/reports/shift{Early}"));
        var handover = report.GetProperty("handover");
        Assert.Equal("ETA-1 held after the wet clean; re-measure lot L0001 first", handover.GetProperty("notes").GetString());
        Assert.Equal(("test supervisor", "test engineer"), (handover.GetProperty("outgoing").GetProperty("by").GetString(), handover.GetProperty("incoming").GetProperty("by").GetString()));
        var csv = await Client.GetStringAsync($"/api/reports/shift.csv{Early}");
        Assert.Contains("handover,1,ETA-1 held after the wet clean; re-measure lot L0001 first,test supervisor,2026-12-01T13:30:00.000Z,test supervisor,2026-12-01T14:00:00.000Z,test engineer,2026-12-01T14:15:00.000Z", csv, StringComparison.Ordinal);

        // The audit trail: four changes, newest first, each with the state before and after.
        var audit = (await Client.GetFromJsonAsync<JsonElement>("/api/audit?entity=handover")).EnumerateArray().ToList();
        Assert.Equal(["signed_incoming", "signed_outgoing", "notes_written", "notes_written"], audit.Select(a => a.GetProperty("action").GetString()));
        Assert.All(audit, a => Assert.Equal("2026-12-01/early", a.GetProperty("key").GetString()));
        Assert.Equal(["test engineer", "test supervisor", "test supervisor", "test supervisor"], audit.Select(a => a.GetProperty("by").GetString()));
        Assert.Null(audit[3].GetProperty("before").GetString()); // the first notes created the handover
        Assert.Contains("first draft", audit[2].GetProperty("before").GetString(), StringComparison.Ordinal);
        Assert.Contains("test engineer", audit[0].GetProperty("after").GetString(), StringComparison.Ordinal);
    }

    [Fact]
    public async Task Handover_SamePersonOnBothSides_IsRefused_AndTheNotesLockWhenSigned()
    {
        await OkAsync(await NotesAsync("supervisor", "nothing unusual"));
        await OkAsync(await SignAsync("supervisor", "outgoing"));

        var locked = await ProblemAsync(await NotesAsync("supervisor", "changed afterwards"), HttpStatusCode.Conflict);
        Assert.Equal("The handover notes are locked.", locked.GetProperty("title").GetString());
        Assert.Contains("signed by the outgoing supervisor test supervisor", locked.GetProperty("detail").GetString(), StringComparison.Ordinal);

        var twice = await ProblemAsync(await SignAsync("supervisor", "incoming"), HttpStatusCode.Forbidden);
        Assert.Equal("The same person cannot sign both sides of a handover.", twice.GetProperty("title").GetString());
        Assert.Contains("must be another person", twice.GetProperty("detail").GetString(), StringComparison.Ordinal);

        var again = await ProblemAsync(await SignAsync("administrator", "outgoing"), HttpStatusCode.Conflict);
        Assert.Contains("test supervisor signed the handover of the early shift of 2026-12-01", again.GetProperty("detail").GetString(), StringComparison.Ordinal);

        // The refusals changed nothing: the notes as signed, no incoming sign-off, two audit entries (notes, outgoing sign-off).
        var stored = await OkAsync(await Client.GetAsync($"/api/reports/shift/handover{Early}"));
        Assert.Equal(("nothing unusual", JsonValueKind.Null), (stored.GetProperty("notes").GetString(), stored.GetProperty("incoming").ValueKind));
        Assert.Equal(2, await Factory.QueryAsync(db => db.AuditEntries.CountAsync(a => a.Entity == "handover")));
    }

    [Fact]
    public async Task Handover_OutOfOrder_IsA409ThatSaysWhatToDoFirst()
    {
        var incomingFirst = await ProblemAsync(await SignAsync("engineer", "incoming"), HttpStatusCode.Conflict);
        Assert.Equal("The outgoing supervisor has not signed yet.", incomingFirst.GetProperty("title").GetString());
        var noNotes = await ProblemAsync(await SignAsync("supervisor", "outgoing"), HttpStatusCode.Conflict);
        Assert.Contains("Write the handover notes of the early shift of 2026-12-01", noNotes.GetProperty("detail").GetString(), StringComparison.Ordinal);
        var notStarted = await ProblemAsync(await NotesAsync("supervisor", "too early", "?date=2026-12-01&shift=late"), HttpStatusCode.Conflict);
        Assert.Contains("starts at 2026-12-01 14:00 UTC", notStarted.GetProperty("detail").GetString(), StringComparison.Ordinal);
        Assert.Equal(0, await Factory.QueryAsync(db => db.ShiftHandovers.CountAsync()));
    }

    [Theory]
    [InlineData("PUT", "?date=2026-12-01&shift=early", "{}", "notes", "notes is required")]
    [InlineData("PUT", "", "{\"notes\":\"x\"}", "date", "date is required")]
    [InlineData("PUT", "?date=2026-12-01&shift=noon", "{\"notes\":\"x\"}", "shift", "'noon' is not a shift of the pattern; the shifts are early, late, night")]
    [InlineData("POST", "?date=01.12.2026&shift=early", "{\"role\":\"outgoing\"}", "date", "use YYYY-MM-DD")]
    [InlineData("POST", "?date=2026-12-01&shift=early", "{\"role\":\"leaving\"}", "role", "role 'leaving' is not known; use outgoing (handing over) or incoming (taking over)")]
    [InlineData("POST", "?date=2026-12-01&shift=early", "{}", "role", "role is required")]
    public async Task Handover_BadInput_IsA400NamingTheFieldAndTheAllowedValues(string method, string query, string body, string field, string message)
    {
        var path = method == "PUT" ? "/api/reports/shift/handover" : "/api/reports/shift/handover/sign-off";
        using var request = new HttpRequestMessage(new HttpMethod(method), path + query) { Content = new StringContent(body, System.Text.Encoding.UTF8, "application/json") };
        var problem = await ProblemAsync(await Client.SendAsync(request), HttpStatusCode.BadRequest);
        Assert.Contains(message, problem.GetProperty("errors").GetProperty(field)[0].GetString(), StringComparison.Ordinal);
        Assert.Equal(0, await Factory.QueryAsync(db => db.ShiftHandovers.CountAsync()));
    }

    [Fact]
    public async Task Handover_TooLongNotes_IsA400WithTheLength()
    {
        var problem = await ProblemAsync(await NotesAsync("supervisor", new string('n', 4001)), HttpStatusCode.BadRequest);
        Assert.Equal("notes are 4001 characters long; the most is 4000", problem.GetProperty("errors").GetProperty("notes")[0].GetString());
    }

    [Fact]
    public async Task Handover_TechnicianReads_ButMayNotWriteOrSign()
    {
        Assert.Equal(HttpStatusCode.Forbidden, (await NotesAsync("technician", "a technician's note")).StatusCode);
        Assert.Equal(HttpStatusCode.Forbidden, (await SignAsync("technician", "outgoing")).StatusCode);
        Assert.Equal(HttpStatusCode.Unauthorized, (await SendAsync(HttpMethod.Get, $"/api/reports/shift/handover{Early}", "anonymous", null)).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await SendAsync(HttpMethod.Get, $"/api/reports/shift/handover{Early}", "technician", null)).StatusCode);
        Assert.Equal(0, await Factory.QueryAsync(db => db.ShiftHandovers.CountAsync()));
    }
}
