using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class FeedEventConfiguration : IEntityTypeConfiguration<FeedEvent>
{
    public void Configure(EntityTypeBuilder<FeedEvent> builder)
    {
        builder.ToTable("feed_events");
        builder.HasKey(e => e.Seq);
        builder.HasIndex(e => new { e.ContextId, e.Seq });
        builder.Property(e => e.Kind).HasMaxLength(16);
    }
}
