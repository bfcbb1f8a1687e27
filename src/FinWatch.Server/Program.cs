using FinWatch.Server.Features;
using FinWatch.Server.Infrastructure;

// A command of the executable (`backup <file>`, `help`) runs instead of the web server.
if (await ServerCommands.TryRunAsync(args) is { } exitCode) return exitCode;

// Value-less switches (`--demo`) are read by their features, not the configuration reader (it would eat the next).
var builder = WebApplication.CreateBuilder([.. args.Where(a => a != "--demo")]);
builder.AddFinWatchHost();
var features = new FeatureList(builder, args)
    .Add<AccessFeature>()
    .Add<AuditFeature>()
    .Add<AboutFeature>()
    .Add<DemoFeature>()
    .Add<ParametersFeature>()
    .Add<ProductsFeature>()
    .Add<MeasurementsFeature>()
    .Add<LotsFeature>()
    .Add<SeriesFeature>()
    .Add<SpcFeature>()
    .Add<ModelFeature>()
    .Add<CalibrationsFeature>()
    .Add<MonitorFeature>()
    .Add<NotifyFeature>()
    .Add<MaintenanceFeature>()
    .Add<ReportsFeature>();
var app = builder.Build();
// The database is migrated first; a feature's command (`admin add`, `keys add`) may then run instead of the server.
if (await features.StartAsync(app) is { } commandExit)
{
    return commandExit;
}

features.Use(app);
await app.RunAsync();
return 0;

/// <summary>Entry point; public so the integration tests' WebApplicationFactory can boot the real app.</summary>
public partial class Program;
