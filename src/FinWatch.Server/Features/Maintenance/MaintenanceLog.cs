using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Server.Features.Audit;
using Microsoft.EntityFrameworkCore;

namespace FinWatch.Server.Features.Maintenance;

/// <summary>Recording maintenance events: all of them with their audit entries in one transaction, or none.</summary>
public static class MaintenanceLog
{
    public static MaintenanceResponse Describe(MaintenanceEvent e) => new(
        e.Id, e.Chamber, MaintenanceKindText.ToText(e.Kind), DateTimeOffset.FromUnixTimeMilliseconds(e.OccurredAtMs), e.PerformedBy, e.Note,
        e.RecordedBy, DateTimeOffset.FromUnixTimeMilliseconds(e.RecordedAtMs), e.Source);

    /// <summary>
    /// The checked events among <paramref name="events"/> that are recorded already (same chamber, kind and time),
    /// with the id that has them. One query.
    /// </summary>
    public static async Task<Dictionary<CheckedMaintenance, long>> RecordedAlreadyAsync(FinWatchDbContext db, IReadOnlyCollection<CheckedMaintenance> events,
        CancellationToken cancellationToken)
    {
        if (events.Count == 0)
        {
            return [];
        }

        var chambers = events.Select(e => e.Chamber).Distinct().ToList();
        long from = events.Min(e => e.OccurredAtMs), to = events.Max(e => e.OccurredAtMs);
        var stored = await db.MaintenanceEvents.AsNoTracking()
            .Where(e => chambers.Contains(e.Chamber) && e.OccurredAtMs >= from && e.OccurredAtMs <= to)
            .Select(e => new { e.Id, e.Chamber, e.Kind, e.OccurredAtMs }).ToListAsync(cancellationToken);
        var byKey = stored.GroupBy(e => (e.Chamber, e.Kind, e.OccurredAtMs)).ToDictionary(g => g.Key, g => g.Min(e => e.Id));
        return events.Where(e => byKey.ContainsKey((e.Chamber, e.Kind, e.OccurredAtMs)))
            .Distinct().ToDictionary(e => e, e => byKey[(e.Chamber, e.Kind, e.OccurredAtMs)]);
    }

    /// <summary>Stores the events and an audit entry for each ("maintenance", its id, "recorded"), in one transaction.</summary>
    public static async Task<List<MaintenanceResponse>> RecordAsync(FinWatchDbContext db, IReadOnlyList<CheckedMaintenance> events, string who, string source,
        TimeProvider clock, CancellationToken cancellationToken)
    {
        var now = clock.GetUtcNow().ToUnixTimeMilliseconds();
        var entities = events.Select(e => new MaintenanceEvent
        {
            Chamber = e.Chamber, Kind = e.Kind, OccurredAtMs = e.OccurredAtMs, PerformedBy = e.PerformedBy, Note = e.Note,
            RecordedBy = who, RecordedAtMs = now, Source = source,
        }).ToList();
        await using var transaction = await db.Database.BeginTransactionAsync(cancellationToken);
        db.MaintenanceEvents.AddRange(entities);
        await db.SaveChangesAsync(cancellationToken); // the ids the audit entries name
        var recorded = entities.Select(Describe).ToList();
        foreach (var r in recorded)
        {
            AuditLog.Add(db, who, "maintenance", r.Id.ToString(System.Globalization.CultureInfo.InvariantCulture), "recorded", null, r, clock);
        }

        await db.SaveChangesAsync(cancellationToken);
        await transaction.CommitAsync(cancellationToken);
        return recorded;
    }
}
