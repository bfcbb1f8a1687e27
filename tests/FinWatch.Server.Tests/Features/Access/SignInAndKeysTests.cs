using System.Net;
using System.Net.Http.Json;
using System.Security.Cryptography;
using System.Text;
using System.Text.Json;
using FinWatch.Testing;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Tests.Features.Access;

/// <summary>The product's own schemes (the test header says "none"): sign-in cookie with antiforgery, lockout, tool keys, display tokens.</summary>
public sealed class SignInAndKeysTests : IntegrationTest
{
    private const string Password = "correct horse battery";

    private HttpClient Real()
    {
        var client = Factory.CreateClient(); // handles cookies
        client.DefaultRequestHeaders.Add(TestAuthHandler.Header, "none");
        return client;
    }

    private async Task AddPersonAsync(string name, string role) =>
        Assert.Equal(HttpStatusCode.Created, (await Client.PostAsJsonAsync("/api/people", new { name, role, password = Password })).StatusCode);

    private static async Task<string> TokenAsync(HttpClient client) =>
        (await client.GetFromJsonAsync<JsonElement>("/api/auth/antiforgery")).GetProperty("token").GetString()!;

    private static async Task<HttpResponseMessage> PostAsync(HttpClient client, string path, object body, string? token)
    {
        using var request = new HttpRequestMessage(HttpMethod.Post, path) { Content = JsonContent.Create(body) };
        if (token is not null)
        {
            request.Headers.Add("X-FinWatch-Antiforgery", token);
        }

        return await client.SendAsync(request);
    }

