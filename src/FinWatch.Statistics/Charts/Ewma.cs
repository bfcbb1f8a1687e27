namespace FinWatch.Statistics.Charts;

/// <summary>Batch EWMA chart (docs/statistics.md §4.1), built point by point on <see cref="EwmaAccumulator"/>.</summary>
public static class Ewma
{
    /// <summary>
    /// Computes z_i = λ·x_i + (1 − λ)·z_{i−1} from z_0 = <paramref name="target"/>, the exact limits
    /// target ± L·σ·√(λ/(2 − λ)·[1 − (1 − λ)^{2i}]), the asymptotic limits, and the rows where z is strictly outside
    /// the exact limits. Identical, value for value, to appending the values to an <see cref="EwmaAccumulator"/>.
    /// </summary>
    /// <param name="values">Observations (or subgroup means) in data units; NaN marks a missing value (skipped:
    /// z carries over, i counts non-missing points, the row's outputs are NaN). An empty or all-missing series gives
    /// all-NaN arrays of its length and no signals.</param>
    /// <param name="lambda">Smoothing weight λ, 0 &lt; λ ≤ 1.</param>
    /// <param name="L">Limit width L &gt; 0 in sigma units of the EWMA.</param>
    /// <param name="target">Target μ0 = z_0, data units.</param>
    /// <param name="sigma">Standard deviation σ &gt; 0 of the plotted statistic, data units. A zero estimate (constant
    /// data) is a data condition the caller reports as "not evaluable" instead of calling this method.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of range, or a value is infinite.</exception>
    public static EwmaResult Compute(ReadOnlySpan<double> values, double lambda, double L, double target, double sigma)
    {
        var accumulator = new EwmaAccumulator(lambda, L, target, sigma);
        var z = new double[values.Length];
        var ucl = new double[values.Length];
        var lcl = new double[values.Length];
        var signals = new List<int>();
        for (var i = 0; i < values.Length; i++)
        {
            var point = accumulator.Append(values[i]);
            z[i] = point.Z;
            ucl[i] = point.Ucl;
            lcl[i] = point.Lcl;
            if (point.Signal)
            {
                signals.Add(i);
            }
        }

        return new EwmaResult(z, ucl, lcl, [.. signals], accumulator.AsymptoticUcl, accumulator.AsymptoticLcl);
    }
}
