using System.Text;
using FinWatch.Data.Entities;
using Microsoft.AspNetCore.Identity;
using Microsoft.AspNetCore.Identity.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Data;

/// <summary>
/// The one model of FinWatch's database. Each provider has a derived context with its own migration set
/// (<see cref="SqliteFinWatchDbContext"/>); handlers depend on this base type only.
/// </summary>
public abstract class FinWatchDbContext(DbContextOptions options) : IdentityUserContext<FinWatchUser>(options)
{
    public DbSet<Product> Products => Set<Product>();
    public DbSet<SpecLimit> SpecLimits => Set<SpecLimit>();
    public DbSet<SitePlanSite> SitePlanSites => Set<SitePlanSite>();
    public DbSet<Measurement> Measurements => Set<Measurement>();
    public DbSet<IngestBatch> IngestBatches => Set<IngestBatch>();
    public DbSet<LotStep> LotSteps => Set<LotStep>();
    public DbSet<LotChamber> LotChambers => Set<LotChamber>();
    public DbSet<MaintenanceEvent> MaintenanceEvents => Set<MaintenanceEvent>();
    public DbSet<ModelStamp> ModelStamps => Set<ModelStamp>();
    public DbSet<ModelParameterSet> ModelParameterSets => Set<ModelParameterSet>();
    public DbSet<ElectricalTest> ElectricalTests => Set<ElectricalTest>();
    public DbSet<ChartContext> ChartContexts => Set<ChartContext>();
    public DbSet<LimitVersion> LimitVersions => Set<LimitVersion>();
    public DbSet<ChartPoint> ChartPoints => Set<ChartPoint>();
    public DbSet<Alert> Alerts => Set<Alert>();
    public DbSet<AlertEvent> AlertEvents => Set<AlertEvent>();
    public DbSet<FeedEvent> FeedEvents => Set<FeedEvent>();
    public DbSet<ApiKey> ApiKeys => Set<ApiKey>();
    public DbSet<AuditEntry> AuditEntries => Set<AuditEntry>();
    public DbSet<ShiftHandover> ShiftHandovers => Set<ShiftHandover>();
    public DbSet<NotificationRule> NotificationRules => Set<NotificationRule>();
    public DbSet<RosterEntry> Roster => Set<RosterEntry>();
    public DbSet<OutboxMessage> Outbox => Set<OutboxMessage>();
    public DbSet<DeliveryAttempt> DeliveryAttempts => Set<DeliveryAttempt>();

    protected override void OnModelCreating(ModelBuilder builder)
    {
        base.OnModelCreating(builder); // Identity's user tables (the role is a column of the user: one role each)
        builder.Entity<FinWatchUser>().ToTable("users");
        builder.Entity<IdentityUserClaim<string>>().ToTable("user_claims");
        builder.Entity<IdentityUserLogin<string>>().ToTable("user_logins");
        builder.Entity<IdentityUserToken<string>>().ToTable("user_tokens");
        builder.ApplyConfigurationsFromAssembly(typeof(FinWatchDbContext).Assembly);

        // snake_case columns: the ingest's bulk insert and operators reading the database use these names.
        foreach (var entity in builder.Model.GetEntityTypes())
        {
            foreach (var property in entity.GetProperties())
            {
                property.SetColumnName(ToSnakeCase(property.Name));
            }
        }
    }

    /// <summary>"MeasuredAtMs" becomes "measured_at_ms"; digits stay with the word before them.</summary>
    public static string ToSnakeCase(string name)
    {
        var sb = new StringBuilder(name.Length + 8);
        for (var i = 0; i < name.Length; i++)
        {
            var c = name[i];
            if (char.IsUpper(c))
            {
                if (i > 0)
                {
                    sb.Append('_');
                }

                sb.Append(char.ToLowerInvariant(c));
            }
            else
            {
                sb.Append(c);
            }
        }

        return sb.ToString();
    }
}
