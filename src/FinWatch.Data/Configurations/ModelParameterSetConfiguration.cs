using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ModelParameterSetConfiguration : IEntityTypeConfiguration<ModelParameterSet>
{
    public void Configure(EntityTypeBuilder<ModelParameterSet> builder)
    {
        builder.ToTable("model_parameter_sets");
        builder.HasIndex(s => new { s.ProductId, s.Version }).IsUnique();
        builder.Property(s => s.CodeVersion).HasMaxLength(200); // as model_stamps.code_version: ThresholdModel.CodeVersion is 72 characters
        builder.Property(s => s.CreatedBy).HasMaxLength(200);
        builder.Property(s => s.Reason).HasMaxLength(2000);
        builder.Property(s => s.SourceName).HasMaxLength(260);
        builder.HasOne<Product>().WithMany().HasForeignKey(s => s.ProductId).OnDelete(DeleteBehavior.Restrict);
    }
}
