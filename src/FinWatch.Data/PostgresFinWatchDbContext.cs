using Microsoft.EntityFrameworkCore;

namespace FinWatch.Data;

/// <summary>The PostgreSQL (scale-out) flavour of the model; its migrations live in Migrations/Postgres.</summary>
public sealed class PostgresFinWatchDbContext(DbContextOptions<PostgresFinWatchDbContext> options) : FinWatchDbContext(options);
