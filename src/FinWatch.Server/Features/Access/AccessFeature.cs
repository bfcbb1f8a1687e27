using FinWatch.Server.Features.Access;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>
/// Who may do what: people with roles, tool keys, display tokens; sign-in; security headers, antiforgery,
/// authorization and rate limits; the <c>admin add</c> and <c>keys add</c> commands and the bootstrap administrator.
/// </summary>
public sealed class AccessFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args) => builder.AddAccess();

    public static void UseBeforeRouting(WebApplication app) => app.UseSecurityHeaders();

    public static void UseAfterRouting(WebApplication app) => app.UseAccess();

    public static async Task<int?> StartAsync(WebApplication app, string[] args)
    {
        if (await AccessCommands.TryRunAsync(app, args) is { } exitCode)
        {
            return exitCode;
        }

        await AccessCommands.BootstrapAdministratorAsync(app);
        return null;
    }

    public static void Map(IEndpointRouteBuilder endpoints)
    {
        AuthEndpoints.Map(endpoints);
        PeopleEndpoints.Map(endpoints);
    }
}
