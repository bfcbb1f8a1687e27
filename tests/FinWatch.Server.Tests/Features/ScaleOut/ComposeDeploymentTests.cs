using System.Diagnostics;
using System.Net;
using System.Net.Http.Json;
using System.Net.Sockets;
using System.Text.Json;
using System.Threading.Channels;
using FinWatch.Server.Features.Monitor;
using FinWatch.Testing;
using Microsoft.AspNetCore.Http.Connections;
using Microsoft.AspNetCore.SignalR.Client;
using Microsoft.Extensions.DependencyInjection;
using Npgsql;
using static FinWatch.Testing.MonitorFixture;

namespace FinWatch.Server.Tests.Features.ScaleOut;

/// <summary>
/// The scale-out set of docker-compose.yml run without Docker (CI has none): the two FinWatch services as server
/// processes with exactly the environment the compose file gives them (service host names mapped to this machine's
/// PostgreSQL and Redis, container paths to temporary folders), and Debian's nginx with deploy/scale-out/nginx.conf
/// (its upstream and listen addresses mapped to the processes' ports). What Docker itself adds (images, networks,
/// start order) is not tested here; the compose file's settings, health checks and proxy configuration are.
/// </summary>
public sealed class ComposeDeploymentTests : IAsyncLifetime
{
    private const string AdminPassword = "an invented compose-test passphrase";
    private readonly string folder = Path.Combine(Path.GetTempPath(), $"finwatch-compose-{Guid.NewGuid():N}");
    private readonly ComposeFile compose = ComposeFile.Load();
    private PostgresTestDatabase? database;
    private ServerProcess? a;
    private ServerProcess? b;
    private Process? nginx;
    private Uri proxy = null!;
    private Dictionary<string, string> environmentA = null!;
    private Dictionary<string, string> environmentB = null!;

    public async Task InitializeAsync()
    {
        if (TestServices.QuickRun)
        {
            return; // the tests are skipped (ScaleOutFact) and say why
        }

        TestServices.RequirePostgres();
        TestServices.RequireRedis();
        TestServices.RequireNginx();

        try
        {
            await StartAsync();
        }
        catch
        {
            await DisposeAsync(); // xunit 2 did not dispose this class when its initialisation threw (a started server kept running)
            throw;
        }
    }

    private async Task StartAsync()
    {
        Directory.CreateDirectory(folder);
        database = await PostgresTestDatabase.CreateAsync();
        environmentA = Environment("finwatch-a");
        environmentB = Environment("finwatch-b");
        // The tool key of a metrology tool, made with the server's own command on the compose environment.
        // The working folder is the server's own, with its appsettings.json, as the image's WORKDIR /app.
        var app = AppContext.BaseDirectory;
        var (exit, stdout, stderr) = await ServerProcess.RunCommandAsync(app, environmentA, "keys", "add", "compose test tool", "--scope", "ingest");
        Assert.True(exit == 0, stderr + stdout);
        var key = stdout.Trim().Split('\n')[^1].Trim();
        a = await ServerProcess.StartWithEnvironmentAsync(app, environmentA, key);
        b = await ServerProcess.StartWithEnvironmentAsync(app, environmentB, key);
        proxy = await StartNginxAsync();
    }

    public async Task DisposeAsync()
    {
        if (nginx is { HasExited: false })
        {
            nginx.Kill(entireProcessTree: true);
            await nginx.WaitForExitAsync();
        }

        nginx?.Dispose();
        foreach (var server in new[] { a, b })
        {
            if (server is not null)
            {
                await server.DisposeAsync();
            }
        }

        NpgsqlConnection.ClearAllPools();
        if (database is not null)
        {
            await database.DisposeAsync();
        }

        if (Directory.Exists(folder))
        {
            Directory.Delete(folder, recursive: true);
        }
    }

