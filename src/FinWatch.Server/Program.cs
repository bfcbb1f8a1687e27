using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Audit;
using FinWatch.Server.Features.Model.Calibrations;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.About;
using FinWatch.Server.Features.Demo;
using FinWatch.Server.Features.Lots;
using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Features.Model;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Features.Products;
using FinWatch.Server.Features.Reports;
using FinWatch.Server.Features.Series;
using FinWatch.Server.Features.Spc;
using FinWatch.Server.Infrastructure;

// A command of the executable (`backup <file>`, `help`) runs instead of the web server.
if (await ServerCommands.TryRunAsync(args) is { } exitCode)
{
    return exitCode;
}

var builder = WebApplication.CreateBuilder(args);
builder.UseDefaultListenAddress();
builder.AddFinWatchApiDefaults();
builder.AddFinWatchTelemetry();
builder.AddFinWatchData();
builder.AddDemo(args);
builder.AddAccess();
builder.Services.AddMeasurements();
builder.Services.AddModel();
builder.Services.AddCalibrations();
builder.Services.AddMonitor(builder.Configuration);
builder.Services.AddReports();

var app = builder.Build();
await app.MigrateFinWatchDatabaseAsync();
// The access commands (`admin add`, `keys add`) need the app's services and the migrated database.
if (await AccessCommands.TryRunAsync(app, args) is { } accessExit)
{
    return accessExit;
}

await AccessCommands.BootstrapAdministratorAsync(app);
app.UseFinWatchApiDefaults();
app.UseSecurityHeaders();
app.UseFinWatchPages();
app.UseAccess();
app.MapAbout();
app.MapAuth();
app.MapPeople();
app.MapAudit();
app.MapParameters();
app.MapProducts();
app.MapMeasurements();
app.MapLots();
app.MapSeries();
app.MapStoredSeriesAnalysis();
app.MapForecast();
app.MapThreeWay();
app.MapSpc();
app.MapModel();
app.MapPredict();
app.MapCalibrations();
app.MapMonitor();
app.MapReports();
await app.RunAsync();
return 0;

/// <summary>Entry point; public so the integration tests' WebApplicationFactory can boot the real app.</summary>
public partial class Program;
