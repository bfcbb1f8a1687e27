using FinWatch.Data;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Infrastructure;

public static class DataExtensions
{
    /// <summary>
    /// Registers the database: the one place the provider is chosen . Both providers' contexts are
    /// registered; <see cref="FinWatchDbContext"/> and <see cref="IDatabaseDialect"/> resolve to the configured one.
    /// </summary>
    public static WebApplicationBuilder AddFinWatchData(this WebApplicationBuilder builder)
    {
        builder.Services.AddOptions<DatabaseOptions>().BindConfiguration(DatabaseOptions.Section).ValidateDataAnnotations().ValidateOnStart();
        builder.Services.AddSingleton<SqliteConnectionSetup>();
        builder.Services.AddDbContext<SqliteFinWatchDbContext>((sp, options) =>
        {
            var db = sp.GetRequiredService<IOptions<DatabaseOptions>>().Value;
            options.UseSqlite(SqliteConnectionString(db, sp.GetRequiredService<IHostEnvironment>().ContentRootPath))
                .AddInterceptors(sp.GetRequiredService<SqliteConnectionSetup>());
        });
        builder.Services.AddDbContext<PostgresFinWatchDbContext>((sp, options) =>
            options.UseNpgsql(sp.GetRequiredService<IOptions<DatabaseOptions>>().Value.PostgresConnectionString()));
        builder.Services.AddScoped<FinWatchDbContext>(sp => IsPostgreSql(sp)
            ? sp.GetRequiredService<PostgresFinWatchDbContext>()
            : sp.GetRequiredService<SqliteFinWatchDbContext>());
        builder.Services.AddSingleton<SqliteDialect>();
        builder.Services.AddSingleton<PostgresDialect>();
        builder.Services.AddSingleton<IDatabaseDialect>(sp => IsPostgreSql(sp) ? sp.GetRequiredService<PostgresDialect>() : sp.GetRequiredService<SqliteDialect>());
        builder.Services.AddHealthChecks().AddCheck<DatabaseHealthCheck>("database");
        return builder;
    }

    private static bool IsPostgreSql(IServiceProvider sp) => sp.GetRequiredService<IOptions<DatabaseOptions>>().Value.IsPostgreSql;

    public static string SqliteConnectionString(DatabaseOptions options, string contentRoot)
    {
        if (!string.IsNullOrWhiteSpace(options.ConnectionString))
        {
            return options.ConnectionString;
        }

        var path = FinWatchPaths.Resolve(contentRoot, options.SqlitePath);
        Directory.CreateDirectory(Path.GetDirectoryName(path)!);
        return new SqliteConnectionStringBuilder { DataSource = path, Pooling = true }.ToString();
    }

    /// <summary>
    /// Creates or upgrades the schema with the provider's migration set, then the provider's settings (SQLite switches
    /// the file to write-ahead logging, a persistent setting). Instances starting together on PostgreSQL are safe: the
    /// migrator takes a database lock while it runs.
    /// </summary>
    public static async Task MigrateFinWatchDatabaseAsync(this WebApplication app)
    {
        await using var scope = app.Services.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        await db.Database.MigrateAsync();
        await scope.ServiceProvider.GetRequiredService<IDatabaseDialect>().AfterMigrateAsync(db, CancellationToken.None);
    }
}
