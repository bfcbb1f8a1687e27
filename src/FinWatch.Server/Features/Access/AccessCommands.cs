using FinWatch.Server.Infrastructure;
using FinWatch.Data;
using FinWatch.Data.Entities;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Access;

/// <summary>
/// The command-line side of access, run against the configured database instead of starting the server:
/// <c>admin add NAME</c> (password from the environment variable FINWATCH_PASSWORD, else read from standard input) and
/// <c>keys add NAME --scope ingest|display</c> (prints the key on the last line). Also creates the bootstrap
/// administrator of <see cref="AccessOptions"/> at start-up when there is no administrator yet.
/// </summary>
public static class AccessCommands
{
    public const string Usage = """
        FinWatch.Server admin add NAME        add an administrator (password: $FINWATCH_PASSWORD, else one line on stdin)
        FinWatch.Server keys add NAME --scope ingest|display
                                              create a tool key or a display token; the key is printed once, last line
        """;

    /// <summary>Runs a command when the arguments name one; null when they do not (the server then starts).</summary>
    public static async Task<int?> TryRunAsync(WebApplication app, string[] args)
    {
        var words = args.TakeWhile(a => !a.StartsWith('-')).ToArray();
        if (words is not (["admin", "add", ..] or ["keys", "add", ..]))
        {
            return null;
        }

        await using var scope = app.Services.CreateAsyncScope();
        var services = scope.ServiceProvider;
        var clock = services.GetRequiredService<TimeProvider>();
        var db = services.GetRequiredService<FinWatchDbContext>();
        if (words.Length != 3)
        {
            await Console.Error.WriteLineAsync(Usage);
            return 2;
        }

        if (words[0] == "admin")
        {
            var password = Environment.GetEnvironmentVariable("FINWATCH_PASSWORD") ?? await Console.In.ReadLineAsync();
            var (user, errors) = await PeopleEndpoints.AddPersonAsync(services.GetRequiredService<UserManager<FinWatchUser>>(), db, words[2],
                Roles.Administrator, password, "command line", clock);
            return Report(errors, $"administrator '{user?.UserName}' added");
        }

        var scopeValue = args.SkipWhile(a => a != "--scope").Skip(1).FirstOrDefault();
        var (created, keyErrors) = await PeopleEndpoints.AddKeyAsync(db, words[2], scopeValue, "command line", clock);
        if (created is not null)
        {
            Console.WriteLine($"{created.Details.Scope} key '{created.Details.Name}' created; {created.Use}. It is shown only now:");
            Console.WriteLine(created.Key);
            return 0;
        }

        return Report(keyErrors, "");
    }

    private static int Report(ValidationErrors errors, string done)
    {
        if (errors.Count == 0)
        {
            Console.WriteLine(done);
            return 0;
        }

        foreach (var (field, messages) in errors.ToDictionary())
        {
            Console.Error.WriteLine($"{field}: {string.Join("; ", messages)}");
        }

        return 1;
    }

    /// <summary>Creates the configured bootstrap administrator when no administrator exists yet.</summary>
    public static async Task BootstrapAdministratorAsync(WebApplication app)
    {
        var options = app.Services.GetRequiredService<IOptions<AccessOptions>>().Value;
        if (string.IsNullOrWhiteSpace(options.BootstrapAdminName))
        {
            return;
        }

        await using var scope = app.Services.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        if (await db.Users.AnyAsync(u => u.Role == Roles.Administrator))
        {
            return;
        }

        var (_, errors) = await PeopleEndpoints.AddPersonAsync(scope.ServiceProvider.GetRequiredService<UserManager<FinWatchUser>>(), db,
            options.BootstrapAdminName, Roles.Administrator, options.BootstrapAdminPassword, "bootstrap (configuration)", scope.ServiceProvider.GetRequiredService<TimeProvider>());
        if (errors.Count > 0)
        {
            throw new InvalidOperationException("FinWatch:Auth:BootstrapAdminName/Password: " + string.Join("; ", errors.ToDictionary().SelectMany(e => e.Value)));
        }
    }
}
