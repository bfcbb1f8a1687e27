namespace FinWatch.Statistics.Shewhart;

/// <summary>Where a chart's limits come from (docs/statistics.md §2.4).</summary>
public enum LimitSource
{
    /// <summary>Trial limits estimated from every point (phase I).</summary>
    Data,

    /// <summary>Estimated from the first <c>count</c> input positions (points or subgroups) and applied to all.</summary>
    Baseline,

    /// <summary>Given mean and sigma of individual values.</summary>
    Known,
}