    // What a container of a FinWatch service starts with: the image's ENV, overridden by the service's compose
    // environment interpolated as `docker compose` would with the administrator's passphrase set; then each address
    // that only exists inside the container or the compose network mapped to this machine.
    private Dictionary<string, string> Environment(string service)
    {
        var env = ComposeFile.ImageEnvironment();
        foreach (var (name, value) in compose.Environment(service, new Dictionary<string, string> { ["FINWATCH_ADMIN_PASSWORD"] = AdminPassword }))
        {
            env[name] = value;
        }

        // The image listens on every address at 8080 (the port nginx.conf and the health check use); here a free port.
        Assert.Equal("http://+:8080", env["ASPNETCORE_URLS"]);
        env["ASPNETCORE_URLS"] = $"http://127.0.0.1:{FreePort()}";
        foreach (var name in new[] { "FinWatch__Database__SqlitePath", "FinWatch__Ingest__InboxPath" })
        {
            Assert.StartsWith("/", env[name], StringComparison.Ordinal); // absolute: independent of the working folder
        }

        env["FinWatch__Database__SqlitePath"] = Path.Combine(folder, "data", "finwatch.db"); // unused on PostgreSQL
        var cs = new NpgsqlConnectionStringBuilder(env["FinWatch__Database__ConnectionString"]);
        Assert.Contains(cs.Host!, compose.ServiceNames); // the database is the compose file's own PostgreSQL service
        var test = new NpgsqlConnectionStringBuilder(database!.ConnectionString);
        (cs.Host, cs.Port, cs.Database, cs.Username, cs.Password) = (test.Host, test.Port, test.Database, test.Username, test.Password);
        env["FinWatch__Database__ConnectionString"] = cs.ToString();

        var redis = env["FinWatch__SignalR__Redis"];
        Assert.Contains(redis.Split(':')[0], compose.ServiceNames);
        env["FinWatch__SignalR__Redis"] = PostgresTestDatabase.Redis!;
        env["FinWatch__SignalR__RedisChannelPrefix"] = Path.GetFileName(folder); // tests side by side do not hear each other
        env["FinWatch__Monitor__ApproverMustDiffer"] = "false"; // the one bootstrap administrator computes and approves the test limits

        // The shared key ring, and the inbox of the instance that watches one, are named volumes: they outlive a container.
        var volumes = new List<(string Name, string Volume)> { ("FinWatch__Auth__DataProtectionKeysPath", "finwatch-keys") };
        if (env["FinWatch__Ingest__InboxEnabled"] == "true")
        {
            volumes.Add(("FinWatch__Ingest__InboxPath", "finwatch-inbox"));
        }
        else
        {
            env["FinWatch__Ingest__InboxPath"] = Path.Combine(folder, "data", "inbox"); // the image's default, not watched
        }

        foreach (var (name, volume) in volumes)
        {
            Assert.Contains($"{volume}:{env[name]}", compose.Volumes(service));
            env[name] = Path.Combine(folder, volume);
        }

        return env;
    }

    // nginx with the repository's configuration; only the addresses differ, and its own files go to the test folder.
    private async Task<Uri> StartNginxAsync()
    {
        var conf = await File.ReadAllTextAsync(Path.Combine(TestPaths.RepositoryRoot(), "deploy", "scale-out", "nginx.conf"));
        var port = FreePort();
        foreach (var (service, server) in new[] { ("finwatch-a", a!), ("finwatch-b", b!) })
        {
            var upstream = $"server {service}:8080 ";
            Assert.Contains(upstream, conf, StringComparison.Ordinal); // the services' port: ASPNETCORE_URLS in the Dockerfile
            conf = conf.Replace(upstream, $"server 127.0.0.1:{server.BaseAddress.Port} ", StringComparison.Ordinal);
        }

        Assert.Contains("listen 8080;", conf, StringComparison.Ordinal);
        conf = conf.Replace("listen 8080;", $"listen 127.0.0.1:{port};", StringComparison.Ordinal)
            .Replace("http {", $$"""
                http {
                    client_body_temp_path {{folder}}/nginx-body;
                    proxy_temp_path {{folder}}/nginx-proxy;
                    fastcgi_temp_path {{folder}}/nginx-fastcgi;
                    uwsgi_temp_path {{folder}}/nginx-uwsgi;
                    scgi_temp_path {{folder}}/nginx-scgi;
                """, StringComparison.Ordinal);
        var path = Path.Combine(folder, "nginx.conf");
        await File.WriteAllTextAsync(path, $"pid {folder}/nginx.pid;\nerror_log {folder}/nginx-error.log;\n" + conf);

        var start = new ProcessStartInfo(TestServices.NginxPath) { RedirectStandardError = true, RedirectStandardOutput = true };
        foreach (var arg in new[] { "-p", folder, "-c", path, "-g", "daemon off;" })
        {
            start.ArgumentList.Add(arg);
        }

        nginx = Process.Start(start)!;
        var address = new Uri($"http://127.0.0.1:{port}/");
        using var http = new HttpClient { BaseAddress = address };
        for (var i = 0; i < 100; i++)
        {
            try
            {
                if ((await http.GetAsync(new Uri("/proxy-health", UriKind.Relative))).IsSuccessStatusCode)
                {
                    return address;
                }
            }
            catch (HttpRequestException)
            {
            }

            Assert.False(nginx.HasExited, "nginx stopped: " + await nginx.StandardError.ReadToEndAsync());
            await Task.Delay(100);
        }

        throw new TimeoutException("nginx did not answer /proxy-health");
    }

