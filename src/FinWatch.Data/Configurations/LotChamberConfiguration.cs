using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class LotChamberConfiguration : IEntityTypeConfiguration<LotChamber>
{
    public void Configure(EntityTypeBuilder<LotChamber> builder)
    {
        builder.ToTable("lot_chambers");
        builder.HasKey(c => new { c.LotId, c.Step, c.Chamber });
        builder.Property(c => c.LotId).HasMaxLength(64);
        builder.Property(c => c.Step).HasMaxLength(64);
        builder.Property(c => c.Chamber).HasMaxLength(64);
        builder.HasIndex(c => c.Chamber);
    }
}
