using FinWatch.Server.Infrastructure;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Features.Audit;
using Microsoft.AspNetCore.Http.HttpResults;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Access;

/// <summary>A person to add or change; <c>email</c> is where e-mail notifications go (an empty string removes it).</summary>
public sealed record PersonRequest(string? Name, string? Role, string? Password, bool? Disabled, string? Email = null);

public sealed record PasswordRequest(string? Password);

public sealed record PersonResponse(string Name, string Role, DateTimeOffset CreatedAt, DateTimeOffset? DisabledAt, DateTimeOffset? LockedUntil, string? Email);

public sealed record KeyRequest(string? Name, string? Scope);

public sealed record KeyResponse(int Id, string Name, string Scope, string Prefix, string CreatedBy, DateTimeOffset CreatedAt,
    string? RevokedBy, DateTimeOffset? RevokedAt, DateTimeOffset? LastUsedAt);

/// <summary>The key itself appears here once, when it is created; FinWatch keeps only its hash.</summary>
public sealed record CreatedKeyResponse(string Key, KeyResponse Details, string Use);

/// <summary>People and keys: administrators only. People are disabled, never deleted (the audit trail names them).</summary>
public static class PeopleEndpoints
{
    public static void Map(IEndpointRouteBuilder app)
    {
        var people = app.MapGroup("/api/people").WithTags("Access").RequireAuthorization(Permissions.Administer);
        people.MapGet("/", ListAsync).WithSummary("People who can sign in, with role and lock state");
        people.MapPost("/", CreateAsync).WithSummary("Add a person with a role and a first password");
        people.MapPut("/{name}", UpdateAsync).WithSummary("Change a person's role or disable/enable the account");
        people.MapPost("/{name}/password", SetPasswordAsync).WithSummary("Set a new password (and unlock)");
        var keys = app.MapGroup("/api/keys").WithTags("Access").RequireAuthorization(Permissions.Administer);
        keys.MapGet("/", KeysAsync).WithSummary("Tool keys and display tokens (never the keys themselves)");
        keys.MapPost("/", CreateKeyAsync).WithSummary("Create a tool key (scope ingest) or display token (scope display); shown once");
        keys.MapPost("/{id:int}/revoke", RevokeAsync).WithSummary("Revoke a key or display token");
    }

    internal static PersonResponse Describe(FinWatchUser u, TimeProvider clock) => new(u.UserName!, u.Role, DateTimeOffset.FromUnixTimeMilliseconds(u.CreatedAtMs),
        u.DisabledAtMs is { } d ? DateTimeOffset.FromUnixTimeMilliseconds(d) : null, u.LockoutEnd > clock.GetUtcNow() ? u.LockoutEnd : null, u.Email);

    internal static KeyResponse Describe(ApiKey k) => new(k.Id, k.Name, k.Scope, k.Prefix, k.CreatedBy, DateTimeOffset.FromUnixTimeMilliseconds(k.CreatedAtMs),
        k.RevokedBy, k.RevokedAtMs is { } r ? DateTimeOffset.FromUnixTimeMilliseconds(r) : null, k.LastUsedAtMs is { } l ? DateTimeOffset.FromUnixTimeMilliseconds(l) : null);

    /// <summary>Null when the address is absent, empty or a single e-mail address; otherwise what is wrong with it.</summary>
    private static string? EmailProblem(string? email) =>
        string.IsNullOrWhiteSpace(email) ? null
        : email.Trim().Length > 254 || !MimeKit.MailboxAddress.TryParse(email.Trim(), out var m) || m.Address != email.Trim() || !m.Address.Contains('@', StringComparison.Ordinal)
            ? $"email '{email}' is not an e-mail address (name@example.org)"
            : null;

    private static async Task<Ok<List<PersonResponse>>> ListAsync(UserManager<FinWatchUser> users, TimeProvider clock) =>
        TypedResults.Ok((await users.Users.OrderBy(u => u.UserName).ToListAsync()).Select(u => Describe(u, clock)).ToList());