    // The compose file's bootstrap administrator (FINWATCH_ADMIN_NAME's default) with the passphrase given it here.
    private Task<HttpClient> SignInAsync(Uri address, CookieContainer cookies) =>
        ServerProcess.SignInAsync(address, environmentA["FinWatch__Auth__BootstrapAdminName"], AdminPassword, cookies);

    private static int FreePort()
    {
        using var listener = new TcpListener(IPAddress.Loopback, 0);
        listener.Start();
        return ((IPEndPoint)listener.LocalEndpoint).Port;
    }

    [ScaleOutFact]
    public async Task FinWatchHealthChecks_OfTheComposeFile_PassOnEachInstanceAndFailWithoutOne()
    {
        Assert.All(compose.ServiceNames, s => Assert.True(compose.HasHealthCheck(s), $"service {s} has no health check"));
        var check = compose.HealthCheck("finwatch-a");
        Assert.Equal(check, compose.HealthCheck("finwatch-b"));
        Assert.Equal(check, compose.HealthCheck("finwatch-single"));
        foreach (var server in new[] { a!, b! })
        {
            Assert.Equal(0, await RunAsync(check, server.BaseAddress.Port));
        }

        Assert.NotEqual(0, await RunAsync(check, FreePort())); // nothing listens there: the check must fail
    }

