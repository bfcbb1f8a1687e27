namespace FinWatch.Statistics.Shewhart;

/// <summary>The Shewhart chart pairs of spc.md section 2.</summary>
public enum ShewhartChartType
{
    /// <summary>Individuals and moving range (span 2), spc.md 2.1.</summary>
    IndividualsMovingRange,

    /// <summary>Subgroup means with subgroup ranges, spc.md 2.2.</summary>
    MeanRange,

    /// <summary>Subgroup means with subgroup standard deviations, spc.md 2.2.</summary>
    MeanStandardDeviation,
}
