using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Audit;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Authorization;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Identity;
using Microsoft.AspNetCore.Mvc;

namespace FinWatch.Server.Features.Access;

public sealed record SignInRequest(string? Name, string? Password);

/// <summary>Who is asking: a person, the demo engineer, a display or a tool, and what they may do.</summary>
public sealed record MeResponse(bool SignedIn, string? Name, string? Role, string? Via, bool Demo, IReadOnlyList<string> Permissions);

public sealed record AntiforgeryResponse(string Token, string Header);

public static class AuthEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var group = app.MapGroup("/api/auth").WithTags("Access").AllowAnonymous();
        group.MapPost("/sign-in", SignInAsync).RequireRateLimiting(AccessExtensions.SignInLimiter).WithSummary("Sign in with name and password (sets the session cookie)");
        group.MapPost("/sign-out", SignOutAsync).WithSummary("Sign out");
        group.MapGet("/me", MeAsync).WithSummary("Who the request is from and what it may do");
        group.MapGet("/antiforgery", (HttpContext http, IAntiforgery antiforgery) =>
            TypedResults.Ok(new AntiforgeryResponse(antiforgery.GetAndStoreTokens(http).RequestToken!, AccessExtensions.AntiforgeryHeader)))
            .WithSummary("A token for the header that browser writes carry");
        app.MapGet("/display/{token}", OpenDisplayAsync).WithTags("Access").AllowAnonymous()
            .WithSummary("Open the floor overview on a wall screen with a display token (sets its cookie, then shows /)");
    }

    private static async Task<Results<Ok<MeResponse>, ProblemHttpResult>> SignInAsync(
        SignInRequest r, SignInManager<FinWatchUser> signIn, FinWatchDbContext db, TimeProvider clock, HttpContext http, IAuthorizationService authorization)
    {
        var user = string.IsNullOrWhiteSpace(r.Name) ? null : await signIn.UserManager.FindByNameAsync(r.Name.Trim());
        if (user is null || string.IsNullOrEmpty(r.Password) || user.DisabledAtMs is not null)
        {
            return Refused("The name or the password is wrong.");
        }

        var result = await signIn.PasswordSignInAsync(user, r.Password, isPersistent: false, lockoutOnFailure: true);
        if (result.IsLockedOut)
        {
            var until = await signIn.UserManager.GetLockoutEndDateAsync(user);
            return TypedResults.Problem(new ProblemDetails
            {
                Type = "/problems/locked-out", Status = StatusCodes.Status423Locked, Title = "The account is locked.",
                Detail = $"Too many wrong passwords; try again after {until:u} or ask an administrator.",
            });
        }

        if (!result.Succeeded)
        {
            return Refused("The name or the password is wrong.");
        }

        http.Response.Cookies.Delete(KeyAuthenticationHandler.DisplayCookie); // this browser is now a person's, not a wall screen's
        AuditLog.Add(db, user.UserName!, "person", user.UserName!, "signed-in", null, null, clock);
        await db.SaveChangesAsync(http.RequestAborted);
        var principal = await signIn.CreateUserPrincipalAsync(user);
        return TypedResults.Ok(await DescribeAsync(principal, demo: false, authorization));
    }

    private static ProblemHttpResult Refused(string detail) => TypedResults.Problem(new ProblemDetails
    {
        Type = "/problems/sign-in", Status = StatusCodes.Status401Unauthorized, Title = "Not signed in.", Detail = detail,
    });

    private static async Task<NoContent> SignOutAsync(SignInManager<FinWatchUser> signIn)
    {
        await signIn.SignOutAsync();
        return TypedResults.NoContent();
    }

    private static async Task<Ok<MeResponse>> MeAsync(HttpContext http, Microsoft.Extensions.Options.IOptions<Demo.DemoOptions> demo, IAuthorizationService authorization) =>
        TypedResults.Ok(await DescribeAsync(http.User, demo.Value.Enabled, authorization));

    /// <summary>Who the caller is and which policies it passes, asked of the policies themselves (no second copy of the rules).</summary>
    internal static async Task<MeResponse> DescribeAsync(System.Security.Claims.ClaimsPrincipal user, bool demo, IAuthorizationService authorization)
    {
        if (user.Identity?.IsAuthenticated != true)
        {
            return new MeResponse(false, null, null, null, demo, []);
        }

        var roles = user.FindAll(System.Security.Claims.ClaimTypes.Role).Select(c => c.Value).ToHashSet();
        var may = new List<string>();
        foreach (var policy in Permissions.All)
        {
            if ((await authorization.AuthorizeAsync(user, policy)).Succeeded)
            {
                may.Add(policy);
            }
        }

        return new MeResponse(true, user.Identity.Name, Roles.Ladder.LastOrDefault(roles.Contains) ?? roles.FirstOrDefault(), user.Via(), demo, may);
    }

    private static async Task<Results<RedirectHttpResult, ProblemHttpResult>> OpenDisplayAsync(string token, FinWatchDbContext db, HttpContext http)
    {
        var key = await ApiKeys.FindAsync(db, token, http.RequestAborted);
        if (key is null || key.Scope != ApiKeys.DisplayScope)
        {
            return TypedResults.Problem(new ProblemDetails
            {
                Type = "/problems/display-token", Status = StatusCodes.Status404NotFound, Title = "Unknown display token.",
                Detail = "This display token is unknown or was revoked; ask an administrator for a new one.",
            });
        }

        http.Response.Cookies.Append(KeyAuthenticationHandler.DisplayCookie, token, new CookieOptions
        {
            HttpOnly = true, SameSite = SameSiteMode.Strict, Secure = http.Request.IsHttps, MaxAge = TimeSpan.FromDays(365), IsEssential = true,
        });
        return TypedResults.Redirect("/");
    }
}
