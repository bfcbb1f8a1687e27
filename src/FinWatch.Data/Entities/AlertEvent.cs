namespace FinWatch.Data.Entities;

/// <summary>Append-only history of an alert: raised, point added, escalated, acknowledged, dispositioned, closed.</summary>
public sealed class AlertEvent
{
    public long Id { get; set; }
    public long AlertId { get; set; }
    public required string Kind { get; set; }
    public long AtMs { get; set; }
    public required string By { get; set; }
    public string Comment { get; set; } = "";

    /// <summary>For a disposition: JSON array of the reaction-plan steps taken, {"step", "done", "note"}.</summary>
    public string? StepsJson { get; set; }

    public long? PointId { get; set; }
}
