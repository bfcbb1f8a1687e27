using FinWatch.Data;
using Microsoft.EntityFrameworkCore;
using Microsoft.Extensions.Diagnostics.HealthChecks;

namespace FinWatch.Server.Infrastructure;

/// <summary>Healthy when the database answers a query.</summary>
public sealed class DatabaseHealthCheck(FinWatchDbContext db) : IHealthCheck
{
    public async Task<HealthCheckResult> CheckHealthAsync(HealthCheckContext context, CancellationToken cancellationToken = default)
    {
        try
        {
            await db.Products.AnyAsync(cancellationToken);
            return HealthCheckResult.Healthy();
        }
        catch (Exception e) when (e is InvalidOperationException or System.Data.Common.DbException)
        {
            return HealthCheckResult.Unhealthy("the database does not answer", e);
        }
    }
}
