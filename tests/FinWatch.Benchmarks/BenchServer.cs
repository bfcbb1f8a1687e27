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

    private BenchServer(ServerProcess server)
    {
        this.server = server;
        Http = server.CreateClient();
        Http.Timeout = TimeSpan.FromMinutes(30);
    }

    public Uri BaseAddress => server.BaseAddress;

    public HttpClient Http { get; }

    public int ProcessId => server.ProcessId;

    /// <summary>Starts the server with extra configuration pairs (name, value) and waits until it answers /alive.</summary>
    public static async Task<BenchServer> StartAsync(string work, string database, params string[] settings) =>
        new(await ServerProcess.StartAsync(Path.Combine(work, database), ["--FinWatch:Ingest:InboxEnabled", "false", .. settings]));

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
