using FinWatch.Data;
using Microsoft.AspNetCore.Authentication;
using Microsoft.AspNetCore.Hosting;
using Microsoft.AspNetCore.Mvc.Testing;
using Microsoft.AspNetCore.TestHost;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.DependencyInjection;
using Microsoft.Extensions.DependencyInjection.Extensions;
using Microsoft.Extensions.Time.Testing;

namespace FinWatch.Testing;

/// <summary>
/// Boots the real server on its own SQLite file (WAL mode, migrations, the production ingest path) with a fake clock.
/// A temporary file rather than an in-memory database: the ingest holds a long write transaction while readers
/// continue, which is what WAL gives in production and shared-cache in-memory databases do not.
/// </summary>
public class FinWatchAppFactory : WebApplicationFactory<Program>
{
    /// <summary>The fake clock starts here: after the invented demo fab's last measurement (2026-11-30).</summary>
    public static readonly DateTimeOffset Now = new(2026, 12, 1, 8, 0, 0, TimeSpan.Zero);

    private readonly Dictionary<string, string?> settings = new(StringComparer.Ordinal);

    private readonly List<Action<IServiceCollection>> serviceChanges = [];

    public FinWatchAppFactory()
    {
        Folder = Directory.CreateTempSubdirectory("finwatch-test-").FullName;
        DatabasePath = Path.Combine(Folder, "finwatch.db");
        InboxPath = Path.Combine(Folder, "inbox");
        settings["FinWatch:Database:SqlitePath"] = DatabasePath;
        settings["FinWatch:Ingest:InboxPath"] = InboxPath;
        settings["FinWatch:Ingest:InboxEnabled"] = "false";
        settings["FinWatch:Ingest:InboxPollSeconds"] = "1";
    }

    public string Folder { get; }
    public string DatabasePath { get; }
    public string InboxPath { get; }
    public FakeTimeProvider Clock { get; } = new(Now);

    /// <summary>Who a request without the <see cref="TestAuthHandler.Header"/> header is (see <see cref="TestAuthHandler"/>).</summary>
    public string DefaultIdentity { get; set; } = "administrator";

    /// <summary>Runs on PostgreSQL instead of the temporary SQLite file (the scale-out tests).</summary>
    public FinWatchAppFactory UsePostgres(string connectionString) =>
        With("FinWatch:Database:Provider", "PostgreSql").With("FinWatch:Database:ConnectionString", connectionString);

    /// <summary>Sets a configuration value before the host starts (for example to enable the inbox or the demo).</summary>
    public FinWatchAppFactory With(string key, string? value)
    {
        settings[key] = value;
        return this;
    }

    /// <summary>Changes the app's services before the host starts, after the app has registered its own (for example to observe one).</summary>
    public FinWatchAppFactory WithServices(Action<IServiceCollection> change)
    {
        serviceChanges.Add(change);
        return this;
    }

    protected override void ConfigureWebHost(IWebHostBuilder builder)
    {
        builder.UseEnvironment("Testing");
        foreach (var (key, value) in settings)
        {
            builder.UseSetting(key, value);
        }

        builder.ConfigureServices(services =>
        {
            services.RemoveAll<TimeProvider>();
            services.AddSingleton<TimeProvider>(Clock);
            services.AddSingleton(this);
            services.AddAuthentication().AddScheme<AuthenticationSchemeOptions, TestAuthHandler>(TestAuthHandler.SchemeName, null);
            services.PostConfigure<AuthenticationOptions>(o =>
            {
                o.DefaultScheme = TestAuthHandler.SchemeName;
                o.DefaultAuthenticateScheme = TestAuthHandler.SchemeName;
                o.DefaultChallengeScheme = TestAuthHandler.SchemeName;
                o.DefaultForbidScheme = TestAuthHandler.SchemeName;
            });
        });
        builder.ConfigureTestServices(services => serviceChanges.ForEach(change => change(services)));
    }

    /// <summary>Runs a query against the app's database in a fresh scope.</summary>
    public async Task<T> QueryAsync<T>(Func<FinWatchDbContext, Task<T>> query)
    {
        await using var scope = Services.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        return await query(db);
    }

    /// <summary>Row counts of the tables an ingest writes: a rejected batch must leave all of them unchanged.</summary>
    public Task<(int Measurements, int Batches, int LotSteps, int LotChambers)> CountsAsync() =>
        QueryAsync(async db => (await db.Measurements.CountAsync(), await db.IngestBatches.CountAsync(),
            await db.LotSteps.CountAsync(), await db.LotChambers.CountAsync()));

    protected override void Dispose(bool disposing)
    {
        base.Dispose(disposing);
        if (disposing)
        {
            Microsoft.Data.Sqlite.SqliteConnection.ClearAllPools();
            try
            {
                Directory.Delete(Folder, recursive: true);
            }
            catch (IOException)
            {
                // A file still open by a finishing background service; the temp folder is cleaned by the OS later.
            }
        }
    }
}
