using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ApiKeyConfiguration : IEntityTypeConfiguration<ApiKey>
{
    public void Configure(EntityTypeBuilder<ApiKey> builder)
    {
        builder.ToTable("api_keys");
        builder.HasIndex(k => k.Prefix).IsUnique();
        builder.Property(k => k.Name).HasMaxLength(100);
        builder.Property(k => k.Prefix).HasMaxLength(32);
        builder.Property(k => k.Hash).HasMaxLength(64);
        builder.Property(k => k.Scope).HasMaxLength(16);
        builder.Property(k => k.CreatedBy).HasMaxLength(200);
        builder.Property(k => k.RevokedBy).HasMaxLength(200);
    }
}

internal sealed class AuditEntryConfiguration : IEntityTypeConfiguration<AuditEntry>
{
    public void Configure(EntityTypeBuilder<AuditEntry> builder)
    {
        builder.ToTable("audit_entries");
        builder.HasIndex(a => a.AtMs);
        builder.HasIndex(a => new { a.Entity, a.Key });
        builder.Property(a => a.By).HasMaxLength(200);
        builder.Property(a => a.Entity).HasMaxLength(64);
        builder.Property(a => a.Key).HasMaxLength(200);
        builder.Property(a => a.Action).HasMaxLength(64);
    }
}

internal sealed class FinWatchUserConfiguration : IEntityTypeConfiguration<FinWatchUser>
{
    public void Configure(EntityTypeBuilder<FinWatchUser> builder)
    {
        builder.Property(u => u.Role).HasMaxLength(16);
    }
}
