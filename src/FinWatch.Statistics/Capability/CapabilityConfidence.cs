using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Capability;

/// <summary>
/// Normal-theory confidence limits for capability indices estimated from N individual values (docs/statistics.md §5.2).
/// The same formulas serve Cp and Pp, and Cpk and Ppk.
/// </summary>
/// <remarks>
/// The formulas assume that sigma was estimated by the sample standard deviation of one sample of N, with
/// ν = N − 1 degrees of freedom. Used for within indices (sigma from Rbar/d2 or MRbar/d2 has fewer
/// effective degrees of freedom), the intervals are slightly optimistic (docs/statistics.md §5.2 [conv]).
/// </remarks>
public static class CapabilityConfidence
{
    /// <summary>
    /// Two-sided interval for Cp: [Ĉp·√(χ²_{α/2,ν}/ν), Ĉp·√(χ²_{1−α/2,ν}/ν)], ν = N − 1, χ²_{p,ν} the
    /// lower-tail p quantile, α = 1 − <paramref name="confidence"/> (Montgomery eq. 8.19, NIST §6.1.6, from memory).
    /// </summary>
    /// <param name="cpHat">Estimated Cp (finite, ≥ 0).</param>
    /// <param name="n">Number of individual values, ≥ 2.</param>
    /// <param name="confidence">Confidence level, strictly between 0 and 1.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument is outside its range.</exception>
    public static ConfidenceInterval CpInterval(double cpHat, int n, double confidence = 0.95)
    {
        Check(cpHat, nameof(cpHat), n, confidence, requireNonNegative: true);
        var nu = n - 1.0;
        var alpha = 1.0 - confidence;
        return new ConfidenceInterval(
            cpHat * Math.Sqrt(ChiSquared.InvCDF(nu, alpha / 2.0) / nu),
            cpHat * Math.Sqrt(ChiSquared.InvCDF(nu, 1.0 - (alpha / 2.0)) / nu));
    }

    /// <summary>One-sided lower confidence bound for Cp: Ĉp·√(χ²_{α,ν}/ν), ν = N − 1.</summary>
    /// <inheritdoc cref="CpInterval" path="/param"/>
    /// <exception cref="ArgumentOutOfRangeException">An argument is outside its range.</exception>
    public static double CpLowerBound(double cpHat, int n, double confidence = 0.95)
    {
        Check(cpHat, nameof(cpHat), n, confidence, requireNonNegative: true);
        var nu = n - 1.0;
        return cpHat * Math.Sqrt(ChiSquared.InvCDF(nu, 1.0 - confidence) / nu);
    }

    /// <summary>
    /// Two-sided interval for Cpk by Bissell (1990), as quoted by Rodriguez (1992):
    /// Ĉpk·[1 ∓ z_{1−α/2}·√(1/(9·N·Ĉpk²) + 1/(2(N − 1)))], with the exact normal quantile.
    /// </summary>
    /// <remarks>
    /// Computed in the algebraically identical form Ĉpk ∓ z·√(1/(9N) + Ĉpk²/(2(N − 1))), which stays finite
    /// and ordered (Low ≤ High) for Ĉpk ≤ 0 as well, where the printed form divides by zero or swaps the
    /// limits (a FinWatch decision; Bissell's approximation is meant for positive Cpk).
    /// </remarks>
    /// <param name="cpkHat">Estimated Cpk (finite, any sign).</param>
    /// <param name="n">Number of individual values, ≥ 2.</param>
    /// <param name="confidence">Confidence level, strictly between 0 and 1.</param>
    /// <exception cref="ArgumentOutOfRangeException">An argument is outside its range.</exception>
    public static ConfidenceInterval CpkInterval(double cpkHat, int n, double confidence = 0.95)
    {
        Check(cpkHat, nameof(cpkHat), n, confidence, requireNonNegative: false);
        var z = Normal.InvCDF(0.0, 1.0, 1.0 - ((1.0 - confidence) / 2.0));
        var halfWidth = z * BissellSd(cpkHat, n);
        return new ConfidenceInterval(cpkHat - halfWidth, cpkHat + halfWidth);
    }

    /// <summary>One-sided lower confidence bound for Cpk: Ĉpk·[1 − z_{1−α}·√(1/(9·N·Ĉpk²) + 1/(2(N − 1)))]
    /// (computed as Ĉpk − z·√(1/(9N) + Ĉpk²/(2(N − 1))), see <see cref="CpkInterval"/>).</summary>
    /// <inheritdoc cref="CpkInterval" path="/param"/>
    /// <exception cref="ArgumentOutOfRangeException">An argument is outside its range.</exception>
    public static double CpkLowerBound(double cpkHat, int n, double confidence = 0.95)
    {
        Check(cpkHat, nameof(cpkHat), n, confidence, requireNonNegative: false);
        var z = Normal.InvCDF(0.0, 1.0, confidence);
        return cpkHat - (z * BissellSd(cpkHat, n));
    }

    private static double BissellSd(double cpkHat, int n) =>
        Math.Sqrt((1.0 / (9.0 * n)) + (cpkHat * cpkHat / (2.0 * (n - 1.0))));

    internal static void CheckConfidence(double confidence, string paramName)
    {
        if (!(confidence > 0.0 && confidence < 1.0))
        {
            throw new ArgumentOutOfRangeException(paramName, confidence, "The confidence level must be strictly between 0 and 1.");
        }
    }

    private static void Check(double index, string indexName, int n, double confidence, bool requireNonNegative)
    {
        if (!double.IsFinite(index) || (requireNonNegative && index < 0))
        {
            throw new ArgumentOutOfRangeException(indexName, index, "The estimated index must be finite (and non-negative for Cp).");
        }

        ArgumentOutOfRangeException.ThrowIfLessThan(n, 2);
        CheckConfidence(confidence, nameof(confidence));
    }
}