    [Fact]
    public async Task SignIn_WithCookie_WritesNeedTheAntiforgeryToken()
    {
        await AddPersonAsync("eng one", "engineer");
        using var client = Real();
        Assert.Equal(HttpStatusCode.Unauthorized, (await client.GetAsync("/api/contexts")).StatusCode);

        var signedIn = await PostAsync(client, "/api/auth/sign-in", new { name = "eng one", password = Password }, await TokenAsync(client));
        Assert.Equal(HttpStatusCode.OK, signedIn.StatusCode);
        var me = await client.GetFromJsonAsync<JsonElement>("/api/auth/me");
        Assert.Equal("eng one", me.GetProperty("name").GetString());
        Assert.Equal("engineer", me.GetProperty("role").GetString());
        Assert.Equal("cookie", me.GetProperty("via").GetString());

        var context = new { code = "AF-1", product = TestProducts.TriGate, step = "FIN-PROFILE", parameter = "top_width_nm" };
        var without = await PostAsync(client, "/api/contexts", context, null);
        Assert.Equal(HttpStatusCode.BadRequest, without.StatusCode);
        Assert.Contains("/problems/antiforgery", await without.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        Assert.Equal(0, await Factory.QueryAsync(db => db.ChartContexts.CountAsync()));

        var with = await PostAsync(client, "/api/contexts", context, await TokenAsync(client));
        Assert.Equal(HttpStatusCode.Created, with.StatusCode);
        var audit = await Client.GetFromJsonAsync<JsonElement>("/api/audit?entity=context");
        Assert.Equal("eng one", audit[0].GetProperty("by").GetString());
    }

    [Fact]
    public async Task SignIn_RoleLimitsWhatAPersonMayDo()
    {
        await AddPersonAsync("tech one", "technician");
        using var client = Real();
        await PostAsync(client, "/api/auth/sign-in", new { name = "tech one", password = Password }, await TokenAsync(client));
        Assert.Equal(HttpStatusCode.OK, (await client.GetAsync("/api/contexts")).StatusCode);
        var refused = await PostAsync(client, "/api/contexts", new { code = "X" }, await TokenAsync(client));
        Assert.Equal(HttpStatusCode.Forbidden, refused.StatusCode);
        Assert.Equal("application/problem+json", refused.Content.Headers.ContentType?.MediaType);
    }

    [Fact]
    public async Task SignIn_FiveWrongPasswords_LockTheAccount()
    {
        // Lockout after 5 failures is the FinWatch default (FinWatch:Auth:LockoutAttempts), a common practice value.
        await AddPersonAsync("sup one", "supervisor");
        using var client = Real();
        for (var i = 0; i < 5; i++)
        {
            var wrong = await PostAsync(client, "/api/auth/sign-in", new { name = "sup one", password = "not the password" }, await TokenAsync(client));
            Assert.True(wrong.StatusCode is HttpStatusCode.Unauthorized or HttpStatusCode.Locked, $"attempt {i + 1}: {wrong.StatusCode}");
        }

        var right = await PostAsync(client, "/api/auth/sign-in", new { name = "sup one", password = Password }, await TokenAsync(client));
        Assert.Equal(HttpStatusCode.Locked, right.StatusCode);
        Assert.Contains("locked", await right.Content.ReadAsStringAsync(), StringComparison.OrdinalIgnoreCase);
    }

    [Fact]
    public async Task IngestKey_IsShownOnce_StoredHashed_OnlyIngests_AndCanBeRevoked()
    {
        var created = await Client.PostAsJsonAsync("/api/keys", new { name = "profile tool MP11", scope = "ingest" });
        Assert.Equal(HttpStatusCode.Created, created.StatusCode);
        var body = await created.Content.ReadFromJsonAsync<JsonElement>();
        var key = body.GetProperty("key").GetString()!;
        var id = body.GetProperty("details").GetProperty("id").GetInt32();
        Assert.DoesNotContain(key, await Client.GetStringAsync("/api/keys"), StringComparison.Ordinal);
        var stored = await Factory.QueryAsync(db => db.ApiKeys.SingleAsync());
        Assert.NotEqual(key, stored.Hash);
        Assert.Equal(Convert.ToHexStringLower(SHA256.HashData(Encoding.UTF8.GetBytes(key))), stored.Hash); // .NET's SHA-256 as the reference

        using var tool = Real();
        tool.DefaultRequestHeaders.Add("X-Api-Key", key);
        var csv = SiteRow.Csv([new SiteRow { LotId = "K0001" }]);
        var ingest = await tool.PostAsync("/api/measurements/csv", new StringContent(csv, Encoding.UTF8, "text/csv"));
        Assert.Equal(HttpStatusCode.OK, ingest.StatusCode);
        Assert.Equal(HttpStatusCode.Forbidden, (await tool.GetAsync("/api/contexts")).StatusCode);
        Assert.NotNull((await Factory.QueryAsync(db => db.ApiKeys.SingleAsync())).LastUsedAtMs);

        Assert.Equal(HttpStatusCode.OK, (await Client.PostAsync($"/api/keys/{id}/revoke", null)).StatusCode);
        var after = await tool.PostAsync("/api/measurements/csv", new StringContent(csv, Encoding.UTF8, "text/csv"));
        Assert.Equal(HttpStatusCode.Unauthorized, after.StatusCode);
    }

    [Fact]
    public async Task DisplayToken_ShowsTheFloorOnly_UntilRevoked()
    {
        var created = await (await Client.PostAsJsonAsync("/api/keys", new { name = "wall screen bay 3", scope = "display" })).Content.ReadFromJsonAsync<JsonElement>();
        var token = created.GetProperty("key").GetString()!;
        using var screen = Factory.CreateClient(new Microsoft.AspNetCore.Mvc.Testing.WebApplicationFactoryClientOptions { AllowAutoRedirect = false });
        screen.DefaultRequestHeaders.Add(TestAuthHandler.Header, "none");
        var open = await screen.GetAsync($"/display/{token}");
        Assert.Equal(HttpStatusCode.Redirect, open.StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await screen.GetAsync("/api/contexts")).StatusCode);
        Assert.Equal(HttpStatusCode.OK, (await screen.GetAsync("/api/alerts?state=open")).StatusCode); // the wall screen's banner
        Assert.Equal(HttpStatusCode.Forbidden, (await screen.GetAsync("/api/alerts/1")).StatusCode); // an alert's history and comments
        Assert.Equal(HttpStatusCode.Forbidden, (await screen.GetAsync("/api/lots")).StatusCode);
        var me = await screen.GetFromJsonAsync<JsonElement>("/api/auth/me");
        Assert.Equal("display", me.GetProperty("via").GetString());

        await Client.PostAsync($"/api/keys/{created.GetProperty("details").GetProperty("id").GetInt32()}/revoke", null);
        Assert.Equal(HttpStatusCode.Unauthorized, (await screen.GetAsync("/api/contexts")).StatusCode);
    }

    [Fact]
    public async Task People_NeedAPasswordOfTwelveCharacters_AndNoDefaultAccountExists()
    {
        Assert.Equal(0, await Factory.QueryAsync(db => db.Users.CountAsync())); // no default administrator, no default password
        var shortPassword = await Client.PostAsJsonAsync("/api/people", new { name = "p", role = "technician", password = "short" });
        Assert.Equal(HttpStatusCode.BadRequest, shortPassword.StatusCode);
        Assert.Contains("password", await shortPassword.Content.ReadAsStringAsync(), StringComparison.Ordinal);
        var badRole = await Client.PostAsJsonAsync("/api/people", new { name = "p", role = "owner", password = Password });
        Assert.Contains("role is one of technician, supervisor, engineer, administrator", await badRole.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }
}
