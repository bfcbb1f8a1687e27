namespace FinWatch.Statistics.Charts;

/// <summary>Batch two-sided tabular CUSUM (docs/statistics.md §4.2), built point by point on <see cref="CusumAccumulator"/>.</summary>
public static class Cusum
{
    /// <summary>
    /// Computes C⁺_i = max(0, C⁺_{i−1} + x_i − (μ0 + K)) and C⁻_i = max(0, C⁻_{i−1} + (μ0 − K) − x_i), the run
    /// counts N⁺, N⁻, the rows where a sum is strictly greater than H, and the new-mean estimates at those rows.
    /// Identical, value for value, to appending the values to a <see cref="CusumAccumulator"/>.
    /// </summary>
    /// <param name="values">Observations (or subgroup means), data units; NaN marks a missing value (skipped, the sums
    /// carry over). An empty or all-missing series gives arrays of its length with no statistic and no signals.</param>
    /// <param name="k">Reference value k ≥ 0 (sigma multiples or data units, per <paramref name="units"/>).</param>
    /// <param name="h">Decision interval h &gt; 0, same units as k.</param>
    /// <param name="target">Target μ0, data units.</param>
    /// <param name="sigma">σ &gt; 0 of the plotted statistic, data units; used only with <see cref="CusumUnits.Sigma"/>.</param>
    /// <param name="units">Units of k, h and the head start.</param>
    /// <param name="headStart">Fast-initial-response head start, 0 ≤ headStart ≤ h, same units as h.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is out of range, or a value is infinite.</exception>
    public static CusumResult Compute(
        ReadOnlySpan<double> values,
        double k,
        double h,
        double target,
        double sigma,
        CusumUnits units,
        double headStart = 0)
    {
        var accumulator = new CusumAccumulator(k, h, target, sigma, units, headStart);
        var n = values.Length;
        var cPlus = new double[n];
        var cMinus = new double[n];
        var nPlus = new int[n];
        var nMinus = new int[n];
        var newMeanUpper = new double[n];
        var newMeanLower = new double[n];
        var signalsUpper = new List<int>();
        var signalsLower = new List<int>();
        for (var i = 0; i < n; i++)
        {
            var point = accumulator.Append(values[i]);
            cPlus[i] = point.CPlus;
            cMinus[i] = point.CMinus;
            nPlus[i] = point.NPlus;
            nMinus[i] = point.NMinus;
            newMeanUpper[i] = point.NewMeanUpper;
            newMeanLower[i] = point.NewMeanLower;
            if (point.SignalUpper)
            {
                signalsUpper.Add(i);
            }

            if (point.SignalLower)
            {
                signalsLower.Add(i);
            }
        }

        return new CusumResult(
            cPlus,
            cMinus,
            nPlus,
            nMinus,
            [.. signalsUpper],
            [.. signalsLower],
            newMeanUpper,
            newMeanLower,
            accumulator.K,
            accumulator.H);
    }
}
