using FinWatch.Server.Features.Demo;
using FinWatch.Server.Features.Monitor;
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

        // One person plays every role in the demo, so the four-eyes rule for limits is off unless set explicitly.
        var approver = $"{MonitorOptions.Section}:{nameof(MonitorOptions.ApproverMustDiffer)}";
        if (builder.Configuration.GetValue<bool>(DemoOptions.Section + ":Enabled") && builder.Configuration[approver] is null)
        {
            builder.Configuration[approver] = "false";
        }

        builder.Services.AddOptions<DemoOptions>().BindConfiguration(DemoOptions.Section);
        builder.Services.AddSingleton<DemoLoader>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<DemoLoader>());
        builder.Services.AddSingleton<DemoTool>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<DemoTool>());
    }

    // The demo has no endpoints of its own: it feeds the others (and About says whether it runs).
    public static void Map(IEndpointRouteBuilder endpoints)
    {
    }
}
