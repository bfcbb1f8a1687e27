using FinWatch.Server.Features.Model.Calibrations;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.About;
using FinWatch.Server.Features.Demo;
using FinWatch.Server.Features.Lots;
using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Features.Model;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Features.Products;
using FinWatch.Server.Features.Series;
using FinWatch.Server.Features.Spc;
using FinWatch.Server.Infrastructure;

// A command of the executable (`backup <file>`, `help`) runs instead of the web server.
if (await ServerCommands.TryRunAsync(args) is { } exitCode)
{
    Environment.ExitCode = exitCode;
    return;
}

var builder = WebApplication.CreateBuilder(args);
builder.AddFinWatchApiDefaults();
builder.AddFinWatchData();
builder.AddDemo(args);
builder.Services.AddMeasurements();
builder.Services.AddModel();
builder.Services.AddCalibrations();
builder.Services.AddMonitor();

var app = builder.Build();
await app.MigrateFinWatchDatabaseAsync();
app.UseFinWatchApiDefaults();
app.UseFinWatchPages();
app.MapAbout();
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
await app.RunAsync();

/// <summary>Entry point; public so the integration tests' WebApplicationFactory can boot the real app.</summary>
public partial class Program;
