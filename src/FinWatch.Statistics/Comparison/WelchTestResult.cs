namespace FinWatch.Statistics.Comparison;

/// <summary>
/// Result of <see cref="WelchTest.Compare"/>: the two samples' sizes, means and variances, and Welch's t statistic
/// for the difference of the means (second minus first) with its Welch–Satterthwaite degrees of freedom and two-sided
/// p-value. Means, the difference and the standard error are in data units, variances in data units squared.
/// </summary>
/// <param name="FirstCount">Values of the first sample used (missing values skipped).</param>
/// <param name="SecondCount">Values of the second sample used.</param>
/// <param name="FirstMean">Mean of the first sample; NaN when it is empty.</param>
/// <param name="SecondMean">Mean of the second sample; NaN when it is empty.</param>
/// <param name="FirstVariance">Sample variance (divisor n − 1) of the first sample; NaN below two values.</param>
/// <param name="SecondVariance">Sample variance of the second sample; NaN below two values.</param>
/// <param name="Difference">Second mean minus first mean.</param>
/// <param name="StandardError">√(s₁²/n₁ + s₂²/n₂); NaN below two values in either sample.</param>
/// <param name="T">Difference / standard error; ±∞ when the standard error is 0 and the means differ; NaN when both
/// are 0 or either sample has fewer than two values.</param>
/// <param name="DegreesOfFreedom">Welch–Satterthwaite ν; NaN when t is not finite.</param>
/// <param name="PValue">Two-sided p = 2·F_ν(−|t|); 0 when t is infinite; NaN when t is NaN.</param>
public sealed record WelchTestResult(
    int FirstCount,
    int SecondCount,
    double FirstMean,
    double SecondMean,
    double FirstVariance,
    double SecondVariance,
    double Difference,
    double StandardError,
    double T,
    double DegreesOfFreedom,
    double PValue);
