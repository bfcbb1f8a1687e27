namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// A computed Shewhart chart. <see cref="Sigma"/> is the sigma of individual values the limits stand on (estimated
/// within-subgroup sigma, or the known one); null when it cannot be estimated (fewer than two usable values).
/// <see cref="ZoneScores"/> holds (x − CL)/sigma_point of the primary statistic per input position, NaN where there is no
/// point or sigma_point is zero (zone rules not evaluable, docs/statistics.md §3.3 item 9).
/// </summary>
public sealed record ShewhartChart(
    ShewhartChartType Type,
    LimitSource Source,
    double Center,
    double? Sigma,
    ChartSeries Primary,
    ChartSeries? Secondary,
    double[] ZoneScores,
    int[] SubgroupSizes,
    IReadOnlyList<string> Warnings);
