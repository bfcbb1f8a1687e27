using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Products;

/// <summary>A product's site plans: stored per step in order, checked (row, field and value named), audited, engineers only.</summary>
public class SitePlanEndpointsTests : IntegrationTest
{
    private const string Url = $"/api/products/{TestProducts.TriGate}/site-plans";

    private static object Plan(string step, params (string? Id, double? X, double? Y)[] sites) =>
        new { step, sites = sites.Select(s => new { site_id = s.Id, site_x_mm = s.X, site_y_mm = s.Y }).ToArray() };

    [Fact]
    public async Task PutSitePlan_RoundTrip_KeepsTheOrderAndIsAudited()
    {
        var put = await Client.PutAsJsonAsync(Url, Plan("FIN-PROFILE", ("S02", 70, 0), ("S01", 0, 0), ("S03", -12.5, 99.9)));
        Assert.Equal(HttpStatusCode.OK, put.StatusCode);
        await Client.PutAsJsonAsync(Url, Plan("POST-ETCH-CD", ("C01", 0, 0)));

        var all = await ReadJsonAsync(await Client.GetAsync(Url));
        Assert.Equal(TestProducts.TriGate, all.GetProperty("product").GetString());
        var plans = all.GetProperty("plans").EnumerateArray().ToList();
        Assert.Equal(["FIN-PROFILE", "POST-ETCH-CD"], plans.Select(p => p.GetProperty("step").GetString()));
        var sites = plans[0].GetProperty("sites").EnumerateArray().ToList();
        Assert.Equal(["S02", "S01", "S03"], sites.Select(s => s.GetProperty("site_id").GetString())); // as given, not sorted
        Assert.Equal(-12.5, sites[2].GetProperty("site_x_mm").GetDouble());
        Assert.Equal(99.9, sites[2].GetProperty("site_y_mm").GetDouble());
        Assert.Equal("test administrator", plans[0].GetProperty("updated_by").GetString());

        var audit = await Factory.QueryAsync(db => db.AuditEntries.Where(a => a.Entity == "site-plan").OrderBy(a => a.Id).ToListAsync());
        Assert.Equal(2, audit.Count);
        Assert.Equal($"{TestProducts.TriGate} FIN-PROFILE", audit[0].Key);
        Assert.Equal("created", audit[0].Action);
        Assert.Equal("test administrator", audit[0].By);
        Assert.Null(audit[0].BeforeJson);
        Assert.Contains("\"S03\"", audit[0].AfterJson, StringComparison.Ordinal);
    }

    [Fact]
    public async Task PutSitePlan_SameSitesInAnotherOrder_ReplacesThePlanAndAuditsBeforeAndAfter()
    {
        await Client.PutAsJsonAsync(Url, Plan("FIN-PROFILE", ("S01", 0, 0), ("S02", 70, 0)));
        var put = await Client.PutAsJsonAsync(Url, Plan("FIN-PROFILE", ("S02", 70, 0), ("S01", 0, 0), ("S04", 0, -70)));
        Assert.Equal(HttpStatusCode.OK, put.StatusCode);

        var plan = (await ReadJsonAsync(await Client.GetAsync(Url))).GetProperty("plans")[0];
        Assert.Equal(["S02", "S01", "S04"], plan.GetProperty("sites").EnumerateArray().Select(s => s.GetProperty("site_id").GetString()));
        var changed = await Factory.QueryAsync(db => db.AuditEntries.SingleAsync(a => a.Entity == "site-plan" && a.Action == "changed"));
        Assert.DoesNotContain("S04", changed.BeforeJson, StringComparison.Ordinal);
        Assert.Contains("S04", changed.AfterJson, StringComparison.Ordinal);
    }

    [Fact]
    public async Task PutSitePlan_EmptyList_RemovesThePlan()
    {
        await Client.PutAsJsonAsync(Url, Plan("FIN-PROFILE", ("S01", 0, 0)));
        var put = await Client.PutAsJsonAsync(Url, Plan("FIN-PROFILE"));
        Assert.Equal(HttpStatusCode.OK, put.StatusCode);

        Assert.Equal(0, (await ReadJsonAsync(await Client.GetAsync(Url))).GetProperty("plans").GetArrayLength());
        Assert.Equal(0, await Factory.QueryAsync(db => db.SitePlanSites.CountAsync()));
        Assert.True(await Factory.QueryAsync(db => db.AuditEntries.AnyAsync(a => a.Entity == "site-plan" && a.Action == "removed")));
    }

