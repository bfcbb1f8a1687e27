using FinWatch.Data;
using Microsoft.Data.Sqlite;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Options;

namespace FinWatch.Server.Infrastructure;

public static class DataExtensions
{
    /// <summary>Registers the database: the one place the provider is chosen (shared/STYLE.md 3.8).</summary>
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
        builder.Services.AddScoped<FinWatchDbContext>(sp => sp.GetRequiredService<SqliteFinWatchDbContext>());
        builder.Services.AddHealthChecks().AddCheck<DatabaseHealthCheck>("database");
        return builder;
    }

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

    /// <summary>Creates or upgrades the schema and switches the file to write-ahead logging (a persistent setting).</summary>
    public static async Task MigrateFinWatchDatabaseAsync(this WebApplication app)
    {
        await using var scope = app.Services.CreateAsyncScope();
        var db = scope.ServiceProvider.GetRequiredService<FinWatchDbContext>();
        await db.Database.MigrateAsync();
        await db.Database.ExecuteSqlRawAsync("PRAGMA journal_mode=WAL;");
    }
}
