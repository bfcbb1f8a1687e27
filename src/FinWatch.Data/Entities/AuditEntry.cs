namespace FinWatch.Data.Entities;

/// <summary>
/// One change, append-only (database triggers refuse updates and deletes): who, when, what (entity and key), the action,
/// and the state before and after as JSON.
/// </summary>
public sealed class AuditEntry
{
    public long Id { get; set; }
    public long AtMs { get; set; }
    public required string By { get; set; }
    public required string Entity { get; set; }
    public required string Key { get; set; }
    public required string Action { get; set; }
    public string? BeforeJson { get; set; }
    public string? AfterJson { get; set; }
}
