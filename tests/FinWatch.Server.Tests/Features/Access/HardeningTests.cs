using System.Net;
using System.Net.Http.Json;
using System.Text;
using System.Text.Json;
using System.Text.RegularExpressions;
using FinWatch.Testing;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Access;

/// <summary>Security headers, body limits, rate limits, the bootstrap administrator, the append-only audit trail, and the pages' CSP rules.</summary>
public sealed partial class HardeningTests : IntegrationTest
{
    public HardeningTests()
    {
        Factory.With("FinWatch:Auth:SignInPerMinute", "3")
            .With("FinWatch:Auth:BootstrapAdminName", "chief")
            .With("FinWatch:Auth:BootstrapAdminPassword", "a long invented password")
            .With("FinWatch:Auth:MaxJsonBodyBytes", "20000")
            .With("FinWatch:Auth:IngestPerMinute", "2");
    }

    [Fact]
    public async Task Answers_CarryTheSecurityHeaders_AndACspWithoutInlineScript()
    {
        foreach (var path in new[] { "/", "/chart.html", "/api/contexts" })
        {
            var response = await Client.GetAsync(path);
            var csp = response.Headers.GetValues("Content-Security-Policy").Single();
            Assert.Contains("script-src 'self'", csp, StringComparison.Ordinal);
            Assert.DoesNotContain("unsafe-inline", csp, StringComparison.Ordinal);
            Assert.DoesNotContain("unsafe-eval", csp, StringComparison.Ordinal);
            Assert.Contains("frame-ancestors 'none'", csp, StringComparison.Ordinal);
            Assert.Equal("nosniff", response.Headers.GetValues("X-Content-Type-Options").Single());
            Assert.Equal("DENY", response.Headers.GetValues("X-Frame-Options").Single());
        }
    }

    [GeneratedRegex(@"<script(?![^>]*\bsrc=)[^>]*>|\sstyle\s*=|\son[a-z]+\s*=", RegexOptions.IgnoreCase)]
    private static partial Regex InlineCode();

    [GeneratedRegex(@"\.(inner|outer)HTML\s*[+]?=|insertAdjacentHTML\s*\(|document\.write(ln)?\s*\(")]
    private static partial Regex MarkupFromStrings();

    [Fact]
    public void Pages_HaveNoInlineScriptStyleOrHandlers_AndModulesNoInnerHtml()
    {
        var root = Path.Combine(TestPaths.RepositoryRoot(), "src", "FinWatch.Server", "wwwroot");
        var pages = Directory.GetFiles(root, "*.html");
        Assert.NotEmpty(pages);
        foreach (var page in pages)
        {
            Assert.False(InlineCode().IsMatch(File.ReadAllText(page)), $"{Path.GetFileName(page)} has inline script, style or an on… handler");
        }

        foreach (var module in Directory.GetFiles(Path.Combine(root, "js"), "*.js", SearchOption.AllDirectories))
        {
            var text = File.ReadAllText(module);
            Assert.False(MarkupFromStrings().IsMatch(text), $"{Path.GetFileName(module)} writes markup from strings");
            // Every module is type-checked by editors that read JSDoc, and takes its colours from the stylesheet's
            // variables (read once by core/charts.js), so each colour keeps its one meaning.
            Assert.True(text.StartsWith("// @ts-check", StringComparison.Ordinal), $"{Path.GetFileName(module)} does not start with // @ts-check");
            Assert.True(Path.GetFileName(module) == "charts.js" || !HexColour().IsMatch(text), $"{Path.GetFileName(module)} has its own colour literal");
        }
    }

    [GeneratedRegex("'#[0-9a-fA-F]{3,8}'")]
    private static partial Regex HexColour();

