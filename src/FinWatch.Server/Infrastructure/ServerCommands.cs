using System.Diagnostics;
using System.Globalization;
using Microsoft.Data.Sqlite;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// Commands of the server executable (<c>FinWatch.Server backup …</c>), run instead of the web server when the first
/// argument names one. Each command reads the same configuration as the server (appsettings.json, environment,
/// <c>--FinWatch:…</c> settings), so it finds the same database. To add one, add a row to <see cref="Table"/>.
/// </summary>
public static class ServerCommands
{
    /// <summary>Exit code of a command that failed at run time (the database could not be read or written).</summary>
    public const int Failed = 1;

    /// <summary>Exit code of a command refused before it started (bad arguments, target exists, folder missing).</summary>
    public const int Refused = 2;

    private sealed record Command(string Name, string Arguments, string Summary, Func<string[], TextWriter, TextWriter, Task<int>> RunAsync);

    private static readonly Command[] Table =
    [
        new("backup", "<target-file> [--force] [settings]",
            "online copy of the SQLite database through the SQLite backup API, safe while the server runs and ingests; " +
            "refuses an existing target unless --force is given",
            BackupAsync),
        new("help", "", "this text", (_, output, _) => { output.Write(Usage()); return Task.FromResult(0); }),
    ];

    /// <summary>Runs the command named by <c>args[0]</c> and returns its exit code, or null when args[0] names none (then the web server runs).</summary>
    public static Task<int?> TryRunAsync(string[] args) => TryRunAsync(args, Console.Out, Console.Error);

    /// <inheritdoc cref="TryRunAsync(string[])"/>
    public static async Task<int?> TryRunAsync(string[] args, TextWriter output, TextWriter error)
    {
        ArgumentNullException.ThrowIfNull(args);
        if (args.Length == 0 || Table.FirstOrDefault(c => c.Name == args[0]) is not { } command)
        {
            return null;
        }

        return await command.RunAsync(args[1..], output, error);
    }

    /// <summary>The usage text: one line per command.</summary>
    public static string Usage()
    {
        var lines = Table.Select(c => $"  {(c.Name + " " + c.Arguments).TrimEnd()}\n      {c.Summary}\n");
        return "Usage: FinWatch.Server [command] [settings]\n" +
            "Without a command the web server runs. Settings are given as --FinWatch:Database:SqlitePath=<file> and so on.\n" +
            "Commands:\n" + string.Concat(lines) + Features.Access.AccessCommands.Usage + "\n";
    }

    private static async Task<int> BackupAsync(string[] args, TextWriter output, TextWriter error)
    {
        if (args.Length == 0 || args[0].StartsWith('-'))
        {
            await error.WriteAsync("backup: the target file is missing.\n" + Usage());
            return Refused;
        }

        var force = args.Contains("--force", StringComparer.Ordinal);
        var settings = args[1..].Where(a => a != "--force").ToArray();
        var source = DatabasePath(settings);
        var target = Path.GetFullPath(args[0]);
        var folder = Path.GetDirectoryName(target)!;
        string? refusal = null;
        if (!File.Exists(source))
        {
            refusal = $"there is no database at {source} (set --FinWatch:Database:SqlitePath=<file>)";
        }
        else if (!Directory.Exists(folder))
        {
            refusal = $"the target folder {folder} does not exist";
        }
        else if (string.Equals(Path.GetFullPath(source), target, StringComparison.Ordinal))
        {
            refusal = "the target is the database itself";
        }
        else if (File.Exists(target) && !force)
        {
            refusal = $"{target} exists already; give --force to replace it";
        }

        if (refusal is not null)
        {
            await error.WriteLineAsync("backup: " + refusal + ". Nothing was written.");
            return Refused;
        }

        // Copy into a hidden file beside the target and rename it when complete, so a failed copy never leaves a
        // half-written file under the target's name, and --force replaces the old one only with a whole backup.
        var partial = Path.Combine(folder, $".{Path.GetFileName(target)}.{Guid.NewGuid():N}.partial");
        var started = Stopwatch.GetTimestamp();
        try
        {
            long pages;
            long pageSize;
            await using (var from = new SqliteConnection(new SqliteConnectionStringBuilder
            {
                DataSource = source, Mode = SqliteOpenMode.ReadWrite, Pooling = false, DefaultTimeout = 60,
            }.ToString()))
            await using (var to = new SqliteConnection(new SqliteConnectionStringBuilder { DataSource = partial, Pooling = false }.ToString()))
            {
                await from.OpenAsync();
                await to.OpenAsync();

                // One step over all pages (sqlite3_backup_step(-1)) under one read transaction: in WAL mode the
                // server's writer goes on, and the copy is the database as of the moment the step began.
                from.BackupDatabase(to);
                pages = Scalar(to, "PRAGMA page_count");
                pageSize = Scalar(to, "PRAGMA page_size");
            }

            File.Move(partial, target, overwrite: force);
            var size = new FileInfo(target).Length;
            var ms = Stopwatch.GetElapsedTime(started).TotalMilliseconds;
            await output.WriteLineAsync(string.Create(CultureInfo.InvariantCulture,
                $"Backed up {source} to {target}: {size} bytes, {pages} pages of {pageSize} bytes, in {ms:0} ms."));
            return 0;
        }
        catch (Exception e) when (e is SqliteException or IOException or UnauthorizedAccessException)
        {
            await error.WriteLineAsync($"backup: failed: {e.Message}. The target was not written.");
            return Failed;
        }
        finally
        {
            foreach (var leftover in new[] { partial, partial + "-wal", partial + "-shm", partial + "-journal" })
            {
                File.Delete(leftover);
            }
        }
    }

    private static long Scalar(SqliteConnection connection, string sql)
    {
        using var cmd = connection.CreateCommand();
        cmd.CommandText = sql;
        return (long)cmd.ExecuteScalar()!;
    }

    // The database the server would open with the same settings: its configuration sources and path anchoring.
    private static string DatabasePath(string[] settings)
    {
        var builder = WebApplication.CreateBuilder(new WebApplicationOptions { Args = settings });
        var options = builder.Configuration.GetSection(DatabaseOptions.Section).Get<DatabaseOptions>() ?? new DatabaseOptions();
        return string.IsNullOrWhiteSpace(options.ConnectionString)
            ? FinWatchPaths.Resolve(builder.Environment.ContentRootPath, options.SqlitePath)
            : Path.GetFullPath(new SqliteConnectionStringBuilder(options.ConnectionString).DataSource);
    }
}
