namespace FinWatch.Statistics.Charts;

/// <summary>
/// One period of a two-sided tabular CUSUM (docs/statistics.md §4.2), as returned by <see cref="CusumAccumulator.Append"/>.
/// Sums and means are in data units.
/// </summary>
/// <param name="CPlus">Upper sum C⁺_i ≥ 0; NaN for a missing value.</param>
/// <param name="CMinus">Lower sum C⁻_i ≥ 0; NaN for a missing value.</param>
/// <param name="NPlus">Consecutive non-missing periods, ending here, with C⁺ &gt; 0; −1 for a missing value.</param>
/// <param name="NMinus">Consecutive non-missing periods, ending here, with C⁻ &gt; 0; −1 for a missing value.</param>
/// <param name="SignalUpper">C⁺_i &gt; H (strict).</param>
/// <param name="SignalLower">C⁻_i &gt; H (strict).</param>
/// <param name="NewMeanUpper">At an upper signal, μ0 + K + C⁺_i/N⁺_i (Montgomery eq. 9.4); otherwise NaN.</param>
/// <param name="NewMeanLower">At a lower signal, μ0 − K − C⁻_i/N⁻_i; otherwise NaN.</param>
public readonly record struct CusumPoint(
    double CPlus,
    double CMinus,
    int NPlus,
    int NMinus,
    bool SignalUpper,
    bool SignalLower,
    double NewMeanUpper,
    double NewMeanLower)
{
    /// <summary>True when the input value was missing (NaN) and the period carries no statistic.</summary>
    public bool IsMissing => double.IsNaN(CPlus);
}
