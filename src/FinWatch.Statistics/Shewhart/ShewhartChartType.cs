namespace FinWatch.Statistics.Shewhart;

/// <summary>The Shewhart chart pairs of docs/statistics.md §2.</summary>
public enum ShewhartChartType
{
    /// <summary>Individuals and moving range (span 2), docs/statistics.md §2.1.</summary>
    IndividualsMovingRange,

    /// <summary>Subgroup means with subgroup ranges, docs/statistics.md §2.2.</summary>
    MeanRange,

    /// <summary>Subgroup means with subgroup standard deviations, docs/statistics.md §2.2.</summary>
    MeanStandardDeviation,
}
