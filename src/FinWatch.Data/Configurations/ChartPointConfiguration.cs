using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ChartPointConfiguration : IEntityTypeConfiguration<ChartPoint>
{
    public void Configure(EntityTypeBuilder<ChartPoint> builder)
    {
        builder.ToTable("chart_points");
        builder.HasIndex(p => new { p.ContextId, p.Seq }).IsUnique();
        builder.HasIndex(p => new { p.ContextId, p.MeasuredAtMs });
        builder.Property(p => p.LotId).HasMaxLength(64);
        builder.Property(p => p.Chamber).HasMaxLength(64);
        builder.Property(p => p.Signals).HasMaxLength(100);
        builder.HasOne<ChartContext>().WithMany().HasForeignKey(p => p.ContextId).OnDelete(DeleteBehavior.Restrict);
    }
}
