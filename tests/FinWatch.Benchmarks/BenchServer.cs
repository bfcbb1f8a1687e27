using System.Diagnostics;
using System.Globalization;
using System.Net.Http.Json;
using FinWatch.SeedDemo;

namespace FinWatch.Benchmarks;

/// <summary>
/// A real FinWatch server process on a fresh SQLite file in a work folder (the built server next to the benchmark,
/// production environment, no demo, no inbox), with an HTTP client to it. Disposing kills the process.
/// </summary>
public sealed class BenchServer : IAsyncDisposable
{
    private readonly Process process;

    private const string Admin = "bench admin";
    private const string AdminPassword = "an invented benchmark password";

    private BenchServer(Process process, int port)
    {
        this.process = process;
        BaseAddress = new Uri($"http://127.0.0.1:{port}");
        Http = new HttpClient(new AntiforgeryHandler(new HttpClientHandler { CookieContainer = Cookies }, BaseAddress))
        {
            BaseAddress = BaseAddress, Timeout = TimeSpan.FromMinutes(30),
        };
    }

    public Uri BaseAddress { get; }

    /// <summary>A client signed in as the benchmark's administrator (created at start-up from the bootstrap settings).</summary>
    public HttpClient Http { get; }

    /// <summary>The signed-in session's cookies, for the SignalR clients.</summary>
    public System.Net.CookieContainer Cookies { get; } = new();

    public int ProcessId => process.Id;

    /// <summary>Starts the server with extra configuration pairs (name, value) and waits until it answers /alive.</summary>
    public static async Task<BenchServer> StartAsync(string work, string database, params string[] settings)
    {
        var serverDll = Path.Combine(AppContext.BaseDirectory, "FinWatch.Server.dll");
        var port = 5600 + Random.Shared.Next(300);
        var start = new ProcessStartInfo("dotnet")
        {
            RedirectStandardOutput = true,
            RedirectStandardError = true,
            WorkingDirectory = work,
        };
        foreach (var a in new[] { serverDll, "--urls", $"http://127.0.0.1:{port}", "--FinWatch:Database:SqlitePath", Path.Combine(work, database),
            "--FinWatch:Ingest:InboxEnabled", "false", "--Logging:LogLevel:Default", "Warning",
            "--FinWatch:Auth:BootstrapAdminName", Admin, "--FinWatch:Auth:BootstrapAdminPassword", AdminPassword }.Concat(settings))
        {
            start.ArgumentList.Add(a);
        }

        start.Environment["ASPNETCORE_ENVIRONMENT"] = "Production";
        var process = Process.Start(start)!;
        process.OutputDataReceived += (_, _) => { };
        process.ErrorDataReceived += (_, e) => { if (e.Data is not null) { Console.Error.WriteLine("server: " + e.Data); } };
        process.BeginOutputReadLine();
        process.BeginErrorReadLine();
        var server = new BenchServer(process, port);
        try
        {
            await server.WaitUntilUpAsync();
            (await server.Http.PostAsJsonAsync("/api/auth/sign-in", new { name = Admin, password = AdminPassword })).EnsureSuccessStatusCode();
            return server;
        }
        catch
        {
            await server.DisposeAsync();
            throw;
        }
    }

    /// <summary>Creates the invented demo products (TRN7, BRM7) through POST /api/products.</summary>
    public async Task CreateDemoProductsAsync()
    {
        foreach (var p in DemoFab.Products)
        {
            var response = await Http.PostAsJsonAsync("/api/products", new
            {
                code = p.Code,
                name = p.Name,
                description = p.Description,
                gate_faces = p.GatedFaces,
                nominal = new
                {
                    top_width_nm = p.Nominal.TopWidthNm,
                    bottom_width_nm = p.Nominal.BottomWidthNm,
                    fin_height_nm = p.Nominal.FinHeightNm,
                    corner_radius_nm = p.Nominal.CornerRadiusNm,
                    liner_thickness_nm = p.Nominal.LinerThicknessNm,
                },
            });
            response.EnsureSuccessStatusCode();
        }
    }

    /// <summary>The server's user plus system CPU time so far.</summary>
    public TimeSpan CpuTime()
    {
        process.Refresh();
        return process.TotalProcessorTime;
    }

    /// <summary>The server's resident set size now (Linux /proc): the memory it really holds, managed and native.</summary>
    public long RssBytes()
    {
        try
        {
            foreach (var line in File.ReadLines($"/proc/{process.Id}/status"))
            {
                if (line.StartsWith("VmRSS:", StringComparison.Ordinal))
                {
                    return long.Parse(line.Split(' ', StringSplitOptions.RemoveEmptyEntries)[1], CultureInfo.InvariantCulture) * 1024;
                }
            }
        }
        catch (IOException)
        {
        }

        return 0;
    }

    public async ValueTask DisposeAsync()
    {
        Http.Dispose();
        if (!process.HasExited)
        {
            process.Kill(entireProcessTree: true);
        }

        await process.WaitForExitAsync();
        process.Dispose();
    }

    private async Task WaitUntilUpAsync()
    {
        for (var i = 0; i < 300; i++)
        {
            try
            {
                if ((await Http.GetAsync("/alive")).IsSuccessStatusCode)
                {
                    return;
                }
            }
            catch (HttpRequestException)
            {
            }

            await Task.Delay(100);
        }

        throw new TimeoutException("the server did not start");
    }
}

/// <summary>Adds the antiforgery header to writes, as the pages do; fetches a token again after signing in.</summary>
internal sealed class AntiforgeryHandler(HttpMessageHandler inner, Uri baseAddress) : DelegatingHandler(inner)
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
                token = (await answer.Content.ReadFromJsonAsync<System.Text.Json.JsonElement>(cancellationToken)).GetProperty("token").GetString();
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
