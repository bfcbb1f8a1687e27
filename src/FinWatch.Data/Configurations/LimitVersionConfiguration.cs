using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class LimitVersionConfiguration : IEntityTypeConfiguration<LimitVersion>
{
    public void Configure(EntityTypeBuilder<LimitVersion> builder)
    {
        builder.ToTable("limit_versions");
        builder.HasIndex(l => new { l.ContextId, l.Version }).IsUnique();
        builder.Property(l => l.Status).HasMaxLength(16);
        builder.Property(l => l.ComputedBy).HasMaxLength(200);
        builder.Property(l => l.ApprovedBy).HasMaxLength(200);
        builder.Property(l => l.Reason).HasMaxLength(2000);
        builder.Property(l => l.ApprovalComment).HasMaxLength(2000);
        builder.Property(l => l.Verdict).HasMaxLength(16);
        builder.Property(l => l.Justification).HasMaxLength(4000);
        builder.HasOne<ChartContext>().WithMany().HasForeignKey(l => l.ContextId).OnDelete(DeleteBehavior.Restrict);
    }
}
