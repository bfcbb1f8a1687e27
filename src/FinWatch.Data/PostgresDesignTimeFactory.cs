using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Design;

namespace FinWatch.Data;

/// <summary>
/// Lets <c>dotnet ef migrations add X --context PostgresFinWatchDbContext --output-dir Migrations/Postgres</c> build the
/// model without the web host or a running server (adding a migration does not connect).
/// </summary>
public sealed class PostgresDesignTimeFactory : IDesignTimeDbContextFactory<PostgresFinWatchDbContext>
{
    public PostgresFinWatchDbContext CreateDbContext(string[] args)
    {
        var options = new DbContextOptionsBuilder<PostgresFinWatchDbContext>()
            .UseNpgsql("Host=localhost;Database=finwatch_design;Username=finwatch", o => o.MigrationsAssembly(typeof(PostgresFinWatchDbContext).Assembly.FullName))
            .Options;
        return new PostgresFinWatchDbContext(options);
    }
}