    public static TheoryData<string, object, string, string[]> Invalid => new()
    {
        // The row is 1-based as on the page; the key is the JSON path; the message names the value.
        { "site id twice", Plan("FIN-PROFILE", ("S01", 0, 0), ("S02", 10, 0), ("S01", 20, 0)), "sites[2].site_id", ["row 3", "'S01'", "row 1"] },
        { "x beyond the wafer", Plan("FIN-PROFILE", ("S01", 0, 0), ("S02", 151, 0)), "sites[1].site_x_mm", ["row 2", "151 mm"] },
        { "inside the square, outside the circle", Plan("FIN-PROFILE", ("S01", 120, 120)), "sites[0].site_x_mm", ["row 1", "(120 mm, 120 mm)", "169.7 mm", "radius 150 mm"] },
        { "y missing", Plan("FIN-PROFILE", ("S01", 0, null)), "sites[0].site_y_mm", ["row 1", "y is required"] },
        { "site id missing", Plan("FIN-PROFILE", (null, 0, 0)), "sites[0].site_id", ["row 1", "a value is required"] },
        { "no step", Plan("", ("S01", 0, 0)), "step", ["a value is required"] },
    };

    [Theory]
    [MemberData(nameof(Invalid))]
    public async Task PutSitePlan_Invalid_Returns400NamingRowFieldAndValue_AndStoresNothing(string name, object request, string field, string[] words)
    {
        await Client.PutAsJsonAsync(Url, Plan("FIN-PROFILE", ("K01", 0, 0)));
        var response = await Client.PutAsJsonAsync(Url, request);
        var body = await response.Content.ReadAsStringAsync();
        Assert.True(response.StatusCode == HttpStatusCode.BadRequest, $"{name}: {(int)response.StatusCode} {body}");
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        var errors = JsonDocument.Parse(body).RootElement.GetProperty("errors");
        Assert.True(errors.TryGetProperty(field, out var messages), $"{name}: no error for {field} in {body}");
        var message = messages[0].GetString()!;
        Assert.All(words, w => Assert.Contains(w, message, StringComparison.Ordinal));

        var stored = await Factory.QueryAsync(db => db.SitePlanSites.Select(s => s.SiteId).ToListAsync());
        Assert.Equal(["K01"], stored); // the earlier plan, untouched
        Assert.Equal(1, await Factory.QueryAsync(db => db.AuditEntries.CountAsync(a => a.Entity == "site-plan")));
    }

    [Fact]
    public async Task PutSitePlan_NotANumber_IsAProblemNotAFailure()
    {
        using var content = new StringContent("""{"step":"FIN-PROFILE","sites":[{"site_id":"S01","site_x_mm":"ten","site_y_mm":0}]}""",
            System.Text.Encoding.UTF8, "application/json");
        var response = await Client.PutAsync(Url, content);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Equal("application/problem+json", response.Content.Headers.ContentType?.MediaType);
        Assert.Equal(0, await Factory.QueryAsync(db => db.SitePlanSites.CountAsync()));
    }

    [Fact]
    public async Task SitePlans_UnknownProduct_Answer404Problems()
    {
        var get = await Client.GetAsync("/api/products/NOPE/site-plans");
        Assert.Equal(HttpStatusCode.NotFound, get.StatusCode);
        Assert.Contains("NOPE", (await ReadJsonAsync(get)).GetProperty("detail").GetString(), StringComparison.Ordinal);
        var put = await Client.PutAsJsonAsync("/api/products/NOPE/site-plans", Plan("FIN-PROFILE", ("S01", 0, 0)));
        Assert.Equal(HttpStatusCode.NotFound, put.StatusCode);
    }

    [Theory]
    [InlineData("technician", HttpStatusCode.OK, HttpStatusCode.Forbidden)]
    [InlineData("supervisor", HttpStatusCode.OK, HttpStatusCode.Forbidden)]
    [InlineData("display", HttpStatusCode.OK, HttpStatusCode.Forbidden)]
    [InlineData("engineer", HttpStatusCode.OK, HttpStatusCode.OK)]
    public async Task SitePlans_FloorReads_EngineersWrite(string who, HttpStatusCode read, HttpStatusCode write)
    {
        using var get = new HttpRequestMessage(HttpMethod.Get, Url);
        get.Headers.Add(TestAuthHandler.Header, who);
        Assert.Equal(read, (await Client.SendAsync(get)).StatusCode);

        using var put = new HttpRequestMessage(HttpMethod.Put, Url) { Content = JsonContent.Create(Plan("FIN-PROFILE", ("S01", 0, 0))) };
        put.Headers.Add(TestAuthHandler.Header, who);
        Assert.Equal(write, (await Client.SendAsync(put)).StatusCode);
        Assert.Equal(write == HttpStatusCode.OK ? 1 : 0, await Factory.QueryAsync(db => db.SitePlanSites.CountAsync()));
    }
}
