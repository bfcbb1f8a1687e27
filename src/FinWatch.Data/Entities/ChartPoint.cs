namespace FinWatch.Data.Entities;

/// <summary>
/// One plotted point of a context: a subgroup (a wafer's sites, or a lot's wafer means) from one ingest batch, with
/// the limits it was judged by and the rules it fired. <see cref="Seq"/> counts the context's points 1, 2, 3 …
/// </summary>
public sealed class ChartPoint
{
    public long Id { get; set; }
    public int ContextId { get; set; }
    public long Seq { get; set; }
    public long BatchId { get; set; }
    public long MeasuredAtMs { get; set; }
    public required string LotId { get; set; }

    /// <summary>The wafer for wafer subgroups; null for lot subgroups.</summary>
    public int? WaferSlot { get; set; }

    public string? Chamber { get; set; }

    /// <summary>Subgroup mean, its size and sample standard deviation (null for n = 1).</summary>
    public double Value { get; set; }
    public int N { get; set; }
    public double? Sd { get; set; }

    /// <summary>Mean predicted ΔVT,sat of the subgroup's sites, mV (engineering estimate); null when none was predicted.</summary>
    public double? PredictedDvtSatMv { get; set; }

    /// <summary>The approved limit version in force when the point was measured; null in the baseline phase.</summary>
    public int? LimitVersionId { get; set; }

    /// <summary>(value − centre)/σ_point under those limits; null in the baseline phase.</summary>
    public double? Z { get; set; }

    /// <summary>Comma-separated ids of the rules this point completed; empty when none.</summary>
    public string Signals { get; set; } = "";
}
