using System.Collections.Concurrent;
using System.Diagnostics;
using System.Net.Http.Json;
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

    /// <summary>The invented administrator every test server is started with (FinWatch:Auth:BootstrapAdmin…).</summary>
    public const string Admin = "process test admin";
    public const string AdminPassword = "an invented process-test password";

    /// <summary>
    /// The tool key <see cref="CreateClient"/> sends as <c>X-Api-Key</c>: created with the server's own
    /// <c>keys add</c> command before the first start on a database, and kept beside it for restarts.
    /// </summary>
    public string ApiKey { get; private set; } = "";

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
            "--Logging:LogLevel:Default", "Warning", "--Logging:LogLevel:Microsoft.Hosting.Lifetime", "Information",
            "--FinWatch:Auth:BootstrapAdminName", Admin, "--FinWatch:Auth:BootstrapAdminPassword", AdminPassword, .. settings,
        ];
        var key = await IngestKeyAsync(databasePath);
        return await StartProcessAsync(Path.GetDirectoryName(databasePath)!, args, null, key);
    }

    /// <summary>
    /// Starts the server with settings in environment variables only (<c>FinWatch__Database__Provider</c> and so on, as
    /// a container gets them), listening where ASPNETCORE_URLS says or else on a free port of 127.0.0.1, and waits
    /// until /alive answers. No bootstrap
    /// administrator or tool key is added: the environment says what there is; <paramref name="apiKey"/> is the key
    /// <see cref="CreateClient"/> sends, if the caller made one (<see cref="RunCommandAsync(string, IReadOnlyDictionary{string, string}?, string[])"/>).
    /// </summary>
    public static Task<ServerProcess> StartWithEnvironmentAsync(string workingDirectory, IReadOnlyDictionary<string, string> environment, string apiKey = "") =>
        StartProcessAsync(workingDirectory,
            [.. environment.ContainsKey("ASPNETCORE_URLS") ? [] : new[] { "--urls", "http://127.0.0.1:0" },
                "--Logging:LogLevel:Default", "Warning", "--Logging:LogLevel:Microsoft.Hosting.Lifetime", "Information"],
            environment, apiKey);

    private static async Task<ServerProcess> StartProcessAsync(string workingDirectory, string[] args, IReadOnlyDictionary<string, string>? environment, string apiKey)
    {
        var server = new ServerProcess(Launch(workingDirectory, args, environment)) { ApiKey = apiKey };
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

    // The key of this database: made once with "keys add" (which also creates and migrates the database), then reused.
    private static async Task<string> IngestKeyAsync(string databasePath)
    {
        var file = databasePath + ".test-ingest-key";
        if (File.Exists(file))
        {
            return await File.ReadAllTextAsync(file);
        }

        var (exit, stdout, stderr) = await RunCommandAsync(Path.GetDirectoryName(databasePath)!, "keys", "add", "process test tool", "--scope", "ingest",
            "--FinWatch:Database:SqlitePath", databasePath, "--Logging:LogLevel:Default", "Warning");
        if (exit != 0)
        {
            throw new InvalidOperationException($"keys add failed ({exit}): {stderr}{stdout}");
        }

        var key = stdout.Trim().Split('\n')[^1].Trim();
        await File.WriteAllTextAsync(file, key);
        return key;
    }

    /// <summary>An HTTP client signed in as the bootstrap administrator (session cookie, antiforgery header on writes).</summary>
    public Task<HttpClient> CreateAdminClientAsync() => SignInAsync(BaseAddress, Admin, AdminPassword, Cookies);

    /// <summary>
    /// An HTTP client for <paramref name="address"/> (a server or a proxy in front of one) signed in as a person: the
    /// session cookie goes into <paramref name="cookies"/>, writes carry the antiforgery header.
    /// </summary>
    public static async Task<HttpClient> SignInAsync(Uri address, string name, string password, System.Net.CookieContainer cookies)
    {
        var client = new HttpClient(new AntiforgeryHandler(new HttpClientHandler { CookieContainer = cookies }, address))
        {
            BaseAddress = address, Timeout = TimeSpan.FromMinutes(30),
        };
        using var body = JsonContent.Create(new { name, password });
        (await client.PostAsync(new Uri("/api/auth/sign-in", UriKind.Relative), body)).EnsureSuccessStatusCode();
        return client;
    }

    /// <summary>The administrator's session cookies (after <see cref="CreateAdminClientAsync"/>), for SignalR clients.</summary>
    public System.Net.CookieContainer Cookies { get; } = new();

    /// <summary>Runs the server executable with a command (for example <c>backup</c>) and returns its exit code and output.</summary>
    public static Task<(int ExitCode, string StdOut, string StdErr)> RunCommandAsync(string workingDirectory, params string[] args) =>
        RunCommandAsync(workingDirectory, null, args);

    /// <summary>The same with extra environment variables (the settings of <see cref="StartWithEnvironmentAsync"/>).</summary>
    public static async Task<(int ExitCode, string StdOut, string StdErr)> RunCommandAsync(string workingDirectory, IReadOnlyDictionary<string, string>? environment, params string[] args)
    {
        using var process = Launch(workingDirectory, args, environment);
        var stdout = process.StandardOutput.ReadToEndAsync();
        var stderr = process.StandardError.ReadToEndAsync();
        using var timeout = new CancellationTokenSource(TimeSpan.FromMinutes(2));
        await process.WaitForExitAsync(timeout.Token);
        return (process.ExitCode, await stdout, await stderr);
    }

    /// <summary>
    /// An HTTP client for ingest: it sends the server's tool key <see cref="ApiKey"/> as <c>X-Api-Key</c> (a tool key
    /// may only ingest; use <see cref="CreateAdminClientAsync"/> for anything else).
    /// </summary>
    public HttpClient CreateClient()
    {
        var client = new HttpClient { BaseAddress = BaseAddress, Timeout = TimeSpan.FromMinutes(5) };
        client.DefaultRequestHeaders.Add("X-Api-Key", ApiKey);
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

    private static Process Launch(string workingDirectory, string[] args, IReadOnlyDictionary<string, string>? environment = null)
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
        foreach (var (name, value) in environment ?? new Dictionary<string, string>())
        {
            start.Environment[name] = value;
        }

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

/// <summary>Adds the antiforgery header to writes, as the pages do; fetches a new token after signing in.</summary>
public sealed class AntiforgeryHandler(HttpMessageHandler inner, Uri baseAddress) : DelegatingHandler(inner)
{
    private string? token;

    protected override async Task<HttpResponseMessage> SendAsync(HttpRequestMessage request, CancellationToken cancellationToken)
    {
        if (request.Method != HttpMethod.Get)
        {
            if (token is null)
            {
                using var get = new HttpRequestMessage(HttpMethod.Get, new Uri(baseAddress, "/api/auth/antiforgery"));
                using var answer = await base.SendAsync(get, cancellationToken);
                using var json = System.Text.Json.JsonDocument.Parse(await answer.Content.ReadAsStringAsync(cancellationToken));
                token = json.RootElement.GetProperty("token").GetString();
            }

            request.Headers.Add("X-FinWatch-Antiforgery", token);
        }

        var response = await base.SendAsync(request, cancellationToken);
        if (request.RequestUri?.AbsolutePath == "/api/auth/sign-in")
        {
            token = null; // the token is bound to who is signed in
        }

        return response;
    }
}
