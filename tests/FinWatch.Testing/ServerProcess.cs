using System.Collections.Concurrent;
using System.Diagnostics;
using System.Text.RegularExpressions;

namespace FinWatch.Testing;

/// <summary>
/// The built FinWatch server (FinWatch.Server.dll beside the test assembly) as a real separate process on a given
/// SQLite file, production environment, no demo, a free port chosen by Kestrel. For tests that kill, stop and restart
/// it; the in-process <see cref="FinWatchAppFactory"/> cannot be killed. Disposing kills the process if it still runs.
/// </summary>
public sealed partial class ServerProcess : IAsyncDisposable
{
    private readonly Process process;
    private readonly ConcurrentQueue<string> output = new();
    private readonly TaskCompletionSource<Uri> listening = new(TaskCreationOptions.RunContinuationsAsynchronously);

    private ServerProcess(Process process)
    {
        this.process = process;
    }

    /// <summary>
    /// The API key sent as <c>X-Api-Key</c> by <see cref="CreateClient"/> when set. The server will require one for
    /// ingest once sign-in and keys arrive (<c>FinWatch.Server keys add --name … --scope ingest</c>); it ignores it today.
    /// </summary>
    public static string? ApiKey { get; set; }

    public Uri BaseAddress { get; private set; } = null!;

    public int ProcessId => process.Id;

    /// <summary>The server's user plus system CPU time so far.</summary>
    public TimeSpan TotalProcessorTime()
    {
        process.Refresh();
        return process.TotalProcessorTime;
    }

    /// <summary>The server's console output so far, for failure messages.</summary>
    public string Output => string.Join('\n', output);

    /// <summary>Starts the server on <paramref name="databasePath"/> with extra settings (name, value pairs) and waits until /alive answers.</summary>
    public static async Task<ServerProcess> StartAsync(string databasePath, params string[] settings)
    {
        string[] args =
        [
            "--urls", "http://127.0.0.1:0", "--FinWatch:Database:SqlitePath", databasePath,
            "--Logging:LogLevel:Default", "Warning", "--Logging:LogLevel:Microsoft.Hosting.Lifetime", "Information", .. settings,
        ];
        var server = new ServerProcess(Launch(Path.GetDirectoryName(databasePath)!, args));
        server.process.OutputDataReceived += (_, e) => server.Collect(e.Data);
        server.process.ErrorDataReceived += (_, e) => server.Collect(e.Data);
        server.process.BeginOutputReadLine();
        server.process.BeginErrorReadLine();
        try
        {
            await server.WaitUntilUpAsync();
            return server;
        }
        catch
        {
            await server.DisposeAsync();
            throw;
        }
    }

    /// <summary>Runs the server executable with a command (for example <c>backup</c>) and returns its exit code and output.</summary>
    public static async Task<(int ExitCode, string StdOut, string StdErr)> RunCommandAsync(string workingDirectory, params string[] args)
    {
        using var process = Launch(workingDirectory, args);
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        using var timeout = new CancellationTokenSource(TimeSpan.FromMinutes(2));
        await process.WaitForExitAsync(timeout.Token);
        return (process.ExitCode, await stdout, await stderr);
    }

    /// <summary>
    /// The one place an HTTP client to the server process is made, so that a credential is added in one place:
    /// it sends <see cref="ApiKey"/> as <c>X-Api-Key</c> when one is set.
    /// </summary>
    public HttpClient CreateClient()
    {
        var client = new HttpClient { BaseAddress = BaseAddress, Timeout = TimeSpan.FromMinutes(5) };
        if (ApiKey is { } key)
        {
            client.DefaultRequestHeaders.Add("X-Api-Key", key);
        }

        return client;
    }

    /// <summary>Ends the process at once with SIGKILL (what <see cref="Process.Kill()"/> sends on Linux): no shutdown code runs.</summary>
    public async Task KillAsync()
    {
        process.Kill(entireProcessTree: true);
        await process.WaitForExitAsync();
    }

    /// <summary>Asks the server to stop with SIGTERM (a graceful host shutdown) and waits for it to exit; returns the exit code.</summary>
    public async Task<int> StopAsync(TimeSpan timeout)
    {
        using (var kill = Process.Start("kill", ["-TERM", process.Id.ToString(System.Globalization.CultureInfo.InvariantCulture)]))
        {
            await kill.WaitForExitAsync();
        }

        using var cts = new CancellationTokenSource(timeout);
        await process.WaitForExitAsync(cts.Token);
        return process.ExitCode;
    }

    public async ValueTask DisposeAsync()
    {
        if (!process.HasExited)
        {
            process.Kill(entireProcessTree: true);
        }

        await process.WaitForExitAsync();
        process.Dispose();
    }

    private static Process Launch(string workingDirectory, string[] args)
    {
        var start = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            WorkingDirectory = workingDirectory,
        };
        start.ArgumentList.Add(Path.Combine(AppContext.BaseDirectory, "FinWatch.Server.dll"));
        foreach (var a in args)
        {
            start.ArgumentList.Add(a);
        }

        start.Environment["ASPNETCORE_ENVIRONMENT"] = "Production";
        return Process.Start(start)!;
    }

    private void Collect(string? line)
    {
        if (line is null)
        {
            return;
        }

        output.Enqueue(line);
        if (ListeningLine().Match(line) is { Success: true } m)
        {
            listening.TrySetResult(new Uri(m.Groups[1].Value));
        }
    }

    private async Task WaitUntilUpAsync()
    {
        var exited = process.WaitForExitAsync();
        var first = await Task.WhenAny(listening.Task, exited, Task.Delay(TimeSpan.FromSeconds(60)));
        if (first != listening.Task)
        {
            throw new InvalidOperationException("the server did not start:\n" + Output);
        }

        BaseAddress = await listening.Task;
        using var http = CreateClient();
        for (var i = 0; i < 300; i++)
        {
            try
            {
                if ((await http.GetAsync(new Uri("/alive", UriKind.Relative))).IsSuccessStatusCode)
                {
                    return;
                }
            }
            catch (HttpRequestException)
            {
            }

            await Task.Delay(100);
        }

        throw new TimeoutException("the server did not answer /alive:\n" + Output);
    }

    [GeneratedRegex(@"Now listening on: (http://\S+)")]
    private static partial Regex ListeningLine();
}
