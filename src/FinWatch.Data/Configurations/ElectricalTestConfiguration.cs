using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ElectricalTestConfiguration : IEntityTypeConfiguration<ElectricalTest>
{
    public void Configure(EntityTypeBuilder<ElectricalTest> builder)
    {
        builder.ToTable("electrical_tests");
        builder.Property(e => e.LotId).HasMaxLength(64);
        builder.HasIndex(e => e.ParameterSetId);
        builder.HasIndex(e => new { e.LotId, e.WaferSlot });
        builder.HasOne<ModelParameterSet>().WithMany().HasForeignKey(e => e.ParameterSetId).OnDelete(DeleteBehavior.Restrict);
        builder.HasOne<Product>().WithMany().HasForeignKey(e => e.ProductId).OnDelete(DeleteBehavior.Restrict);
    }
}
