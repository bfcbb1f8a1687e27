using FinWatch.Data.Entities;
using Microsoft.EntityFrameworkCore;
using Microsoft.EntityFrameworkCore.Metadata.Builders;

namespace FinWatch.Data.Configurations;

internal sealed class ShiftHandoverConfiguration : IEntityTypeConfiguration<ShiftHandover>
{
    public void Configure(EntityTypeBuilder<ShiftHandover> builder)
    {
        builder.ToTable("shift_handovers");
        builder.Property(e => e.ShiftDate).HasMaxLength(10);
        builder.Property(e => e.Shift).HasMaxLength(32);
        builder.Property(e => e.Notes).HasMaxLength(ShiftHandover.MaxNotesLength);
        builder.Property(e => e.NotesBy).HasMaxLength(200);
        builder.Property(e => e.OutgoingBy).HasMaxLength(200);
        builder.Property(e => e.IncomingBy).HasMaxLength(200);
        // One handover per shift; two supervisors writing at once meet here, not in two rows.
        builder.HasIndex(e => new { e.ShiftDate, e.Shift }).IsUnique();
        builder.HasIndex(e => e.ShiftStartMs);
    }
}
