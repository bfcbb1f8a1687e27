using System.Text.Json;
using FinWatch.Server.Infrastructure;
using Microsoft.AspNetCore.Http.Json;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Features.Measurements;

/// <summary>
/// Watches the inbox folder. A dropped .csv or .json file is ingested through <see cref="IngestMeasurements"/> and then
/// moved to processed/ or, with an error report beside it, to rejected/. A file is moved only after its batch committed
/// or was rejected, so a crash in between leaves it in the inbox; its second ingest finds the rows already present.
/// Files still being written (names starting with '.', ending in .tmp or .part, or still growing) are left alone.
/// </summary>
public sealed partial class InboxWatcher(
    IServiceScopeFactory scopes, IOptions<IngestOptions> options, IHostEnvironment environment,
    IOptions<JsonOptions> json, TimeProvider clock, ILogger<InboxWatcher> logger) : BackgroundService
{
    private readonly SemaphoreSlim wake = new(0);

    /// <summary>The absolute inbox path.</summary>
    public string InboxPath => FinWatchPaths.Resolve(environment.ContentRootPath, options.Value.InboxPath);

    protected override async Task ExecuteAsync(CancellationToken stoppingToken)
    {
        if (!options.Value.InboxEnabled)
        {
            return;
        }

        var inbox = InboxPath;
        Directory.CreateDirectory(inbox);
        Directory.CreateDirectory(Path.Combine(inbox, "processed"));
        Directory.CreateDirectory(Path.Combine(inbox, "rejected"));
        using var watcher = new FileSystemWatcher(inbox) { IncludeSubdirectories = false, EnableRaisingEvents = true };
        watcher.Created += (_, _) => wake.Release();
        watcher.Renamed += (_, _) => wake.Release();
        LogWatching(inbox);

        while (!stoppingToken.IsCancellationRequested)
        {
            try
            {
                await ProcessPendingAsync(inbox, stoppingToken);
                await wake.WaitAsync(TimeSpan.FromSeconds(options.Value.InboxPollSeconds), stoppingToken);
            }
            catch (OperationCanceledException) when (stoppingToken.IsCancellationRequested)
            {
                break;
            }
            catch (Exception e) when (e is IOException or UnauthorizedAccessException)
            {
                LogInboxFault(e, inbox);
                await Task.Delay(TimeSpan.FromSeconds(options.Value.InboxPollSeconds), stoppingToken);
            }
        }
    }

    /// <summary>Ingests every complete file waiting in the inbox, oldest name first.</summary>
    public async Task ProcessPendingAsync(string inbox, CancellationToken cancellationToken)
    {
        var files = Directory.EnumerateFiles(inbox)
            .Where(IsCandidate)
            .Order(StringComparer.Ordinal)
            .ToList();
        foreach (var file in files)
        {
            if (await IsStillGrowingAsync(file, cancellationToken))
            {
                continue;
            }

            await ProcessFileAsync(inbox, file, cancellationToken);
        }
    }

    private static bool IsCandidate(string path)
    {
        var name = Path.GetFileName(path);
        var ext = Path.GetExtension(name);
        return !name.StartsWith('.')
            && (ext.Equals(".csv", StringComparison.OrdinalIgnoreCase) || ext.Equals(".json", StringComparison.OrdinalIgnoreCase));
    }

    private static async Task<bool> IsStillGrowingAsync(string file, CancellationToken cancellationToken)
    {
        var before = new FileInfo(file).Length;
        await Task.Delay(TimeSpan.FromMilliseconds(250), cancellationToken);
        return new FileInfo(file).Length != before;
    }

    private async Task ProcessFileAsync(string inbox, string file, CancellationToken cancellationToken)
    {
        var name = Path.GetFileName(file);
        IngestOutcome outcome;
        await using (var stream = new FileStream(file, FileMode.Open, FileAccess.Read, FileShare.Read, 64 * 1024, useAsync: true))
        {
            using var scope = scopes.CreateScope();
            var ingest = scope.ServiceProvider.GetRequiredService<IngestMeasurements>();
            var rows = Path.GetExtension(name).Equals(".json", StringComparison.OrdinalIgnoreCase)
                ? JsonRowSource.ReadAsync(stream, cancellationToken)
                : CsvRowSource.ReadAsync(stream, cancellationToken);
            outcome = await ingest.RunAsync(rows, "inbox", name, cancellationToken);
        }

        var stamp = clock.GetUtcNow().UtcDateTime.ToString("yyyyMMdd'T'HHmmss'Z'", System.Globalization.CultureInfo.InvariantCulture);
        if (outcome.Accepted is { } accepted)
        {
            var target = UniquePath(Path.Combine(inbox, "processed"), name, stamp);
            File.Move(file, target);
            LogProcessed(name, accepted.Inserted, accepted.AlreadyPresent);
        }
        else
        {
            var target = UniquePath(Path.Combine(inbox, "rejected"), name, stamp);
            var report = outcome.Rejected!.ToProblem();
            await File.WriteAllTextAsync(target + ".errors.json",
                JsonSerializer.Serialize(report, json.Value.SerializerOptions), cancellationToken);
            File.Move(file, target);
            LogRejected(name, outcome.Rejected!.ErrorCount);
        }
    }

    // Keeps earlier files of the same name: processed/x.csv, then processed/x.20261202T101500Z.csv.
    private static string UniquePath(string folder, string name, string stamp)
    {
        var target = Path.Combine(folder, name);
        return File.Exists(target)
            ? Path.Combine(folder, $"{Path.GetFileNameWithoutExtension(name)}.{stamp}{Path.GetExtension(name)}")
            : target;
    }

    public override void Dispose()
    {
        wake.Dispose();
        base.Dispose();
    }

    [LoggerMessage(Level = LogLevel.Information, Message = "Watching inbox {Inbox}")]
    private partial void LogWatching(string inbox);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Inbox {Inbox} could not be read; retrying")]
    private partial void LogInboxFault(Exception e, string inbox);

    [LoggerMessage(Level = LogLevel.Information, Message = "Inbox file {Name} ingested: {Inserted} stored, {Present} already present")]
    private partial void LogProcessed(string name, int inserted, int present);

    [LoggerMessage(Level = LogLevel.Warning, Message = "Inbox file {Name} rejected with {Errors} errors")]
    private partial void LogRejected(string name, int errors);
}
