using System.Globalization;
using System.Net.Http.Headers;
using System.Text;
using FinWatch.Data;
using FinWatch.SeedDemo;
using FinWatch.Server.Features.Access;
using FinWatch.Server.Features.Audit;
using Microsoft.AspNetCore.Hosting.Server;
using Microsoft.AspNetCore.Hosting.Server.Features;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Demo;

/// <summary>
/// In demo mode, a simulated profile tool (<see cref="DemoFab.LiveProfileToolId"/>) that keeps measuring the invented
/// fab after its history: every <see cref="DemoOptions.LiveLotSeconds"/> it sends one new lot to the server's own CSV
/// ingest over HTTP, signed in with a tool key of its own like any tool, so the lot is validated, stored, judged and
/// pushed exactly as a real tool's would be. The lot is the generator's next one at the history's time now (the history
/// ends when the demo was loaded, and its planted drifts go on).
/// </summary>
public sealed partial class DemoTool(
    IServiceScopeFactory scopes, DemoLoader loader, IOptions<DemoOptions> options, IServer server, IHostApplicationLifetime lifetime,
    TimeProvider clock, ILogger<DemoTool> logger) : BackgroundService
{
    /// <summary>The name of the simulated tool's key (on the people and keys page).</summary>
    public static string KeyName => $"profile tool {DemoFab.LiveProfileToolId} (simulated, demo)";

    /// <summary>Lots sent and accepted since the server started.</summary>
    public int LotsSent { get; private set; }

    /// <summary>The id of the last lot accepted, or null.</summary>
    public string? LastLot { get; private set; }

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        var o = options.Value;
        if (!o.Enabled || o.LiveLotSeconds <= 0)
        {
            return;
        }

        // After the history is in (or was there already), and once the server listens.
        while (loader.State is "idle" or "loading")
        {
            await Task.Delay(500, stoppingToken);
        }

        if (loader.State == "failed" || !await StartedAsync(stoppingToken))
        {
            return;
        }

        using var http = Client();
        if (http is null)
        {
            LogNoAddress();
            return;
        }

        var scale = new DemoScale(o.Days, o.LotsPerDay);
        var (shift, next) = await ResumeAsync(scale, stoppingToken);
        if (shift is null)
        {
            return;
        }

        http.DefaultRequestHeaders.Add("X-Api-Key", await NewKeyAsync(stoppingToken));
        LogStarted(DemoFab.LiveProfileToolId, o.LiveLotSeconds);
        using var timer = new PeriodicTimer(TimeSpan.FromSeconds(o.LiveLotSeconds), clock);
        while (await timer.WaitForNextTickAsync(stoppingToken))
        {
            var lastSite = clock.GetUtcNow().UtcDateTime - shift.Value;
            var rows = DemoFab.LiveProfileLot(o.Seed, next, new DateTime(lastSite.Ticks - (lastSite.Ticks % TimeSpan.TicksPerSecond), DateTimeKind.Utc));
            var csv = new StringBuilder();
            await using (var writer = new StringWriter(csv, CultureInfo.InvariantCulture))
            {
                DemoFab.WriteCsv(writer, rows, shift.Value);
            }

            using var content = new StringContent(csv.ToString(), Encoding.UTF8, new MediaTypeHeaderValue("text/csv"));
            try
            {
                using var response = await http.PostAsync("/api/measurements/csv", content, stoppingToken);
                if (response.IsSuccessStatusCode)
                {
                    LastLot = $"Q{next}";
                    LotsSent++;
                    next++;
                }
                else
                {
                    LogRefused(next, (int)response.StatusCode, await response.Content.ReadAsStringAsync(stoppingToken));
                    next++; // a refused lot is not sent again: the tool moves on to the next
                }
            }
            catch (HttpRequestException e)
            {
                LogUnreachable(e.Message);
            }
        }
    }

    private async Task<bool> StartedAsync(CancellationToken stoppingToken)
    {
        var started = new TaskCompletionSource();
        using (lifetime.ApplicationStarted.Register(() => started.TrySetResult()))
        using (stoppingToken.Register(() => started.TrySetCanceled(stoppingToken)))
        {
            try
            {
                await started.Task;
                return true;
            }
            catch (OperationCanceledException)
            {
                return false;
            }
        }
    }

    // The server's own plain-HTTP address, with a wildcard host replaced by the loopback.
    private HttpClient? Client()
    {
        var address = server.Features.Get<IServerAddressesFeature>()?.Addresses.FirstOrDefault(a => a.StartsWith("http://", StringComparison.OrdinalIgnoreCase));
        if (address is null)
        {
            return null;
        }

        var host = address[7..];
        var port = host[(host.LastIndexOf(':') + 1)..];
        var local = host.StartsWith("localhost", StringComparison.OrdinalIgnoreCase) || host.StartsWith("127.", StringComparison.Ordinal) || host.StartsWith("[::1]", StringComparison.Ordinal)
            ? address
            : $"http://127.0.0.1:{port}";
        return new HttpClient { BaseAddress = new Uri(local.TrimEnd('/') + "/"), Timeout = TimeSpan.FromSeconds(60) };
    }

    /// <summary>
    /// How far the stored history was moved (its first site against the generator's first row) and the next lot number
    /// (after the generator's history and after every lot stored).
    /// </summary>
    private async Task<(TimeSpan? Shift, int Next)> ResumeAsync(DemoScale scale, CancellationToken cancellationToken)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        var first = await db.Measurements.AsNoTracking().OrderBy(m => m.MeasuredAtMs).Select(m => (long?)m.MeasuredAtMs).FirstOrDefaultAsync(cancellationToken);
        if (first is null)
        {
            LogNoHistory();
            return (null, 0);
        }

        var generated = DemoFab.GenerateRows(options.Value.Seed, scale).First().MeasuredAtUtc;
        var shift = DateTimeOffset.FromUnixTimeMilliseconds(first.Value).UtcDateTime - generated;
        var lots = await db.LotSteps.AsNoTracking().Where(l => EF.Functions.Like(l.LotId, "Q%")).Select(l => l.LotId).Distinct().ToListAsync(cancellationToken);
        var stored = lots.Select(l => int.TryParse(l.AsSpan(1), NumberStyles.None, CultureInfo.InvariantCulture, out var n) ? n : 0).DefaultIfEmpty(0).Max();
        return (shift, Math.Max(DemoFab.FirstLotNumberAfter(scale), stored + 1));
    }

    // A fresh ingest key at each start (only its hash is stored, so the last one cannot be read back); earlier keys of
    // the simulated tool are revoked. Both are audited as any key's are.
    private async Task<string> NewKeyAsync(CancellationToken cancellationToken)
    {
        await using var scope = scopes.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        foreach (var old in await db.ApiKeys.Where(k => k.Name == KeyName && k.RevokedAtMs == null).ToListAsync(cancellationToken))
        {
            var before = PeopleEndpoints.Describe(old);
            old.RevokedAtMs = now;
            old.RevokedBy = DemoLoader.Recorder;
            AuditLog.Add(db, DemoLoader.Recorder, "key", $"{old.Id} {old.Name}", "revoked", before, PeopleEndpoints.Describe(old), clock);
        }

        var (row, key) = ApiKeys.Create(KeyName, ApiKeys.IngestScope, DemoLoader.Recorder, now);
        db.ApiKeys.Add(row);
        await db.SaveChangesAsync(cancellationToken);
        AuditLog.Add(db, DemoLoader.Recorder, "key", $"{row.Id} {row.Name}", "created", null, PeopleEndpoints.Describe(row), clock);
        await db.SaveChangesAsync(cancellationToken);
        return key;
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Demo: the simulated profile tool {Tool} sends a new lot every {Seconds} s through the normal ingest")]
    private partial void LogStarted(string tool, int seconds);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Demo: the simulated profile tool needs a plain HTTP address to send its lots to; it does not run")]
    private partial void LogNoAddress();

    [LoggerMessage(Level = LogLevel.Warning, Message = "Demo: the database holds no measurements, so the simulated profile tool has no history to continue")]
    private partial void LogNoHistory();

    [LoggerMessage(Level = LogLevel.Warning, Message = "Demo: lot Q{Lot} of the simulated profile tool was refused ({Status}): {Problem}")]
    private partial void LogRefused(int lot, int status, string problem);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Demo: the simulated profile tool could not reach the server: {Message}")]
    private partial void LogUnreachable(string message);
}
