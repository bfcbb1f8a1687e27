using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ModelStampConfiguration : IEntityTypeConfiguration<ModelStamp>
{
    public void Configure(EntityTypeBuilder<ModelStamp> builder)
    {
        builder.ToTable("model_stamps");
        builder.Property(m => m.ParameterSet).HasMaxLength(200);
        builder.Property(m => m.ParameterSetVersion).HasMaxLength(200);
        builder.Property(m => m.CodeVersion).HasMaxLength(200);
        builder.HasIndex(m => new { m.ProductId, m.ParameterSet, m.ParameterSetVersion, m.CodeVersion }).IsUnique();
        builder.HasOne<Product>().WithMany().HasForeignKey(m => m.ProductId).OnDelete(DeleteBehavior.Restrict);
    }
}
