namespace FinWatch.Server.Features.Demo;

public static class DemoExtensions
{
    /// <summary>Registers the demo loader; <c>--demo</c> on the command line switches it on.</summary>
    public static WebApplicationBuilder AddDemo(this WebApplicationBuilder builder, string[] args)
    {
        if (args.Contains("--demo", StringComparer.Ordinal))
        {
            builder.Configuration[DemoOptions.Section + ":Enabled"] = "true";
        }

        builder.Services.AddOptions<DemoOptions>().BindConfiguration(DemoOptions.Section);
        builder.Services.AddSingleton<DemoLoader>();
        builder.Services.AddHostedService(sp => sp.GetRequiredService<DemoLoader>());
        return builder;
    }
}
