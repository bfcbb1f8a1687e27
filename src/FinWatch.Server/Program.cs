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

var builder = WebApplication.CreateBuilder(args);
builder.AddFinWatchApiDefaults();
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
if (await AccessCommands.TryRunAsync(app, args) is { } exitCode)
{
    return exitCode;
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
