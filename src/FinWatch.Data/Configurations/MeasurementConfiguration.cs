using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class MeasurementConfiguration : IEntityTypeConfiguration<Measurement>
{
    public void Configure(EntityTypeBuilder<Measurement> builder)
    {
        builder.ToTable("measurements");
        foreach (var p in new[] { nameof(Measurement.LotId), nameof(Measurement.SiteId), nameof(Measurement.Step),
                     nameof(Measurement.EtchTool), nameof(Measurement.EtchChamber), nameof(Measurement.LinerTool),
                     nameof(Measurement.LinerChamber), nameof(Measurement.MetrologyTool), nameof(Measurement.Operator) })
        {
            builder.Property(p).HasMaxLength(64);
        }

        // The natural key: re-sending a batch must not duplicate a site (the ingest reports it as already present).
        builder.HasIndex(m => new { m.LotId, m.WaferSlot, m.SiteId, m.Step, m.MeasuredAtMs }).IsUnique();
        // Series and chart queries: one product and step in time order, ties in lot, wafer and site order, so the index
        // gives the whole ORDER BY of SeriesQuery.Rows and neither engine sorts (README Performance, time-range).
        builder.HasIndex(m => new { m.ProductId, m.Step, m.MeasuredAtMs, m.LotId, m.WaferSlot, m.SiteId })
            .HasDatabaseName("IX_measurements_series_order");
        // The monitor's step after each ingest: the rows of one batch for one product and step. Three equalities, so
        // the planner prefers it to the product-step index, which would read the product's whole history per batch.
        builder.HasIndex(m => new { m.BatchId, m.ProductId, m.Step });
        builder.HasOne<Product>().WithMany().HasForeignKey(m => m.ProductId).OnDelete(DeleteBehavior.Restrict);
        builder.HasOne<IngestBatch>().WithMany().HasForeignKey(m => m.BatchId).OnDelete(DeleteBehavior.Restrict);
    }
}
