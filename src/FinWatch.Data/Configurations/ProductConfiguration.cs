using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ProductConfiguration : IEntityTypeConfiguration<Product>
{
    public void Configure(EntityTypeBuilder<Product> builder)
    {
        builder.ToTable("products");
        builder.HasIndex(p => p.Code).IsUnique();
        builder.Property(p => p.Code).HasMaxLength(64);
        builder.Property(p => p.Name).HasMaxLength(200);
        builder.Property(p => p.Description).HasMaxLength(2000);
        // The API's spelling ("tri-gate", "double-gate"), so the column reads the same as the JSON.
        builder.Property(p => p.GateFaces).HasConversion(f => GateFacesText.ToText(f), s => GateFacesText.Parse(s)).HasMaxLength(16);
        builder.Property(p => p.ModelSidewallOrientation).HasMaxLength(8);
        builder.Property(p => p.ModelEotNm).HasDefaultValue(0.9);
        builder.Property(p => p.ModelGateLengthNm).HasDefaultValue(20.0);
        builder.Property(p => p.ModelChannelDopingCm3).HasDefaultValue(1e17);
        builder.Property(p => p.ModelSidewallOrientation).HasDefaultValue(ConfinementSurfaceText.Si110);
        builder.HasMany(p => p.Specs).WithOne().HasForeignKey(s => s.ProductId).OnDelete(DeleteBehavior.Cascade);
    }
}
