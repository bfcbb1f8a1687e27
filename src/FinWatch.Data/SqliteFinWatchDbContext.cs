using Microsoft.EntityFrameworkCore;

namespace FinWatch.Data;

/// <summary>The SQLite (embedded default) flavour of the model; its migrations live in Migrations/Sqlite.</summary>
public sealed class SqliteFinWatchDbContext(DbContextOptions<SqliteFinWatchDbContext> options) : FinWatchDbContext(options);
