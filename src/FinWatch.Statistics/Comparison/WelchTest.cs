using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Comparison;

/// <summary>
/// Welch's two-sample t-test for a difference of means without assuming equal variances (docs/statistics.md §4.5).
/// </summary>
/// <remarks>
/// t = (x̄₂ − x̄₁)/√(s₁²/n₁ + s₂²/n₂), with sample variances (divisor n − 1), compared with Student's t on the
/// Welch–Satterthwaite degrees of freedom ν = (s₁²/n₁ + s₂²/n₂)² / [(s₁²/n₁)²/(n₁ − 1) + (s₂²/n₂)²/(n₂ − 1)]
/// (Welch 1947, Biometrika 34, 28–35; Satterthwaite 1946, Biometrics Bulletin 2, 110–114); ν is not rounded. Means and
/// variances come from <see cref="RunningMoments"/> (§2.6), so no sum of squares minus square of sum is formed.
/// </remarks>
public static class WelchTest
{
    /// <summary>Compares the means of two independent samples.</summary>
    /// <param name="first">The first sample (for example the points before a maintenance), data units; NaN marks a
    /// missing value and is skipped.</param>
    /// <param name="second">The second sample (the points after it), same units.</param>
    /// <returns>
    /// The test of the second mean against the first. With fewer than two values in either sample the variances that
    /// cannot be formed, the standard error, t, ν and p are NaN (the means are still given where they exist). Two
    /// samples without spread give t = ±∞ and p = 0 when their means differ, and NaN when they are equal.
    /// </returns>
    /// <exception cref="ArgumentOutOfRangeException">A value is infinite.</exception>
    public static WelchTestResult Compare(ReadOnlySpan<double> first, ReadOnlySpan<double> second)
    {
        var a = Moments(first, nameof(first));
        var b = Moments(second, nameof(second));
        int n1 = (int)a.Count, n2 = (int)b.Count;
        double v1 = a.SampleVariance, v2 = b.SampleVariance;
        var difference = b.Mean - a.Mean;
        if (n1 < 2 || n2 < 2)
        {
            return new(n1, n2, a.Mean, b.Mean, v1, v2, difference, double.NaN, double.NaN, double.NaN, double.NaN);
        }

        double w1 = v1 / n1, w2 = v2 / n2;
        var se = Math.Sqrt(w1 + w2);
        if (se == 0)
        {
            return difference == 0
                ? new(n1, n2, a.Mean, b.Mean, v1, v2, difference, 0, double.NaN, double.NaN, double.NaN)
                : new(n1, n2, a.Mean, b.Mean, v1, v2, difference, 0, difference > 0 ? double.PositiveInfinity : double.NegativeInfinity, double.NaN, 0);
        }

        var t = difference / se;
        var nu = (w1 + w2) * (w1 + w2) / ((w1 * w1 / (n1 - 1)) + (w2 * w2 / (n2 - 1)));
        var p = Math.Min(1.0, 2.0 * StudentT.CDF(0.0, 1.0, nu, -Math.Abs(t)));
        return new(n1, n2, a.Mean, b.Mean, v1, v2, difference, se, t, nu, p);
    }

    private static RunningMoments Moments(ReadOnlySpan<double> values, string name)
    {
        var m = new RunningMoments();
        foreach (var v in values)
        {
            if (double.IsInfinity(v))
            {
                throw new ArgumentOutOfRangeException(name, v, "Values must be finite or NaN (missing).");
            }

            if (!double.IsNaN(v))
            {
                m.Add(v);
            }
        }

        return m;
    }
}
