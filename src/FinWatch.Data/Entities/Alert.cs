namespace FinWatch.Data.Entities;

/// <summary>
/// An out-of-control alert: one per context and rule while open; later signals of the same rule add points to it.
/// States: open → acknowledged → dispositioned → closed. Its history is in <see cref="AlertEvent"/>; nothing about an
/// alert is ever deleted.
/// </summary>
public sealed class Alert
{
    public long Id { get; set; }
    public int ContextId { get; set; }
    public required string Rule { get; set; }
    public required string State { get; set; }
    public long RaisedAtMs { get; set; }
    public long UpdatedAtMs { get; set; }
    public long FirstPointId { get; set; }
    public long LastPointId { get; set; }
    public int PointCount { get; set; }
    public required string LotId { get; set; }
    public int? WaferSlot { get; set; }
    public string? Chamber { get; set; }

    /// <summary>Largest |mean predicted ΔVT,sat| over the alert's points, mV, with its sign; null when none was predicted.</summary>
    public double? PredictedDvtSatMv { get; set; }

    /// <summary>"low", "medium", "high" or "critical" (see the README: statistics and predicted electrical impact).</summary>
    public required string Severity { get; set; }

    public int SeverityRank { get; set; }
    public long? EscalatedAtMs { get; set; }
    public string? AcknowledgedBy { get; set; }
    public long? AcknowledgedAtMs { get; set; }
    public string? ClosedBy { get; set; }
    public long? ClosedAtMs { get; set; }
}
