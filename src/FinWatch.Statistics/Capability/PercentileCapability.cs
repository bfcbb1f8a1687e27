using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Capability;

/// <summary>
/// Capability of non-normal data by the percentile method (Clements 1989; ISO 22514-2/-4 percentile
/// indices), docs/statistics.md §7, with the percentiles taken from a fitted two-parameter lognormal distribution.
/// </summary>
public static class PercentileCapability
{
    /// <summary>The label every result carries.</summary>
    public const string MethodLabel = "percentile method, fitted lognormal (overall variation)";

    /// <summary>Lower tail probability, exactly 0.00135 (not Φ(−3) = 0.0013499, docs/statistics.md §7).</summary>
    public const double LowerTailProbability = 0.00135;

    /// <summary>Upper tail probability, exactly 0.99865.</summary>
    public const double UpperTailProbability = 0.99865;

    /// <summary>
    /// Fits a two-parameter lognormal by maximum likelihood (mu = mean of ln x, sigma with divisor n) and
    /// computes the percentile indices Cp, Cpu, Cpl, Cpk of docs/statistics.md §7 from x_0.00135, the median exp(mu) and
    /// x_0.99865.
    /// </summary>
    /// <param name="values">Positive measurements in data units; NaN marks a missing value and is skipped.</param>
    /// <param name="spec">Specification limits (the target is not used).</param>
    /// <returns>The fit and the indices. Undefined (null with a reason): any value ≤ 0 (the lognormal fit
    /// is undefined), fewer than 2 values, a fitted sigma of 0 (constant data), no specification limit
    /// (indices only), a one-sided specification (Cp only).</returns>
    /// <exception cref="ArgumentOutOfRangeException">A value is infinite, or a limit is not finite or LSL ≥ USL.</exception>
    public static PercentileCapabilityResult Lognormal(ReadOnlySpan<double> values, SpecLimits spec)
    {
        spec.Validate(nameof(spec));
        var reasons = new Dictionary<string, string>(StringComparer.Ordinal);
        var logMoments = new RunningMoments();
        var nonPositive = 0;
        foreach (var v in values)
        {
            if (double.IsNaN(v))
            {
                continue;
            }

            if (double.IsInfinity(v))
            {
                throw new ArgumentOutOfRangeException(nameof(values), v, "Values must be finite (NaN marks a missing value).");
            }

            if (v <= 0)
            {
                nonPositive++;
                continue;
            }

            logMoments.Add(Math.Log(v));
        }

        var n = checked((int)logMoments.Count + nonPositive);
        string? fitReason = nonPositive > 0 ? $"{nonPositive} value(s) <= 0: the lognormal fit is undefined"
            : n < 2 ? "the lognormal fit needs at least 2 values"
            : null;
        if (fitReason is not null)
        {
            foreach (var key in new[] { "Mu", "Sigma", "Median", "LowerPercentile", "UpperPercentile" })
            {
                reasons[key] = fitReason;
            }

            AllIndices(reasons, fitReason);
            return new PercentileCapabilityResult(MethodLabel, n, null, null, null, null, null, null, null, null, null, reasons);
        }

        var mu = logMoments.Mean;
        var sigma = Math.Sqrt(logMoments.PopulationVariance);
        var median = Math.Exp(mu);
        var lowerP = Math.Exp(mu + (sigma * Normal.InvCDF(0.0, 1.0, LowerTailProbability)));
        var upperP = Math.Exp(mu + (sigma * Normal.InvCDF(0.0, 1.0, UpperTailProbability)));

        string? indexReason = spec.IsEmpty ? "no specification limit given"
            : !(upperP > median && median > lowerP) ? "the fitted sigma is zero (constant data): the indices would be infinite"
            : null;
        if (indexReason is not null)
        {
            AllIndices(reasons, indexReason);
            return new PercentileCapabilityResult(MethodLabel, n, mu, sigma, median, lowerP, upperP, null, null, null, null, reasons);
        }

        double? cp = spec.IsTwoSided ? (spec.Upper!.Value - spec.Lower!.Value) / (upperP - lowerP) : null;
        double? cpu = spec.Upper is { } usl ? (usl - median) / (upperP - median) : null;
        double? cpl = spec.Lower is { } lsl ? (median - lsl) / (median - lowerP) : null;
        double? cpk = cpu is { } u && cpl is { } l ? Math.Min(u, l) : cpu ?? cpl;
        if (cp is null)
        {
            reasons["CpPercentile"] = "one-sided specification: Cp needs both limits";
        }

        if (cpu is null)
        {
            reasons["CpuPercentile"] = "no upper specification limit";
        }

        if (cpl is null)
        {
            reasons["CplPercentile"] = "no lower specification limit";
        }

        return new PercentileCapabilityResult(MethodLabel, n, mu, sigma, median, lowerP, upperP, cp, cpu, cpl, cpk, reasons);
    }

    private static void AllIndices(Dictionary<string, string> reasons, string reason)
    {
        reasons["CpPercentile"] = reasons["CpuPercentile"] = reasons["CplPercentile"] = reasons["CpkPercentile"] = reason;
    }
}
