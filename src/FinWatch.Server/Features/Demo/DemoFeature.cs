using FinWatch.Server.Features.Demo;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features;

/// <summary>The invented demo fab: <c>--demo</c> on the command line loads its history at start and keeps it live.</summary>
public sealed class DemoFeature : IFeature
{
    public static void Add(WebApplicationBuilder builder, string[] args)
    {
        if (args.Contains("--demo", StringComparer.Ordinal))
        {
            builder.Configuration[DemoOptions.Section + ":Enabled"] = "true";
        }

        builder.Services.AddOptions<DemoOptions>().BindConfiguration(DemoOptions.Section);
        builder.Services.AddSingleton<DemoLoader>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<DemoLoader>());
    }

    // The demo has no endpoints of its own: it feeds the others (and About says whether it runs).
    public static void Map(IEndpointRouteBuilder endpoints)
    {
    }
}
