namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// How to set a chart's limits. For <see cref="LimitSource.Baseline"/> the first <see cref="BaselineCount"/> input
/// positions (missing entries count as positions) are the baseline; <see cref="Excluded"/> input positions are left out
/// of the estimate (the caller keeps the reasons) but still plotted and judged.
/// </summary>
public sealed record LimitRequest(
    LimitSource Source,
    int? BaselineCount = null,
    double? KnownMean = null,
    double? KnownSigma = null,
    IReadOnlySet<int>? Excluded = null)
{
    /// <summary>Trial limits from all points.</summary>
    public static LimitRequest FromData { get; } = new(LimitSource.Data);

    /// <summary>Whether input position <paramref name="index"/> takes part in estimating the limits.</summary>
    public bool InEstimate(int index) =>
        Source switch
        {
            LimitSource.Baseline => index < BaselineCount && (Excluded is null || !Excluded.Contains(index)),
            LimitSource.Data => Excluded is null || !Excluded.Contains(index),
            _ => false,
        };
}
