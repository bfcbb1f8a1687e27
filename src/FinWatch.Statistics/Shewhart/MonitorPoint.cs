namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// What one appended point shows on a chart with frozen limits: the plotted statistic, its limits and zone score, the
/// secondary (moving range, range or standard deviation) point, and whether either lies beyond its limits.
/// NaN marks what does not exist (the first moving range; a spread of a one-value subgroup; z when sigma is zero).
/// </summary>
public readonly record struct MonitorPoint(
    int Index,
    double Value,
    double Center,
    double Upper,
    double Lower,
    double Z,
    bool Beyond,
    double Secondary,
    double SecondaryUpper,
    double SecondaryLower,
    bool SecondaryBeyond);
