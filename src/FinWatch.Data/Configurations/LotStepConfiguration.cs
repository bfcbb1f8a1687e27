using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class LotStepConfiguration : IEntityTypeConfiguration<LotStep>
{
    public void Configure(EntityTypeBuilder<LotStep> builder)
    {
        builder.ToTable("lot_steps");
        builder.HasKey(l => new { l.LotId, l.Step });
        builder.Property(l => l.LotId).HasMaxLength(64);
        builder.Property(l => l.Step).HasMaxLength(64);
        builder.HasIndex(l => l.LastMeasuredAtMs);
        builder.HasOne<Product>().WithMany().HasForeignKey(l => l.ProductId).OnDelete(DeleteBehavior.Restrict);
    }
}
