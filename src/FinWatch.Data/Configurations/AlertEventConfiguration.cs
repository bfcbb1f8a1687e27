using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class AlertEventConfiguration : IEntityTypeConfiguration<AlertEvent>
{
    public void Configure(EntityTypeBuilder<AlertEvent> builder)
    {
        builder.ToTable("alert_events");
        builder.HasIndex(e => e.AlertId);
        builder.Property(e => e.Kind).HasMaxLength(32);
        builder.Property(e => e.By).HasMaxLength(200);
        builder.Property(e => e.Comment).HasMaxLength(4000);
        builder.HasOne<Alert>().WithMany().HasForeignKey(e => e.AlertId).OnDelete(DeleteBehavior.Restrict);
    }
}
