using System.Security.Claims;
using System.Text.Encodings.Web;
using FinWatch.Data;
using Microsoft.AspNetCore.Authentication;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Access;

/// <summary>
/// Authenticates a tool key (header <c>X-Api-Key</c>, or <c>Authorization: ApiKey …</c>) or a wall screen's display
/// token (cookie <see cref="DisplayCookie"/>, set by <c>GET /display/{token}</c>). Records the key's last use.
/// </summary>
public sealed class KeyAuthenticationHandler(IOptionsMonitor<AuthenticationSchemeOptions> options, ILoggerFactory logger, UrlEncoder encoder,
    FinWatchDbContext db, TimeProvider clock) : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "FinWatchKey";
    public const string Header = "X-Api-Key";
    public const string DisplayCookie = "finwatch-display";

    /// <summary>Whether a request carries a tool key in a header (the scheme selector's first question).</summary>
    public static bool PresentsHeader(HttpRequest request) =>
        request.Headers.ContainsKey(Header) || request.Headers.Authorization.ToString().StartsWith("ApiKey ", StringComparison.Ordinal);

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var fromHeader = Request.Headers[Header].ToString();
        var auth = Request.Headers.Authorization.ToString();
        if (fromHeader.Length == 0 && auth.StartsWith("ApiKey ", StringComparison.Ordinal))
        {
            fromHeader = auth["ApiKey ".Length..].Trim();
        }

        var presented = fromHeader.Length > 0 ? fromHeader : Request.Cookies[DisplayCookie];
        // A person's session wins over a display cookie left in the same browser (the selector only sends it here without one).
        if (string.IsNullOrEmpty(presented))
        {
            return AuthenticateResult.NoResult();
        }

        var key = await ApiKeys.FindAsync(db, presented, Context.RequestAborted);
        if (key is null)
        {
            return AuthenticateResult.Fail("the key or display token is unknown or revoked");
        }

        // A display token only works as the screen's cookie, a tool key only as a header.
        var display = key.Scope == ApiKeys.DisplayScope;
        if (display == (fromHeader.Length > 0))
        {
            return AuthenticateResult.Fail(display ? "a display token is opened at /display/{token}, not sent as a header" : "a tool key is sent as a header");
        }

        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        if (key.LastUsedAtMs is not { } last || now - last > 60_000)
        {
            key.LastUsedAtMs = now; // at most once a minute, so a busy tool does not write on every request
            await db.SaveChangesAsync(Context.RequestAborted);
        }

        var identity = new ClaimsIdentity(
        [
            new Claim(ClaimTypes.Name, $"{(display ? "display" : "key")}:{key.Name}"),
            new Claim(ClaimTypes.Role, display ? Roles.Display : Roles.IngestKey),
            new Claim(Roles.ViaClaim, display ? "display" : "key"),
        ], SchemeName);
        return AuthenticateResult.Success(new AuthenticationTicket(new ClaimsPrincipal(identity), SchemeName));
    }
}

/// <summary>In demo mode, a request without any sign-in is the invented demo engineer (marked on every page).</summary>
public sealed class DemoAuthenticationHandler(IOptionsMonitor<AuthenticationSchemeOptions> options, ILoggerFactory logger, UrlEncoder encoder)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "FinWatchDemo";
    public const string Name = Demo.DemoMonitor.DemoEngineer;

    protected override Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var claims = new List<Claim> { new(ClaimTypes.Name, Name), new(Roles.ViaClaim, "demo") };
        claims.AddRange(Roles.Including(Roles.Engineer).Select(r => new Claim(ClaimTypes.Role, r)));
        return Task.FromResult(AuthenticateResult.Success(new AuthenticationTicket(new ClaimsPrincipal(new ClaimsIdentity(claims, SchemeName)), SchemeName)));
    }
}
