using System.Globalization;
using FinWatch.Testing;

namespace FinWatch.Benchmarks;

/// <summary>
/// A real FinWatch server process on a fresh SQLite file in a work folder (the built server next to the benchmark,
/// production environment, no demo, no inbox), with an HTTP client to it. Disposing kills the process.
/// </summary>
public sealed class BenchServer : IAsyncDisposable
{
    private readonly ServerProcess server;

    private BenchServer(ServerProcess server, HttpClient admin)
    {
        this.server = server;
        Http = admin;
    }

    public Uri BaseAddress => server.BaseAddress;

    /// <summary>A client signed in as the server's administrator (products, contexts, limits and ingest).</summary>
    public HttpClient Http { get; }

    /// <summary>The administrator's session, for the SignalR clients.</summary>
    public System.Net.CookieContainer Cookies => server.Cookies;

    public int ProcessId => server.ProcessId;

    /// <summary>Starts the server with extra configuration pairs (name, value) and waits until it answers /alive.</summary>
    public static async Task<BenchServer> StartAsync(string work, string database, params string[] settings)
    {
        var server = await ServerProcess.StartAsync(Path.Combine(work, database), ["--FinWatch:Ingest:InboxEnabled", "false", .. settings]);
        return new BenchServer(server, await server.CreateAdminClientAsync());
    }

    /// <summary>Creates the invented demo products (TRN7, BRM7) through POST /api/products.</summary>
    public Task CreateDemoProductsAsync() => DemoProducts.CreateAsync(Http);

    /// <summary>The server's user plus system CPU time so far.</summary>
    public TimeSpan CpuTime()
    {
        return server.TotalProcessorTime();
    }

    /// <summary>The server's resident set size now (Linux /proc): the memory it really holds, managed and native.</summary>
    public long RssBytes()
    {
        try
        {
            foreach (var line in File.ReadLines($"/proc/{server.ProcessId}/status"))
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
        await server.DisposeAsync();
    }
}
