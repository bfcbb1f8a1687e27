using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class SpecLimitConfiguration : IEntityTypeConfiguration<SpecLimit>
{
    public void Configure(EntityTypeBuilder<SpecLimit> builder)
    {
        builder.ToTable("spec_limits");
        builder.Property(s => s.Parameter).HasMaxLength(64);
        builder.HasIndex(s => new { s.ProductId, s.Parameter }).IsUnique();
    }
}
