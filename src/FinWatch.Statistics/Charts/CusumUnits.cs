namespace FinWatch.Statistics.Charts;

/// <summary>How the tabular CUSUM parameters k, h and the head start are expressed (docs/statistics.md §4.2).</summary>
public enum CusumUnits
{
    /// <summary>k, h and the head start are multiples of σ: K = k·σ, H = h·σ, C_0 = headStart·σ.</summary>
    Sigma,

    /// <summary>k, h and the head start are in data units: K = k, H = h, C_0 = headStart; σ is not used.</summary>
    Data,
}
