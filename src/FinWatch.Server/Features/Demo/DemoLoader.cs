using System.IO.Pipelines;
using System.Text;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.SeedDemo;
using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Features.Products;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Demo;

/// <summary>
/// Loads the invented demo fab into an empty database: creates its products, then streams the generated CSV through
/// the normal ingest (validation, derivation, one transaction), exactly as a metrology tool's file would arrive.
/// </summary>
public sealed partial class DemoLoader(IServiceScopeFactory scopes, IOptions<DemoOptions> options, TimeProvider clock, ILogger<DemoLoader> logger)
    : BackgroundService
{
    /// <summary>"idle", "loading", "loaded", "skipped" (database not empty) or "failed".</summary>
    public string State { get; private set; } = "idle";

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (!options.Value.Enabled)
        {
            return;
        }

        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        if (await db.Products.AnyAsync(stoppingToken))
        {
            State = "skipped";
            LogSkipped();
            return;
        }

        State = "loading";
        LogLoading();
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        foreach (var p in DemoFab.Products)
        {
            db.Products.Add(ToProduct(p, now));
        }

        await db.SaveChangesAsync(stoppingToken);

        var ingest = scope.ServiceProvider.GetRequiredService<IngestMeasurements>();
        var pipe = new Pipe();
        var seed = options.Value.Seed;
        var scale = new DemoScale(options.Value.Days, options.Value.LotsPerDay);
        var writer = Task.Run(async () =>
        {
            await using var stream = pipe.Writer.AsStream();
            await using var text = new StreamWriter(stream, new UTF8Encoding(false), 64 * 1024);
            DemoFab.WriteMeasurementsCsv(text, seed, scale);
        }, stoppingToken);
        await using var reader = pipe.Reader.AsStream();
        var outcome = await ingest.RunAsync(CsvRowSource.ReadAsync(reader, stoppingToken), "demo", $"invented demo fab, seed {seed}", stoppingToken);
        await pipe.Reader.CompleteAsync();
        await writer;
        if (outcome.Accepted is { } a)
        {
            State = "loaded";
            LogLoaded(a.Inserted, a.DurationMs / 1000);
        }
        else
        {
            State = "failed";
            LogFailed(outcome.Rejected!.ErrorCount, string.Join("; ", outcome.Rejected.Errors.Take(3).Select(e => $"row {e.Row} {e.Column}: {e.Reason}")));
        }
    }

    private static Product ToProduct(DemoProduct p, long now) => new()
    {
        Code = p.Code,
        Name = p.Name,
        Description = p.Description,
        GateFaces = ProductRules.ParseFaces(p.GatedFaces) ?? GateFaces.TriGate,
        NominalTopWidthNm = p.Nominal.TopWidthNm,
        NominalBottomWidthNm = p.Nominal.BottomWidthNm,
        NominalFinHeightNm = p.Nominal.FinHeightNm,
        NominalCornerRadiusNm = p.Nominal.CornerRadiusNm,
        NominalLinerThicknessNm = p.Nominal.LinerThicknessNm,
        CreatedAtMs = now,
        UpdatedAtMs = now,
        Specs = p.Specs.Select(s => new SpecLimit { Parameter = s.Parameter, Lower = s.Lower, Target = s.Target, Upper = s.Upper }).ToList(),
    };

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: the database already holds products; the invented demo fab is not loaded again")]
    private partial void LogSkipped();

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: loading the invented demo fab (about 650,000 site rows; this takes a little while)")]
    private partial void LogLoading();

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: loaded {Rows} site rows in {Seconds:0.0} s")]
    private partial void LogLoaded(int rows, double seconds);

    [LoggerMessage(Level = LogLevel.Error, Message = "Demo: the generated data were rejected ({Errors} errors): {First}")]
    private partial void LogFailed(int errors, string first);
}