    /// <summary>Creates a person (also used by the <c>admin add</c> command); the errors are keyed by field.</summary>
    public static async Task<(FinWatchUser? User, ValidationErrors Errors)> AddPersonAsync(
        UserManager<FinWatchUser> users, FinWatchDbContext db, string? name, string? role, string? password, string by, TimeProvider clock, string? email = null)
    {
        var errors = new ValidationErrors();
        if (EmailProblem(email) is { } bad)
        {
            errors["email"] = bad;
        }

        if (string.IsNullOrWhiteSpace(name) || name.Trim().Length > 100)
        {
            errors["name"] = "name is 1 to 100 letters, digits, spaces, '.', '-' or '_'";
        }
        else if (await users.FindByNameAsync(name.Trim()) is not null)
        {
            errors["name"] = $"'{name.Trim()}' exists already";
        }

        if (role is null || !Roles.IsPersonRole(role))
        {
            errors["role"] = $"role is one of {string.Join(", ", Roles.Ladder)}";
        }

        if (errors.Count > 0)
        {
            return (null, errors);
        }

        var user = new FinWatchUser
        {
            UserName = name!.Trim(), Role = role!, CreatedAtMs = clock.GetUtcNow().ToUnixTimeMilliseconds(), Email = string.IsNullOrWhiteSpace(email) ? null : email.Trim(),
        };
        var created = await users.CreateAsync(user, password ?? "");
        if (!created.Succeeded)
        {
            errors.Set(created.Errors.Any(e => e.Code.StartsWith("Password", StringComparison.Ordinal)) ? "password" : "name", created.Errors.Select(e => e.Description));
            return (null, errors);
        }

        AuditLog.Add(db, by, "person", user.UserName, "created", null, Describe(user, clock), clock);
        await db.SaveChangesAsync();
        return (user, errors);
    }

    private static async Task<Results<Created<PersonResponse>, ValidationProblem>> CreateAsync(
        PersonRequest r, UserManager<FinWatchUser> users, FinWatchDbContext db, TimeProvider clock, HttpContext http)
    {
        var (user, errors) = await AddPersonAsync(users, db, r.Name, r.Role, r.Password, http.User.Who(), clock, r.Email);
        return user is null ? Problems.Invalid(errors) : TypedResults.Created($"/api/people/{Uri.EscapeDataString(user.UserName!)}", Describe(user, clock));
    }

    private static async Task<Results<Ok<PersonResponse>, ValidationProblem, ProblemHttpResult>> UpdateAsync(
        string name, PersonRequest r, UserManager<FinWatchUser> users, FinWatchDbContext db, TimeProvider clock, HttpContext http)
    {
        var user = await users.FindByNameAsync(name);
        if (user is null)
        {
            return NotFound(name);
        }

        if (r.Role is not null && !Roles.IsPersonRole(r.Role))
        {
            return Problems.Invalid("role", $"role is one of {string.Join(", ", Roles.Ladder)}");
        }

        if (EmailProblem(r.Email) is { } bad)
        {
            return Problems.Invalid("email", bad);
        }

        if (user.UserName == http.User.Who() && (r.Disabled == true || (r.Role is not null && r.Role != Roles.Administrator)))
        {
            return Problems.Invalid("name", "you cannot disable yourself or take away your own administration");
        }

        var before = Describe(user, clock);
        user.Role = r.Role ?? user.Role;
        if (r.Email is not null)
        {
            user.Email = r.Email.Trim().Length == 0 ? null : r.Email.Trim();
        }
        if (r.Disabled is { } disabled)
        {
            user.DisabledAtMs = disabled ? user.DisabledAtMs ?? clock.GetUtcNow().ToUnixTimeMilliseconds() : null;
        }

        await users.UpdateAsync(user);
        await users.UpdateSecurityStampAsync(user); // signed-in sessions pick up the change within a minute
        AuditLog.Add(db, http.User.Who(), "person", user.UserName!, "changed", before, Describe(user, clock), clock);
        await db.SaveChangesAsync();
        return TypedResults.Ok(Describe(user, clock));
    }

