using System.Text.Json;
using FinWatch.Data;
using FinWatch.Data.Entities;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Audit;

/// <summary>
/// The append-only audit trail: each change is staged in the same SaveChanges as the change itself, so a change and its
/// entry commit or fail together. States are stored as JSON of the API's own response shapes, in the API's dialect.
/// </summary>
public static class AuditLog
{
    private static readonly JsonSerializerOptions Json = new JsonSerializerOptions(JsonSerializerDefaults.Web).UseFinWatchJson();

    public static AuditEntry Add(FinWatchDbContext db, string by, string entity, string key, string action, object? before, object? after, TimeProvider clock)
    {
        var entry = new AuditEntry
        {
            AtMs = clock.GetUtcNow().ToUnixTimeMilliseconds(), By = by, Entity = entity, Key = key, Action = action,
            BeforeJson = before is null ? null : JsonSerializer.Serialize(before, Json),
            AfterJson = after is null ? null : JsonSerializer.Serialize(after, Json),
        };
        db.AuditEntries.Add(entry);
        return entry;
    }
}
