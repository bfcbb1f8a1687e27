using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class AlertConfiguration : IEntityTypeConfiguration<Alert>
{
    public void Configure(EntityTypeBuilder<Alert> builder)
    {
        builder.ToTable("alerts");
        builder.HasIndex(a => new { a.ContextId, a.State });
        builder.HasIndex(a => a.State);
        builder.Property(a => a.Rule).HasMaxLength(8);
        builder.Property(a => a.Rules).HasMaxLength(64);
        builder.Property(a => a.State).HasMaxLength(16);
        builder.Property(a => a.LotId).HasMaxLength(64);
        builder.Property(a => a.Chamber).HasMaxLength(64);
        builder.Property(a => a.Severity).HasMaxLength(16);
        builder.Property(a => a.AcknowledgedBy).HasMaxLength(200);
        builder.Property(a => a.ClosedBy).HasMaxLength(200);
        builder.Property(a => a.EscalatedTo).HasMaxLength(2000);
        builder.HasOne<ChartContext>().WithMany().HasForeignKey(a => a.ContextId).OnDelete(DeleteBehavior.Restrict);
    }
}
