using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class SitePlanSiteConfiguration : IEntityTypeConfiguration<SitePlanSite>
{
    public void Configure(EntityTypeBuilder<SitePlanSite> builder)
    {
        builder.ToTable("site_plan_sites");
        builder.Property(s => s.Step).HasMaxLength(64);
        builder.Property(s => s.SiteId).HasMaxLength(64);
        builder.Property(s => s.UpdatedBy).HasMaxLength(200);
        builder.HasIndex(s => new { s.ProductId, s.Step, s.Position }).IsUnique();
        builder.HasIndex(s => new { s.ProductId, s.Step, s.SiteId }).IsUnique();
        builder.HasOne<Product>().WithMany().HasForeignKey(s => s.ProductId).OnDelete(DeleteBehavior.Cascade);
    }
}