    // The check's command with the container port (8080) replaced by the instance's; its exit code.
    private static async Task<int> RunAsync(IReadOnlyList<string> check, int port)
    {
        var start = new ProcessStartInfo(check[0]) { RedirectStandardOutput = true, RedirectStandardError = true };
        foreach (var arg in check.Skip(1))
        {
            start.ArgumentList.Add(arg.Replace("/127.0.0.1/8080", $"/127.0.0.1/{port}", StringComparison.Ordinal));
        }

        using var process = Process.Start(start)!;
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(10));
        await process.WaitForExitAsync(timeout.Token);
        return process.ExitCode;
    }

    [ScaleOutFact]
    public async Task ThroughTheProxy_SignInIsValidOnBothInstances_AndAScreenReceivesPointsIngestedThroughEither()
    {
        using var http = new HttpClient { BaseAddress = proxy };
        Assert.Equal("ok\n", await http.GetStringAsync(new Uri("/proxy-health", UriKind.Relative)));
        Assert.Equal(HttpStatusCode.OK, (await http.GetAsync(new Uri("/health", UriKind.Relative))).StatusCode);

        // The compose file's administrator, signed in through the proxy.
        var cookies = new CookieContainer();
        using var admin = await SignInAsync(proxy, cookies);
        // One key ring (the finwatch-keys volume): the cookie the proxy's instance issued is accepted by each instance.
        foreach (var server in new[] { a!, b! })
        {
            using var direct = new HttpClient(new HttpClientHandler { CookieContainer = cookies }) { BaseAddress = server.BaseAddress };
            var me = await direct.GetFromJsonAsync<JsonElement>("/api/auth/me");
            Assert.True(me.GetProperty("signed_in").GetBoolean(), $"not signed in on {server.BaseAddress}");
            Assert.Equal("administrator", me.GetProperty("role").GetString());
        }

        await TestProducts.CreateBothAsync(admin);
        using var toolA = a!.CreateClient();
        await IngestAsync(toolA, Wafers("C0001", BaselineDay, new double[20]));
        await ApprovedContextAsync(admin, "TRI-TOP");

        // A floor screen through the proxy, on WebSockets only: the proxy must pass the upgrade through.
        var received = Channel.CreateUnbounded<FeedMessage>();
        await using var screen = new HubConnectionBuilder()
            .WithUrl(new Uri(proxy, MonitorHub.Path), o =>
            {
                o.Transports = HttpTransportType.WebSockets;
                o.Cookies = cookies;
            })
            .AddJsonProtocol(o => o.PayloadSerializerOptions.PropertyNamingPolicy = JsonNamingPolicy.SnakeCaseLower)
            .Build();
        screen.On<List<FeedMessage>>(nameof(IMonitorClient.Feed), entries => entries.ForEach(m => received.Writer.TryWrite(m)));
        await screen.StartAsync();
        var head = await screen.InvokeAsync<long>("Watch", new[] { "TRI-TOP" });

        // Whichever instance the proxy chose for the screen, one of these two lots was ingested on the other one.
        using var toolB = b!.CreateClient();
        await IngestAsync(toolA, Wafers("C0002", MonitorDay, 0.0));
        await IngestAsync(toolB, Wafers("C0003", MonitorDay.AddHours(1), 0.0));
        using var timeout = new CancellationTokenSource(TimeSpan.FromSeconds(20));
        var first = await received.Reader.ReadAsync(timeout.Token);
        var second = await received.Reader.ReadAsync(timeout.Token);
        Assert.Equal([head + 1, head + 2], new[] { first.Seq, second.Seq });
        Assert.Equal(["C0002", "C0003"], new[] { first.Point!.LotId, second.Point!.LotId });
    }

    [ScaleOutFact]
    public async Task ThroughTheProxy_AnUploadLargerThanNginxsDefaultLimit_IsStoredWhole()
    {
        using var admin = await SignInAsync(proxy, new CookieContainer());
        await TestProducts.CreateBothAsync(admin);
        // 60 lots of 25 wafers of 15 sites: 22,500 rows, about 3 MB, where nginx refuses bodies above 1 MB unless told
        // otherwise (nginx.org, client_max_body_size: "default 1m").
        var start = new DateTimeOffset(2026, 11, 20, 6, 0, 0, TimeSpan.Zero);
        var csv = SiteRow.Csv(Enumerable.Range(1, 60).SelectMany(lot => SiteRow.Wafers($"U{lot:000}", 25, 15, start.AddHours(lot))));
        Assert.True(csv.Length > 2 * 1024 * 1024, $"{csv.Length} bytes");
        using var tool = new HttpClient { BaseAddress = proxy };
        tool.DefaultRequestHeaders.Add("X-Api-Key", a!.ApiKey);
        var response = await tool.PostAsync(new Uri("/api/measurements/csv", UriKind.Relative), new StringContent(csv, System.Text.Encoding.UTF8, "text/csv"));
        Assert.Equal(HttpStatusCode.OK, response.StatusCode);
        Assert.Equal(22_500, (await response.Content.ReadFromJsonAsync<JsonElement>()).GetProperty("inserted").GetInt32());
    }

    [ScaleOutFact]
    public async Task InboxFolder_IsWatchedByInstanceAOnly_AndAFileIsIngestedOnce()
    {
        Assert.Equal("true", environmentA["FinWatch__Ingest__InboxEnabled"]);
        Assert.Equal("false", environmentB["FinWatch__Ingest__InboxEnabled"]);
        using var admin = await SignInAsync(a!.BaseAddress, new CookieContainer());
        await TestProducts.CreateBothAsync(admin);

        var inbox = environmentA["FinWatch__Ingest__InboxPath"];
        var file = Path.Combine(inbox, "tool-7.csv");
        await File.WriteAllTextAsync(Path.Combine(inbox, ".tool-7.csv.part"), SiteRow.Csv(SiteRow.Wafers("I0001", 2, 3, BaselineDay)));
        File.Move(Path.Combine(inbox, ".tool-7.csv.part"), file);
        var processed = Path.Combine(inbox, "processed");
        for (var i = 0; i < 300 && (!Directory.Exists(processed) || Directory.GetFiles(processed).Length == 0); i++)
        {
            await Task.Delay(100);
        }

        Assert.Single(Directory.GetFiles(processed));
        Assert.False(File.Exists(file));
        var lot = await admin.GetFromJsonAsync<JsonElement>("/api/lots/I0001");
        Assert.Equal(6, lot.GetProperty("steps").EnumerateArray()
            .Sum(s => s.GetProperty("wafers").EnumerateArray().Sum(w => w.GetProperty("sites").GetArrayLength())));
    }
}
