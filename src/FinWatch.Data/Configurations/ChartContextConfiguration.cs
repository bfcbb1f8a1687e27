using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ChartContextConfiguration : IEntityTypeConfiguration<ChartContext>
{
    public void Configure(EntityTypeBuilder<ChartContext> builder)
    {
        builder.ToTable("chart_contexts");
        builder.HasIndex(c => c.Code).IsUnique();
        builder.HasIndex(c => new { c.ProductId, c.Step });
        builder.Property(c => c.Code).HasMaxLength(100);
        builder.Property(c => c.Title).HasMaxLength(200);
        builder.Property(c => c.Step).HasMaxLength(64);
        builder.Property(c => c.Parameter).HasMaxLength(64);
        builder.Property(c => c.Chamber).HasMaxLength(64);
        builder.Property(c => c.ChartType).HasMaxLength(16);
        builder.Property(c => c.Subgroup).HasMaxLength(16);
        builder.Property(c => c.Rules).HasMaxLength(100);
        builder.Property(c => c.ReactionPlan).HasMaxLength(8000);
        builder.HasOne<Product>().WithMany().HasForeignKey(c => c.ProductId).OnDelete(DeleteBehavior.Restrict);
    }
}
