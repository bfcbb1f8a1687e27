using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class NotificationRuleConfiguration : IEntityTypeConfiguration<NotificationRule>
{
    public void Configure(EntityTypeBuilder<NotificationRule> builder)
    {
        builder.ToTable("notification_rules");
        builder.HasIndex(e => e.Owner);
        builder.Property(e => e.Owner).HasMaxLength(200);
        builder.Property(e => e.Channel).HasMaxLength(16);
        builder.Property(e => e.Webhook).HasMaxLength(64);
        builder.Property(e => e.MinSeverity).HasMaxLength(16);
        builder.Property(e => e.Product).HasMaxLength(64);
        builder.Property(e => e.Step).HasMaxLength(64);
        builder.Property(e => e.Equipment).HasMaxLength(64);
        builder.Property(e => e.Context).HasMaxLength(64);
        builder.Property(e => e.CreatedBy).HasMaxLength(200);
    }
}

internal sealed class RosterEntryConfiguration : IEntityTypeConfiguration<RosterEntry>
{
    public void Configure(EntityTypeBuilder<RosterEntry> builder)
    {
        builder.ToTable("shift_roster");
        builder.HasIndex(e => e.Shift);
        builder.Property(e => e.Shift).HasMaxLength(32);
        builder.Property(e => e.Person).HasMaxLength(200);
        builder.Property(e => e.FromDate).HasMaxLength(10);
        builder.Property(e => e.ToDate).HasMaxLength(10);
    }
}

internal sealed class OutboxMessageConfiguration : IEntityTypeConfiguration<OutboxMessage>
{
    public void Configure(EntityTypeBuilder<OutboxMessage> builder)
    {
        builder.ToTable("notification_outbox");
        // A repeat of the same notification (a retried evaluation) meets the key here, not the receiver.
        builder.HasIndex(e => e.Key).IsUnique();
        builder.HasIndex(e => new { e.Status, e.NextAttemptAtMs });
        builder.HasIndex(e => e.AlertId);
        builder.Property(e => e.Key).HasMaxLength(200);
        builder.Property(e => e.Event).HasMaxLength(16);
        builder.Property(e => e.Channel).HasMaxLength(16);
        builder.Property(e => e.Target).HasMaxLength(320);
        builder.Property(e => e.Recipient).HasMaxLength(200);
        builder.Property(e => e.Status).HasMaxLength(16);
        builder.Property(e => e.ClaimedBy).HasMaxLength(100);
        builder.Property(e => e.LastError).HasMaxLength(2000);
        builder.HasOne<Alert>().WithMany().HasForeignKey(e => e.AlertId).OnDelete(DeleteBehavior.Restrict);
    }
}

internal sealed class DeliveryAttemptConfiguration : IEntityTypeConfiguration<DeliveryAttempt>
{
    public void Configure(EntityTypeBuilder<DeliveryAttempt> builder)
    {
        builder.ToTable("notification_deliveries");
        builder.HasIndex(e => e.MessageId);
        builder.HasIndex(e => e.AlertId);
        builder.Property(e => e.Outcome).HasMaxLength(16);
        builder.Property(e => e.Detail).HasMaxLength(2000);
        builder.Property(e => e.By).HasMaxLength(100);
        builder.HasOne<OutboxMessage>().WithMany().HasForeignKey(e => e.MessageId).OnDelete(DeleteBehavior.Restrict);
    }
}
