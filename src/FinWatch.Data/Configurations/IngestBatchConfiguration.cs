using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class IngestBatchConfiguration : IEntityTypeConfiguration<IngestBatch>
{
    public void Configure(EntityTypeBuilder<IngestBatch> builder)
    {
        builder.ToTable("ingest_batches");
        builder.Property(b => b.Source).HasMaxLength(16);
        builder.Property(b => b.Label).HasMaxLength(260);
    }
}
