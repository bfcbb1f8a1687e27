using System.Security.Claims;
using System.Threading.RateLimiting;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Demo;
using Microsoft.AspNetCore.Antiforgery;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Authorization;
using Microsoft.AspNetCore.DataProtection;
using Microsoft.AspNetCore.Http.Features;
using Microsoft.AspNetCore.Identity;
using Microsoft.AspNetCore.Mvc;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Access;

public static class AccessExtensions
{
    /// <summary>The default scheme: it picks the key, the sign-in cookie or (in demo mode) the demo engineer.</summary>
    public const string Scheme = "FinWatch";

    public const string AntiforgeryHeader = "X-FinWatch-Antiforgery";
    public const string SessionCookie = "finwatch-session";
    public const string SignInLimiter = "sign-in";
    public const string IngestLimiter = "ingest";

    public static WebApplicationBuilder AddAccess(this WebApplicationBuilder builder)
    {
        var services = builder.Services;
        services.AddOptions<AccessOptions>().BindConfiguration(AccessOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        var access = builder.Configuration.GetSection(AccessOptions.Section).Get<AccessOptions>() ?? new AccessOptions();
        if (access.DataProtectionKeysPath is { Length: > 0 } keys)
        {
            services.AddDataProtection().SetApplicationName("FinWatch").PersistKeysToFileSystem(Directory.CreateDirectory(keys));
        }

        services.AddIdentityCore<FinWatchUser>(o =>
            {
                o.Password.RequiredLength = 12;
                o.Password.RequireNonAlphanumeric = false;
                o.Password.RequireUppercase = false;
                o.Password.RequireLowercase = false;
                o.Password.RequireDigit = false;
                o.Lockout.AllowedForNewUsers = true;
                o.Lockout.MaxFailedAccessAttempts = access.LockoutAttempts;
                o.Lockout.DefaultLockoutTimeSpan = TimeSpan.FromMinutes(access.LockoutMinutes);
                o.User.AllowedUserNameCharacters = "abcdefghijklmnopqrstuvwxyzABCDEFGHIJKLMNOPQRSTUVWXYZ0123456789-._ ";
            })
            .AddEntityFrameworkStores<FinWatchDbContext>()
            .AddSignInManager()
            .AddClaimsPrincipalFactory<RoleClaimsFactory>()
            .AddDefaultTokenProviders();
        services.Configure<SecurityStampValidatorOptions>(o => o.ValidationInterval = TimeSpan.FromMinutes(1));

        services.AddAuthentication(o =>
            {
                o.DefaultScheme = Scheme;
                o.DefaultChallengeScheme = Scheme;
            })
            .AddPolicyScheme(Scheme, "key, sign-in cookie or demo", o => o.ForwardDefaultSelector = SelectScheme)
            .AddScheme<AuthenticationSchemeOptions, KeyAuthenticationHandler>(KeyAuthenticationHandler.SchemeName, null)
            .AddScheme<AuthenticationSchemeOptions, DemoAuthenticationHandler>(DemoAuthenticationHandler.SchemeName, null)
            .AddIdentityCookies(c => c.ApplicationCookie?.Configure(o =>
            {
                o.Cookie.Name = SessionCookie;
                o.Cookie.HttpOnly = true;
                o.Cookie.SameSite = SameSiteMode.Strict;
                o.Cookie.SecurePolicy = CookieSecurePolicy.SameAsRequest; // Secure whenever served over HTTPS
                o.ExpireTimeSpan = TimeSpan.FromHours(12);
                o.SlidingExpiration = true;
                // An API answers 401/403; the pages send people to the sign-in page themselves.
                o.Events.OnRedirectToLogin = c => Problem(c.HttpContext, StatusCodes.Status401Unauthorized);
                o.Events.OnRedirectToAccessDenied = c => Problem(c.HttpContext, StatusCodes.Status403Forbidden);
            }));

        services.AddAuthorizationBuilder()
            .SetFallbackPolicy(ReadPolicy())
            .AddPolicy(Permissions.Read, ReadPolicy())
            .AddPolicy(Permissions.Floor, p => p.RequireAuthenticatedUser().RequireRole([.. Roles.Ladder, Roles.Display]))
            .AddPolicy(Permissions.Ingest, p => p.RequireAuthenticatedUser().RequireRole(Roles.Technician, Roles.IngestKey))
            .AddPolicy(Permissions.Acknowledge, p => p.RequireAuthenticatedUser().RequireRole(Roles.Technician))
            .AddPolicy(Permissions.Disposition, p => p.RequireAuthenticatedUser().RequireRole(Roles.Supervisor))
            .AddPolicy(Permissions.Engineer, p => p.RequireAuthenticatedUser().RequireRole(Roles.Engineer))
            .AddPolicy(Permissions.Administer, p => p.RequireAuthenticatedUser().RequireRole(Roles.Administrator));

        services.AddAntiforgery(o =>
        {
            o.HeaderName = AntiforgeryHeader;
            o.Cookie.Name = "finwatch-antiforgery";
            o.Cookie.SameSite = SameSiteMode.Strict;
            o.Cookie.SecurePolicy = CookieSecurePolicy.SameAsRequest;
        });

        services.AddRateLimiter(o =>
        {
            o.RejectionStatusCode = StatusCodes.Status429TooManyRequests;
            o.OnRejected = (c, _) =>
            {
                c.HttpContext.Response.Headers.RetryAfter = "60";
                return new ValueTask(Problem(c.HttpContext, StatusCodes.Status429TooManyRequests));
            };
            o.AddPolicy(SignInLimiter, http => RateLimitPartition.GetFixedWindowLimiter(http.Connection.RemoteIpAddress?.ToString() ?? "unknown",
                _ => new FixedWindowRateLimiterOptions { PermitLimit = http.RequestServices.GetRequiredService<IOptions<AccessOptions>>().Value.SignInPerMinute, Window = TimeSpan.FromMinutes(1) }));
            o.AddPolicy(IngestLimiter, http => RateLimitPartition.GetFixedWindowLimiter(http.User.Who(),
                _ => new FixedWindowRateLimiterOptions { PermitLimit = http.RequestServices.GetRequiredService<IOptions<AccessOptions>>().Value.IngestPerMinute, Window = TimeSpan.FromMinutes(1) }));
        });
        return builder;
    }

    private static AuthorizationPolicy ReadPolicy() =>
        new AuthorizationPolicyBuilder().RequireAuthenticatedUser().RequireRole(Roles.Ladder).Build();

    // A tool's header first, then a person's session, then a wall screen's display cookie, then (demo only) the demo engineer.
    private static string SelectScheme(HttpContext http)
    {
        var request = http.Request;
        if (KeyAuthenticationHandler.PresentsHeader(request))
        {
            return KeyAuthenticationHandler.SchemeName;
        }

        if (request.Cookies.ContainsKey(SessionCookie))
        {
            return IdentityConstants.ApplicationScheme;
        }

        if (request.Cookies.ContainsKey(KeyAuthenticationHandler.DisplayCookie))
        {
            return KeyAuthenticationHandler.SchemeName;
        }

        return http.RequestServices.GetRequiredService<IOptions<DemoOptions>>().Value.Enabled ? DemoAuthenticationHandler.SchemeName : IdentityConstants.ApplicationScheme;
    }

    /// <summary>Security headers and body limits on every answer, pages included (so it runs before the static files).</summary>
    public static WebApplication UseSecurityHeaders(this WebApplication app)
    {
        app.Use(async (http, next) =>
        {
            var h = http.Response.Headers;
            // No inline script or style anywhere in the pages; data: only for images Chart.js may draw.
            h.ContentSecurityPolicy = "default-src 'self'; script-src 'self'; style-src 'self'; img-src 'self' data:; connect-src 'self'; " +
                "font-src 'self'; object-src 'none'; base-uri 'none'; form-action 'self'; frame-ancestors 'none'";
            h.XContentTypeOptions = "nosniff";
            h.XFrameOptions = "DENY";
            h["Referrer-Policy"] = "no-referrer";
            h["Permissions-Policy"] = "camera=(), microphone=(), geolocation=()";
            h["Cross-Origin-Opener-Policy"] = "same-origin";
            var path = http.Request.Path;
            if (!path.StartsWithSegments("/api/measurements") && !path.StartsWithSegments("/api/model/calibrations")
                && http.Features.Get<IHttpMaxRequestBodySizeFeature>() is { IsReadOnly: false } size)
            {
                size.MaxRequestBodySize = http.RequestServices.GetRequiredService<IOptions<AccessOptions>>().Value.MaxJsonBodyBytes;
            }

            await next();
        });
        return app;
    }

    /// <summary>Authentication, antiforgery for browser writes, authorization, rate limits (after routing).</summary>
    public static WebApplication UseAccess(this WebApplication app)
    {
        app.UseAuthentication();
        app.Use(async (http, next) =>
        {
            // Writes from a browser (sign-in cookie, demo) carry the antiforgery token in a header; keys do not need it.
            if (!HttpMethods.IsGet(http.Request.Method) && !HttpMethods.IsHead(http.Request.Method) && !HttpMethods.IsOptions(http.Request.Method)
                && (http.User.Via() is "cookie" or "demo" || http.Request.Path.StartsWithSegments("/api/auth/sign-in"))
                && !http.Request.Path.StartsWithSegments("/hubs")
                && !await http.RequestServices.GetRequiredService<IAntiforgery>().IsRequestValidAsync(http))
            {
                await Problem(http, StatusCodes.Status400BadRequest, "/problems/antiforgery",
                    $"The request has no valid antiforgery token (header {AntiforgeryHeader}); reload the page and try again.");
                return;
            }

            await next();
        });
        app.UseAuthorization();
        app.UseRateLimiter();
        return app;
    }

    internal static Task Problem(HttpContext http, int status, string? type = null, string? detail = null)
    {
        http.Response.StatusCode = status;
        return http.Response.WriteAsJsonAsync(new ProblemDetails
        {
            Type = type ?? $"/problems/{status}",
            Status = status,
            Title = status switch
            {
                401 => "Sign in first.",
                403 => "Not allowed for your role.",
                429 => "Too many requests; wait a minute.",
                _ => "The request was refused.",
            },
            Detail = detail ?? status switch
            {
                401 => "This needs a signed-in person, a tool key (header X-Api-Key) or a display token.",
                403 => $"{http.User.Who()} may not do this; see README, Access, for who may do what.",
                _ => null,
            },
        }, (System.Text.Json.JsonSerializerOptions?)null, "application/problem+json");
    }
}

/// <summary>Adds the ladder's role claims and how the person signed in to the cookie's principal.</summary>
public sealed class RoleClaimsFactory(UserManager<FinWatchUser> users, IOptions<IdentityOptions> options)
    : UserClaimsPrincipalFactory<FinWatchUser>(users, options)
{
    protected override async Task<ClaimsIdentity> GenerateClaimsAsync(FinWatchUser user)
    {
        var identity = await base.GenerateClaimsAsync(user);
        if (user.DisabledAtMs is null)
        {
            identity.AddClaims(Roles.Including(user.Role).Select(r => new Claim(ClaimTypes.Role, r)));
        }

        identity.AddClaim(new Claim(Roles.ViaClaim, "cookie"));
        return identity;
    }
}
