using System.Net;
using System.Net.Http.Json;
using System.Text.Json;
using FinWatch.Testing;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// FinWatch:Auth:DataProtectionKeysPath: instances given one folder accept each other's antiforgery tokens (and
/// session cookies, protected by the same ring); an instance with another folder refuses them. SQLite suffices here:
/// the key ring does not live in the database.
/// </summary>
public sealed class SharedKeyRingTests : IDisposable
{
    private readonly string shared = Directory.CreateTempSubdirectory("finwatch-keys-").FullName;
    private readonly string other = Directory.CreateTempSubdirectory("finwatch-keys-").FullName;

    private static FinWatchAppFactory Instance(string keys) => new FinWatchAppFactory().With("FinWatch:Auth:DataProtectionKeysPath", keys);

    // A sign-in for nobody, carrying the token and cookie that instance A issued: past the antiforgery check it is a
    // plain wrong sign-in (401); refused by the check it is the antiforgery problem (400).
    private static async Task<HttpResponseMessage> SignInWithTokenFromAsync(FinWatchAppFactory issuer, FinWatchAppFactory receiver)
    {
        using var fromA = issuer.Server.CreateClient();
        fromA.DefaultRequestHeaders.Add(TestAuthHandler.Header, "none");
        var response = await fromA.GetAsync("/api/auth/antiforgery");
        var token = (await response.Content.ReadFromJsonAsync<JsonElement>()).GetProperty("token").GetString()!;
        var cookies = string.Join("; ", response.Headers.GetValues("Set-Cookie").Select(c => c.Split(';')[0]));

        using var toB = receiver.Server.CreateClient();
        using var request = new HttpRequestMessage(HttpMethod.Post, "/api/auth/sign-in") { Content = JsonContent.Create(new { name = "nobody here", password = "not a real password" }) };
        request.Headers.Add(TestAuthHandler.Header, "none");
        request.Headers.Add("X-FinWatch-Antiforgery", token);
        request.Headers.Add("Cookie", cookies);
        return await toB.SendAsync(request);
    }

    [Fact]
    public async Task AntiforgeryToken_FromOneInstance_IsAcceptedByAnotherWithTheSameKeyFolder()
    {
        using var a = Instance(shared);
        using var b = Instance(shared);
        var response = await SignInWithTokenFromAsync(a, b);
        Assert.Equal(HttpStatusCode.Unauthorized, response.StatusCode);
        Assert.NotEmpty(Directory.GetFiles(shared, "key-*.xml"));
    }

    [Fact]
    public async Task AntiforgeryToken_FromOneInstance_IsRefusedByAnInstanceWithAnotherKeyFolder()
    {
        using var a = Instance(shared);
        using var c = Instance(other);
        var response = await SignInWithTokenFromAsync(a, c);
        Assert.Equal(HttpStatusCode.BadRequest, response.StatusCode);
        Assert.Contains("/problems/antiforgery", await response.Content.ReadAsStringAsync(), StringComparison.Ordinal);
    }

    public void Dispose()
    {
        Directory.Delete(shared, recursive: true);
        Directory.Delete(other, recursive: true);
    }
}