    [Fact]
    public async Task LargeBody_OnAnOrdinaryEndpoint_IsRefusedWith413()
    {
        // Body limits are a server feature the in-process test server does not have: this one runs on Kestrel.
        using var factory = new FinWatchAppFactory().With("FinWatch:Auth:MaxJsonBodyBytes", "20000");
        factory.UseKestrel(0);
        factory.StartServer();
        using var client = factory.CreateClient();
        var body = new string('x', 50_000);
        var response = await client.PostAsync("/api/contexts", new StringContent($"{{\"title\":\"{body}\"}}", Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.RequestEntityTooLarge, response.StatusCode);
        var small = await client.PostAsync("/api/contexts", new StringContent("{\"title\":\"small\"}", Encoding.UTF8, "application/json"));
        Assert.Equal(HttpStatusCode.BadRequest, small.StatusCode); // under the limit it reaches the validation
    }

    [Fact]
    public async Task SignIn_MoreThanTheLimitPerMinute_Is429()
    {
        using var client = Factory.CreateClient();
        client.DefaultRequestHeaders.Add(TestAuthHandler.Header, "none");
        var statuses = new List<HttpStatusCode>();
        for (var i = 0; i < 4; i++)
        {
            var token = (await client.GetFromJsonAsync<JsonElement>("/api/auth/antiforgery")).GetProperty("token").GetString()!;
            using var request = new HttpRequestMessage(HttpMethod.Post, "/api/auth/sign-in") { Content = JsonContent.Create(new { name = "chief", password = "wrong" }) };
            request.Headers.Add("X-FinWatch-Antiforgery", token);
            statuses.Add((await client.SendAsync(request)).StatusCode);
        }

        Assert.Equal([HttpStatusCode.Unauthorized, HttpStatusCode.Unauthorized, HttpStatusCode.Unauthorized, HttpStatusCode.TooManyRequests], statuses);
    }

    [Fact]
    public async Task Ingest_MoreThanTheLimitPerMinute_Is429_AndStoresNothing()
    {
        var statuses = new List<HttpStatusCode>();
        for (var i = 0; i < 3; i++)
        {
            var csv = SiteRow.Csv([new SiteRow { LotId = $"R000{i}" }]);
            statuses.Add((await Client.PostAsync("/api/measurements/csv", new StringContent(csv, Encoding.UTF8, "text/csv"))).StatusCode);
        }

        Assert.Equal([HttpStatusCode.OK, HttpStatusCode.OK, HttpStatusCode.TooManyRequests], statuses);
        Assert.Equal(2, await Factory.QueryAsync(db => db.IngestBatches.CountAsync()));
    }

    [Fact]
    public async Task BootstrapAdministrator_IsCreatedFromConfiguration()
    {
        var people = await Client.GetFromJsonAsync<JsonElement>("/api/people");
        var chief = people.EnumerateArray().Single();
        Assert.Equal("chief", chief.GetProperty("name").GetString());
        Assert.Equal("administrator", chief.GetProperty("role").GetString());
    }

    [Fact]
    public async Task AuditTrail_RecordsBeforeAndAfter_AndTheDatabaseRefusesToChangeIt()
    {
        var product = await Client.GetFromJsonAsync<JsonElement>($"/api/products/{TestProducts.TriGate}");
        var changed = JsonSerializer.Deserialize<Dictionary<string, object>>(product.GetRawText())!;
        changed["name"] = "renamed for the audit test";
        Assert.Equal(HttpStatusCode.OK, (await Client.PutAsJsonAsync($"/api/products/{TestProducts.TriGate}", changed)).StatusCode);

        var entries = await Client.GetFromJsonAsync<JsonElement>($"/api/audit?entity=product&key={TestProducts.TriGate}");
        var change = entries.EnumerateArray().First(e => e.GetProperty("action").GetString() == "changed");
        Assert.Equal("test administrator", change.GetProperty("by").GetString());
        Assert.Contains("\"name\":\"" + product.GetProperty("name").GetString(), change.GetProperty("before").GetString(), StringComparison.Ordinal);
        Assert.Contains("renamed for the audit test", change.GetProperty("after").GetString(), StringComparison.Ordinal);
        var csv = await Client.GetStringAsync("/api/audit/csv");
        Assert.StartsWith("id,at_utc,by,entity,key,action,before_json,after_json\n", csv, StringComparison.Ordinal);
        Assert.Contains("renamed for the audit test", csv, StringComparison.Ordinal);

        await using var connection = new SqliteConnection($"Data Source={Factory.DatabasePath}");
        await connection.OpenAsync();
        foreach (var sql in new[] { "UPDATE audit_entries SET by = 'someone else'", "DELETE FROM audit_entries" })
        {
            await using var command = connection.CreateCommand();
            command.CommandText = sql;
            var refused = await Assert.ThrowsAsync<SqliteException>(() => command.ExecuteNonQueryAsync());
            Assert.Contains("append-only", refused.Message, StringComparison.Ordinal);
        }

        Assert.True(await Factory.QueryAsync(db => db.AuditEntries.CountAsync()) >= 3); // two products created, one changed, one person
    }
}
