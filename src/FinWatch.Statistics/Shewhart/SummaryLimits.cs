using MathNet.Numerics;

namespace FinWatch.Statistics.Shewhart;

/// <summary>
/// Trial limits from stored subgroup summaries (mean, size, sample standard deviation) rather than raw values, by the
/// conventions of docs/statistics.md §2.1 and 2.3, so a live chart can recompute its limits from its plotted points alone.
/// </summary>
public static class SummaryLimits
{
    /// <summary>
    /// Xbar-S limits of docs/statistics.md §2.3 from summaries: centre x̿ = Σ nᵢ x̄ᵢ / Σ nᵢ and σ̂ = mean over the subgroups with
    /// nᵢ ≥ 2 of sᵢ/c4(nᵢ). Identical to <see cref="ShewhartCharts.Subgroups"/> with
    /// <see cref="ShewhartChartType.MeanStandardDeviation"/> on the raw values (tests).
    /// </summary>
    /// <param name="means">Subgroup means.</param>
    /// <param name="sizes">Subgroup sizes (≥ 1).</param>
    /// <param name="sds">Sample standard deviations (divisor n − 1); ignored where the size is 1.</param>
    /// <returns>The centre and σ̂ of one value; σ̂ is null without a subgroup of two or more.</returns>
    /// <exception cref="ArgumentException">The spans differ in length or are empty, or a size is below 1.</exception>
    public static (double Centre, double? Sigma) MeanStandardDeviation(ReadOnlySpan<double> means, ReadOnlySpan<int> sizes, ReadOnlySpan<double> sds)
    {
        if (means.Length == 0 || sizes.Length != means.Length || sds.Length != means.Length)
        {
            throw new ArgumentException("One mean, size and standard deviation per subgroup, at least one subgroup, are required.", nameof(means));
        }

        double weighted = 0, total = 0, sigmaSum = 0;
        var sigmaTerms = 0;
        for (var i = 0; i < means.Length; i++)
        {
            if (sizes[i] < 1)
            {
                throw new ArgumentException("Subgroup sizes must be at least 1.", nameof(sizes));
            }

            weighted += sizes[i] * means[i];
            total += sizes[i];
            if (sizes[i] >= 2)
            {
                sigmaSum += sds[i] / C4(sizes[i]);
                sigmaTerms++;
            }
        }

        return (weighted / total, sigmaTerms > 0 ? sigmaSum / sigmaTerms : null);
    }

    /// <summary>
    /// I-MR limits of docs/statistics.md §2.1: centre x̄ and σ̂ = MR̄/d2(2), d2(2) = 2/√π, over the moving ranges of consecutive values.
    /// </summary>
    /// <param name="values">The plotted values in order.</param>
    /// <returns>The centre and σ̂; σ̂ is null for fewer than two values.</returns>
    /// <exception cref="ArgumentException">The span is empty.</exception>
    public static (double Centre, double? Sigma) Individuals(ReadOnlySpan<double> values)
    {
        if (values.Length == 0)
        {
            throw new ArgumentException("At least one value is required.", nameof(values));
        }

        double sum = 0, mr = 0;
        for (var i = 0; i < values.Length; i++)
        {
            sum += values[i];
            if (i > 0)
            {
                mr += Math.Abs(values[i] - values[i - 1]);
            }
        }

        return (sum / values.Length, values.Length >= 2 ? mr / (values.Length - 1) / (2 / Math.Sqrt(Math.PI)) : null);
    }

    /// <summary>c4(n) = √(2/(n − 1))·Γ(n/2)/Γ((n − 1)/2) (docs/statistics.md §1.1), for any n ≥ 2.</summary>
    /// <param name="n">Subgroup size, ≥ 2.</param>
    /// <returns>c4.</returns>
    public static double C4(int n)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(n, 2);
        return Math.Sqrt(2.0 / (n - 1)) * Math.Exp(SpecialFunctions.GammaLn(n / 2.0) - SpecialFunctions.GammaLn((n - 1) / 2.0));
    }
}
