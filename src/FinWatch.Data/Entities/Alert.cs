namespace FinWatch.Data.Entities;

/// <summary>
/// An out-of-control alert: one excursion of one chart. It opens at the first signal of any enabled rule and collects
/// every later point and signal of that chart until a person closes it; while it is not closed the chart opens no
/// other. When the last few points (a setting) fire no rule it is marked back in control, which does not close it.
/// States: open → acknowledged → dispositioned → closed. Its history is in <see cref="AlertEvent"/>; nothing about an
/// alert is ever deleted.
/// </summary>
public sealed class Alert
{
    public long Id { get; set; }
    public int ContextId { get; set; }
    /// <summary>The rule whose signal opened the excursion (WE1..WE4, N1..N8).</summary>
    public required string Rule { get; set; }

    /// <summary>Every rule that fired during the excursion, comma separated, in the order they first fired.</summary>
    public string Rules { get; set; } = "";
    public required string State { get; set; }
    public long RaisedAtMs { get; set; }
    public long UpdatedAtMs { get; set; }
    /// <summary>The first signal point (the point that opened the excursion).</summary>
    public long FirstPointId { get; set; }

    /// <summary>The last point collected.</summary>
    public long LastPointId { get; set; }

    /// <summary>Chart position (seq) of the first signal point; the excursion's points are seq FirstSeq..LastSeq.</summary>
    public long FirstSeq { get; set; }

    /// <summary>Chart position of the last point collected.</summary>
    public long LastSeq { get; set; }

    /// <summary>Chart position of the last point that fired a rule.</summary>
    public long LastSignalSeq { get; set; }

    /// <summary>Points collected (every point of the chart from the first signal on).</summary>
    public int PointCount { get; set; }

    /// <summary>Points among them that fired at least one rule.</summary>
    public int SignalCount { get; set; }

    /// <summary>Distinct lots among the collected points.</summary>
    public int LotCount { get; set; }

    /// <summary>Distinct wafers (lot and slot) among the collected points; 0 on a chart of lot subgroups.</summary>
    public int WaferCount { get; set; }

    /// <summary>Measured time (UTC, ms) of the first signal point.</summary>
    public long FirstSignalAtMs { get; set; }

    /// <summary>Measured time (UTC, ms) of the last signal point.</summary>
    public long LastSignalAtMs { get; set; }

    /// <summary>When the excursion was marked back in control (the last N points fired no rule); null while it signals.</summary>
    public long? BackInControlAtMs { get; set; }

    /// <summary>Lot, wafer and chamber of the last signal point.</summary>
    public required string LotId { get; set; }
    public int? WaferSlot { get; set; }
    public string? Chamber { get; set; }

    /// <summary>Largest |mean predicted ΔVT,sat| over the alert's points, mV, with its sign; null when none was predicted.</summary>
    public double? PredictedDvtSatMv { get; set; }

    /// <summary>"low", "medium", "high" or "critical" (see the README: statistics and predicted electrical impact).</summary>
    public required string Severity { get; set; }

    public int SeverityRank { get; set; }
    public long? EscalatedAtMs { get; set; }

    /// <summary>Escalation steps taken: 0 none, 1 the on-shift supervisors, 2 and on the configured next levels.</summary>
    public int EscalationLevel { get; set; }

    /// <summary>The people of the latest escalation step, comma separated (empty when it found nobody).</summary>
    public string? EscalatedTo { get; set; }
    public string? AcknowledgedBy { get; set; }
    public long? AcknowledgedAtMs { get; set; }
    public string? ClosedBy { get; set; }
    public long? ClosedAtMs { get; set; }
}
