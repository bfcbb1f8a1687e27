using System.Globalization;
using System.IO.Pipelines;
using System.Text;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.SeedDemo;
using FinWatch.Server.Features.Products;
using FinWatch.Server.Features.Maintenance;
using FinWatch.Server.Features.Measurements;
using FinWatch.Server.Features.Model.Calibrations;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Reports;
using Microsoft.AspNetCore.Identity;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Demo;

/// <summary>
/// Loads the invented demo fab into an empty database: creates its products, then streams the generated CSV through
/// the normal ingest (validation, derivation, one transaction), exactly as a metrology tool's file would arrive.
/// </summary>
public sealed partial class DemoLoader(IServiceScopeFactory scopes, IOptions<DemoOptions> options, IOptions<ShiftOptions> shifts, TimeProvider clock,
    ILogger<DemoLoader> logger)
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
        await StoreSitePlansAsync(db, stoppingToken);
        await StoreCrewAsync(db, scope.ServiceProvider.GetRequiredService<UserManager<FinWatchUser>>(), stoppingToken);

        var ingest = scope.ServiceProvider.GetRequiredService<IngestMeasurements>();
        var seed = options.Value.Seed;
        var scale = new DemoScale(options.Value.Days, options.Value.LotsPerDay);

        // The invented history is moved so that it ends at the moment the demo starts (whole minutes): this shift and
        // the last one have data. The first weeks are the baseline the demo's limits are computed from; the rest
        // arrives after the limits are approved.
        var shift = TimeSpan.FromMinutes(Math.Floor((clock.GetUtcNow().UtcDateTime - DemoFab.EndUtc).TotalMinutes));
        await RecordMaintenanceAsync(db, shift, stoppingToken);
        var start = DemoFab.StartUtc(scale);
        var cut = start + TimeSpan.FromDays(Math.Min(20, Math.Max(1, options.Value.Days / 3)));
        var baseline = await IngestPartAsync(ingest, seed, scale, null, cut, shift, "baseline", stoppingToken);
        if (baseline is null)
        {
            return;
        }

        await DemoMonitor.SetUpAsync(db, scope.ServiceProvider.GetRequiredService<MonitorEvaluator>(), cut + shift, now, stoppingToken);
        var rest = await IngestDaysAsync(db, ingest, seed, scale, cut, shift, stoppingToken);
        if (rest is null)
        {
            return;
        }

        LogLoaded(baseline.Inserted + (int)rest.Value.Inserted, (baseline.DurationMs + rest.Value.DurationMs) / 1000);
        await CalibrateAsync(scope.ServiceProvider.GetRequiredService<CalibrateModel>(), seed, scale, shift, stoppingToken);
        State = "loaded";
    }

    private async Task<IngestAccepted?> IngestPartAsync(IngestMeasurements ingest, int seed, DemoScale scale, DateTime? from, DateTime? to, TimeSpan shift,
        string part, CancellationToken stoppingToken)
    {
        var pipe = new Pipe();
        var writer = Task.Run(async () =>
        {
            await using var stream = pipe.Writer.AsStream();
            await using var text = new StreamWriter(stream, new UTF8Encoding(false), 64 * 1024);
            DemoFab.WriteMeasurementsCsv(text, seed, scale, from, to, shift);
        }, stoppingToken);
        await using var reader = pipe.Reader.AsStream();
        var outcome = await ingest.RunAsync(CsvRowSource.ReadAsync(reader, stoppingToken), "demo", $"invented demo fab, seed {seed}, {part}", stoppingToken);
        await pipe.Reader.CompleteAsync();
        await writer;
        if (outcome.Accepted is { } a)
        {
            return a;
        }

        State = "failed";
        LogFailed(outcome.Rejected!.ErrorCount, string.Join("; ", outcome.Rejected.Errors.Take(3).Select(e => $"row {e.Row} {e.Column}: {e.Reason}")));
        return null;
    }

    // The rest of the history a day at a time, as the lots arrived, each day through the normal ingest and followed by
    // the invented floor's handling of its excursions (DemoMonitor.HandleExcursionsAsync). The generator runs once.
    private async Task<(long Inserted, double DurationMs)?> IngestDaysAsync(FinWatchDbContext db, IngestMeasurements ingest, int seed, DemoScale scale,
        DateTime cut, TimeSpan shift, CancellationToken stoppingToken)
    {
        long inserted = 0;
        double durationMs = 0;
        var day = new List<DemoSiteRow>();
        foreach (var row in DemoFab.GenerateRows(seed, scale).Where(r => r.MeasuredAtUtc >= cut).Select(r => (DemoSiteRow?)r).Append(null))
        {
            if (day.Count > 0 && (row is not { } next || next.MeasuredAtUtc.Date != day[0].MeasuredAtUtc.Date))
            {
                using var buffer = new MemoryStream();
                await using (var text = new StreamWriter(buffer, new UTF8Encoding(false), 64 * 1024, leaveOpen: true))
                {
                    DemoFab.WriteCsv(text, day, shift);
                }

                buffer.Position = 0;
                var outcome = await ingest.RunAsync(CsvRowSource.ReadAsync(buffer, stoppingToken), "demo",
                    $"invented demo fab, seed {seed}, {day[0].MeasuredAtUtc:yyyy-MM-dd}", stoppingToken);
                if (outcome.Accepted is not { } a)
                {
                    State = "failed";
                    LogFailed(outcome.Rejected!.ErrorCount, string.Join("; ", outcome.Rejected.Errors.Take(3).Select(e => $"row {e.Row} {e.Column}: {e.Reason}")));
                    return null;
                }

                inserted += a.Inserted;
                durationMs += a.DurationMs;
                var dayEnd = new DateTimeOffset(Min(day[0].MeasuredAtUtc.Date.AddDays(1), DemoFab.EndUtc) + shift, TimeSpan.Zero);
                await DemoMonitor.HandleExcursionsAsync(db, dayEnd.ToUnixTimeMilliseconds(), stoppingToken);
                day.Clear();
            }

            if (row is { } r)
            {
                day.Add(r);
            }
        }

        return (inserted, durationMs);
    }

    /// <summary>Who records the invented chamber log (the audit trail names it).</summary>
    public const string Recorder = "demo loader";

    // The invented chamber log: each planted maintenance as its crew recorded it when the chamber went back to
    // production, moved with the rest of the history; through the maintenance log's own checks, records and audit.
    private async Task RecordMaintenanceAsync(FinWatchDbContext db, TimeSpan shift, CancellationToken cancellationToken)
    {
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var events = DemoFab.Events.Where(e => e.LoggedAs is not null)
            .Select(e => new CheckedMaintenance(e.Chamber, e.LoggedAs!.Value, new DateTimeOffset(e.BackInProductionUtc + shift, TimeSpan.Zero).ToUnixTimeMilliseconds(),
                e.Crew, e.LoggedAs switch
                {
                    MaintenanceKind.WetClean => "wet clean at the RF-hour interval; seasoned and released to production (invented)",
                    MaintenanceKind.PartReplacement => "edge ring replaced at its RF-hour limit; seasoned and released to production (invented)",
                    _ => "scheduled preventive maintenance; released to production (invented)",
                }))
            .Where(e => e.OccurredAtMs <= now).ToList();
        await MaintenanceLog.RecordAsync(db, events, Recorder, "invented demo fab", clock, cancellationToken);
    }

    private static DateTime Min(DateTime a, DateTime b) => a < b ? a : b;

    // The invented electrical tests go through the normal calibration, one product at a time, as an engineer's upload would.
    private async Task CalibrateAsync(CalibrateModel calibrate, int seed, DemoScale scale, TimeSpan shift, CancellationToken cancellationToken)
    {
        foreach (var p in DemoFab.Products)
        {
            if (!DemoFab.GenerateElectricalTests(seed, scale).Any(t => t.Product == p.Code))
            {
                LogNoElectricalTests(p.Code);
                continue;
            }

            using var buffer = new MemoryStream();
            await using (var text = new StreamWriter(buffer, new UTF8Encoding(false), 64 * 1024, leaveOpen: true))
            {
                DemoFab.WriteElectricalTestsCsv(text, p.Code, seed, scale, shift);
            }

            buffer.Position = 0;
            var outcome = await calibrate.RunAsync(buffer, new CalibrateModel.Request(
                "demo: invented electrical tests of the invented demo fab", "demo loader", $"demo-electrical-{p.Code}.csv", false,
                CalibrateModel.DefaultMeasurementSdMv), cancellationToken);
            if (outcome.Result is { } r)
            {
                LogCalibrated(p.Code, r.Observations, r.RmsResidualBeforeMv, r.RmsResidualAfterMv);
            }
            else
            {
                LogCalibrationFailed(p.Code, string.Join("; ", outcome.Rejected!.Errors.Take(3).Select(e => $"row {e.Row} {e.Column}: {e.Reason}")));
            }
        }
    }

    /// <summary>
    /// The invented crews: who works which shift (role names, not people's names), in the roster from a month ago; the
    /// area engineer works days off the roster (an escalation level an administrator can name).
    /// </summary>
    public static readonly (string Name, string Role, string? Shift)[] Crew =
    [
        ("early-supervisor", Roles.Supervisor, "early"), ("early-technician", Roles.Technician, "early"),
        ("late-supervisor", Roles.Supervisor, "late"), ("night-supervisor", Roles.Supervisor, "night"),
        ("etch-area-engineer", Roles.Engineer, null),
    ];

    // The crew as people (random passwords: an administrator sets one to sign in as them), the roster of the
    // configured pattern's shifts, and a browser rule of the demo engineer for high alerts; each audited as the API does.
    private async Task StoreCrewAsync(FinWatchDbContext db, UserManager<FinWatchUser> users, CancellationToken cancellationToken)
    {
        var pattern = shifts.Value.EffectivePattern.Select(s => s.Name).ToList();
        var from = DateOnly.FromDateTime(clock.GetUtcNow().UtcDateTime.AddDays(-30)).ToString(Features.Notify.Roster.DateFormat, CultureInfo.InvariantCulture);
        foreach (var (name, role, shift) in Crew)
        {
            var (user, errors) = await PeopleEndpoints.AddPersonAsync(users, db, name, role, $"{Guid.NewGuid():N}-Aa1!", Recorder, clock, $"{name}@fab.example");
            if (user is null)
            {
                LogCrewSkipped(name, string.Join("; ", errors.ToDictionary().Values.SelectMany(m => m)));
                continue;
            }

            if (shift is not null)
            {
                // A configured pattern may name its shifts otherwise: the crew then takes them in order.
                var on = pattern.Contains(shift) ? shift : pattern[Array.IndexOf(Crew, (name, role, shift)) % pattern.Count];
                db.Roster.Add(new RosterEntry { Shift = on, Person = name, FromDate = from });
            }
        }

        db.NotificationRules.Add(new NotificationRule
        {
            Owner = DemoMonitor.DemoEngineer, Channel = Features.Notify.NotificationChannels.Browser, MinSeverity = "high", MinSeverityRank = 3,
            CreatedAtMs = clock.GetUtcNow().ToUnixTimeMilliseconds(), CreatedBy = Recorder,
        });
        await db.SaveChangesAsync(cancellationToken);
    }

    /// <summary>The site plans the invented metrology measures by, so the data-entry page fills its grid from them.</summary>
    private async Task StoreSitePlansAsync(FinWatchDbContext db, CancellationToken cancellationToken)
    {
        var products = await db.Products.ToDictionaryAsync(p => p.Code, StringComparer.Ordinal, cancellationToken);
        foreach (var plan in DemoFab.SitePlans)
        {
            await SitePlanEndpoints.StageAsync(db, products[plan.Product], plan.Step,
                [.. plan.Sites.Select(s => new SitePlanSiteDto(s.SiteId, s.XMm, s.YMm))], Recorder, clock, cancellationToken);
        }

        await db.SaveChangesAsync(cancellationToken);
    }

    private static Product ToProduct(DemoProduct p, long now) => new()
    {
        Code = p.Code,
        Name = p.Name,
        Description = p.Description,
        GateFaces = p.GateFaces,
        NominalTopWidthNm = p.Nominal.TopWidthNm,
        NominalBottomWidthNm = p.Nominal.BottomWidthNm,
        NominalFinHeightNm = p.Nominal.FinHeightNm,
        NominalCornerRadiusNm = p.Nominal.CornerRadiusNm,
        NominalLinerThicknessNm = p.Nominal.LinerThicknessNm,
        CreatedAtMs = now,
        UpdatedAtMs = now,
        Specs = p.Specs.Select(s => new SpecLimit { Parameter = s.Parameter, Lower = s.Lower, Target = s.Target, Upper = s.Upper }).ToList(),
    };

    [LoggerMessage(Level = LogLevel.Warning, Message = "Demo: the invented crew member {Name} was not added: {Errors}")]
    private partial void LogCrewSkipped(string name, string errors);

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: the database already holds products; the invented demo fab is not loaded again")]
    private partial void LogSkipped();

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: loading the invented demo fab (about 650,000 site rows; this takes a little while)")]
    private partial void LogLoading();


    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: loaded {Rows} site rows in {Seconds:0.0} s")]
    private partial void LogLoaded(int rows, double seconds);

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: calibrated {Product} on {Wafers} invented electrical tests, rms residual {Before:0.0} → {After:0.0} mV")]
    private partial void LogCalibrated(string product, int wafers, double before, double after);

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: no lot of {Product} has reached electrical test in this window (18 days after its profile); it stays on the physics defaults")]
    private partial void LogNoElectricalTests(string product);

    [LoggerMessage(Level = LogLevel.Error, Message = "Demo: the invented electrical tests of {Product} were rejected: {First}")]
    private partial void LogCalibrationFailed(string product, string first);

    [LoggerMessage(Level = LogLevel.Error, Message = "Demo: the generated data were rejected ({Errors} errors): {First}")]
    private partial void LogFailed(int errors, string first);
}
