using System.Security.Claims;
using System.Text.Encodings.Web;
using FinWatch.Server.Features.Access;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Http;
using Microsoft.Extensions.Logging;
using Microsoft.Extensions.Options;

namespace FinWatch.Testing;

/// <summary>
/// Test-only identities (never part of the product): a request's header <see cref="Header"/> names who it is from.
/// "none" uses the product's real schemes (sign-in cookie, tool key, display token, demo); "anonymous" is nobody; a role
/// name (technician, supervisor, engineer, administrator) or "display" / "ingest-key" is a principal with that role.
/// Without the header, <see cref="FinWatchAppFactory.DefaultIdentity"/> applies (an administrator unless a test says
/// otherwise), so the feature tests need no sign-in and the access tests can ask for each identity.
/// </summary>
public sealed class TestAuthHandler(IOptionsMonitor<AuthenticationSchemeOptions> options, ILoggerFactory logger, UrlEncoder encoder, FinWatchAppFactory factory)
    : AuthenticationHandler<AuthenticationSchemeOptions>(options, logger, encoder)
{
    public const string SchemeName = "FinWatchTest";
    public const string Header = "X-Test-As";

    protected override async Task<AuthenticateResult> HandleAuthenticateAsync()
    {
        var who = Request.Headers.TryGetValue(Header, out var value) ? value.ToString() : factory.DefaultIdentity;
        switch (who)
        {
            case "none":
                return await Context.AuthenticateAsync(AccessExtensions.Scheme);
            case "anonymous":
                return AuthenticateResult.NoResult();
        }

        var claims = new List<Claim> { new(ClaimTypes.Name, $"test {who}"), new(Roles.ViaClaim, "test") };
        claims.AddRange(Roles.Including(who).Select(r => new Claim(ClaimTypes.Role, r)));
        return AuthenticateResult.Success(new AuthenticationTicket(new ClaimsPrincipal(new ClaimsIdentity(claims, SchemeName)), SchemeName));
    }

    protected override async Task HandleChallengeAsync(AuthenticationProperties properties)
    {
        Response.StatusCode = StatusCodes.Status401Unauthorized;
        await Task.CompletedTask;
    }
}