    private static async Task<Results<Ok<PersonResponse>, ValidationProblem, ProblemHttpResult>> SetPasswordAsync(
        string name, PasswordRequest r, UserManager<FinWatchUser> users, FinWatchDbContext db, TimeProvider clock, HttpContext http)
    {
        var user = await users.FindByNameAsync(name);
        if (user is null)
        {
            return NotFound(name);
        }

        var token = await users.GeneratePasswordResetTokenAsync(user);
        var reset = await users.ResetPasswordAsync(user, token, r.Password ?? "");
        if (!reset.Succeeded)
        {
            var errors = new ValidationErrors();
            errors.Set("password", reset.Errors.Select(e => e.Description));
            return Problems.Invalid(errors);
        }

        await users.SetLockoutEndDateAsync(user, null);
        await users.ResetAccessFailedCountAsync(user);
        AuditLog.Add(db, http.User.Who(), "person", user.UserName!, "password-set", null, null, clock); // never the password
        await db.SaveChangesAsync();
        return TypedResults.Ok(Describe(user, clock));
    }

    private static async Task<Ok<List<KeyResponse>>> KeysAsync(FinWatchDbContext db) =>
        TypedResults.Ok((await db.ApiKeys.AsNoTracking().OrderBy(k => k.Id).ToListAsync()).Select(Describe).ToList());

    /// <summary>Creates a key (also used by the <c>keys add</c> command).</summary>
    public static async Task<(CreatedKeyResponse? Created, ValidationErrors Errors)> AddKeyAsync(
        FinWatchDbContext db, string? name, string? scope, string by, TimeProvider clock)
    {
        var errors = new ValidationErrors();
        if (string.IsNullOrWhiteSpace(name) || name.Length > 100)
        {
            errors["name"] = "name says which tool, script or screen holds the key (1 to 100 characters)";
        }

        if (scope is null || !ApiKeys.Scopes.Contains(scope))
        {
            errors["scope"] = $"scope is {string.Join(" or ", ApiKeys.Scopes)}";
        }

        if (errors.Count > 0)
        {
            return (null, errors);
        }

        var (row, key) = ApiKeys.Create(name!.Trim(), scope!, by, clock.GetUtcNow().ToUnixTimeMilliseconds());
        db.ApiKeys.Add(row);
        await db.SaveChangesAsync();
        AuditLog.Add(db, by, "key", $"{row.Id} {row.Name}", "created", null, Describe(row), clock);
        await db.SaveChangesAsync();
        var use = scope == ApiKeys.IngestScope
            ? $"send it as the header {KeyAuthenticationHandler.Header} with POST /api/measurements or /api/measurements/csv"
            : $"open /display/{key} on the wall screen once; it stays signed in as a display until the token is revoked";
        return (new CreatedKeyResponse(key, Describe(row), use), errors);
    }

    private static async Task<Results<Created<CreatedKeyResponse>, ValidationProblem>> CreateKeyAsync(KeyRequest r, FinWatchDbContext db, TimeProvider clock, HttpContext http)
    {
        var (created, errors) = await AddKeyAsync(db, r.Name, r.Scope, http.User.Who(), clock);
        return created is null ? Problems.Invalid(errors) : TypedResults.Created($"/api/keys/{created.Details.Id}", created);
    }

    private static async Task<Results<Ok<KeyResponse>, ProblemHttpResult>> RevokeAsync(int id, FinWatchDbContext db, TimeProvider clock, HttpContext http)
    {
        var key = await db.ApiKeys.SingleOrDefaultAsync(k => k.Id == id);
        if (key is null)
        {
            return NotFound($"key {id}");
        }

        var before = Describe(key);
        if (key.RevokedAtMs is null)
        {
            key.RevokedAtMs = clock.GetUtcNow().ToUnixTimeMilliseconds();
            key.RevokedBy = http.User.Who();
            AuditLog.Add(db, http.User.Who(), "key", $"{key.Id} {key.Name}", "revoked", before, Describe(key), clock);
            await db.SaveChangesAsync();
        }

        return TypedResults.Ok(Describe(key));
    }

    private static ProblemHttpResult NotFound(string what) => Problems.NotFound("Not found.", $"There is no person or key '{what}'.");
}
