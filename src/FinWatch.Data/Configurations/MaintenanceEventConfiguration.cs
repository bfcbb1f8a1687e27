using FinWatch.Data.Entities;
using FinWatch.Physics;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class MaintenanceEventConfiguration : IEntityTypeConfiguration<MaintenanceEvent>
{
    public void Configure(EntityTypeBuilder<MaintenanceEvent> builder)
    {
        builder.ToTable("maintenance_events");
        builder.Property(e => e.Chamber).HasMaxLength(64);
        builder.Property(e => e.Kind).HasConversion(k => MaintenanceKindText.ToText(k), s => MaintenanceKindText.Spelling.Parse(s)).HasMaxLength(32);
        builder.Property(e => e.PerformedBy).HasMaxLength(200);
        builder.Property(e => e.Note).HasMaxLength(2000);
        builder.Property(e => e.RecordedBy).HasMaxLength(200);
        builder.Property(e => e.Source).HasMaxLength(260);
        // The last maintenance of a chamber before a time: one chamber in time order.
        builder.HasIndex(e => new { e.Chamber, e.OccurredAtMs });
        // The log across chambers, newest first.
        builder.HasIndex(e => e.OccurredAtMs);
    }
}
