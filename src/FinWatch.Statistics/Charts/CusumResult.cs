namespace FinWatch.Statistics.Charts;

/// <summary>
/// A two-sided tabular CUSUM over a whole series (docs/statistics.md §4.2), from <see cref="Cusum.Compute"/>. Per-index arrays
/// have the length of the input and are indexed by input row; sums and means are in data units; missing rows hold
/// NaN sums and means and −1 counts.
/// </summary>
/// <param name="CPlus">Upper sums C⁺_i.</param>
/// <param name="CMinus">Lower sums C⁻_i.</param>
/// <param name="NPlus">Consecutive non-missing periods with C⁺ &gt; 0, ending at each row.</param>
/// <param name="NMinus">Consecutive non-missing periods with C⁻ &gt; 0, ending at each row.</param>
/// <param name="SignalsUpper">Rows (ascending) with C⁺ &gt; H. Every such row is listed: the sums are not reset.</param>
/// <param name="SignalsLower">Rows (ascending) with C⁻ &gt; H.</param>
/// <param name="NewMeanUpper">μ0 + K + C⁺/N⁺ at upper-signal rows, NaN elsewhere.</param>
/// <param name="NewMeanLower">μ0 − K − C⁻/N⁻ at lower-signal rows, NaN elsewhere.</param>
/// <param name="K">Reference value K in data units.</param>
/// <param name="H">Decision interval H in data units.</param>
public sealed record CusumResult(
    double[] CPlus,
    double[] CMinus,
    int[] NPlus,
    int[] NMinus,
    int[] SignalsUpper,
    int[] SignalsLower,
    double[] NewMeanUpper,
    double[] NewMeanLower,
    double K,
    double H);
