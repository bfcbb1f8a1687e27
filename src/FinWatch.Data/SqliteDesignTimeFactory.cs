using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Design;

namespace FinWatch.Data;

/// <summary>Lets <c>dotnet ef migrations add X --context SqliteFinWatchDbContext</c> build the model without the web host.</summary>
public sealed class SqliteDesignTimeFactory : IDesignTimeDbContextFactory<SqliteFinWatchDbContext>
{
    public SqliteFinWatchDbContext CreateDbContext(string[] args)
    {
        var options = new DbContextOptionsBuilder<SqliteFinWatchDbContext>()
            .UseSqlite("Data Source=design-time.db", o => o.MigrationsAssembly(typeof(SqliteFinWatchDbContext).Assembly.FullName))
            .Options;
        return new SqliteFinWatchDbContext(options);
    }
}
