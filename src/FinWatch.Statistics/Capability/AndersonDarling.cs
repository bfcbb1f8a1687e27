using FinWatch.Statistics.Constants;

namespace FinWatch.Statistics.Capability;

/// <summary>
/// Anderson–Darling test of normality, mean and variance estimated from the data ("case 3"), docs/statistics.md §6.
/// Anderson and Darling (1952, 1954); Stephens (1974); D'Agostino and Stephens (1986), Table 4.9.
/// </summary>
public static class AndersonDarling
{
    /// <summary>Below this sample size the result carries a note that the p-value approximation is
    /// stated for n ≥ 8.</summary>
    public const int MinimumSizeForStatedApproximation = 8;

    /// <summary>
    /// Tests the values for normality. With z_(i) = (x_(i) − x̄)/s (s the sample standard deviation,
    /// divisor n − 1) and F_i = Φ(z_(i)) on the sorted values:
    /// A² = −n − (1/n)·Σ (2i − 1)·[ln F_i + ln(1 − F_{n+1−i})]; A* = A²·(1 + 0.75/n + 2.25/n²); p from
    /// the four-branch formula of docs/statistics.md §6, clipped to [0, 1] (and held at its minimum beyond A* ≈ 153.5,
    /// where the last branch would turn upward).
    /// </summary>
    /// <param name="values">The data; NaN marks a missing value and is skipped. The input is not modified.</param>
    /// <returns>The statistics, or null statistics with a reason for n &lt; 3 or s = 0; a note for n &lt; 8.
    /// ln(1 − F) is evaluated as ln Φ(−z), so that no term is lost to rounding near F = 1.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A value is infinite.</exception>
    public static NormalityResult Test(ReadOnlySpan<double> values)
    {
        var sorted = new List<double>(values.Length);
        var moments = new RunningMoments();
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

            sorted.Add(v);
            moments.Add(v);
        }

        var n = sorted.Count;
        if (n < 3)
        {
            return new NormalityResult(n, null, null, null, null, "the Anderson-Darling test needs at least 3 values");
        }

        var s = moments.SampleStandardDeviation;
        if (!(s > 0))
        {
            return new NormalityResult(n, null, null, null, null, "the standard deviation is zero (constant data): the test is undefined");
        }

        sorted.Sort();
        var mean = moments.Mean;
        var logF = new double[n];
        var logOneMinusF = new double[n];
        for (var i = 0; i < n; i++)
        {
            var z = (sorted[i] - mean) / s;
            logF[i] = ElementaryFunctions.LogNormalCdf(z);
            logOneMinusF[i] = ElementaryFunctions.LogNormalCdf(-z);
        }

        var sum = 0.0;
        for (var i = 1; i <= n; i++)
        {
            sum += ((2.0 * i) - 1.0) * (logF[i - 1] + logOneMinusF[n - i]);
        }

        var a2 = -n - (sum / n);
        var aStar = a2 * (1.0 + (0.75 / n) + (2.25 / ((double)n * n)));
        var p = Math.Clamp(PValue(aStar), 0.0, 1.0);
        var note = n < MinimumSizeForStatedApproximation
            ? $"n = {n}: the p-value approximation is stated for n >= {MinimumSizeForStatedApproximation}; treat it as rough"
            : null;
        return new NormalityResult(n, a2, aStar, p, note, null);
    }

    /// <summary>A* at which the quadratic of the last branch turns upward, 5.709/(2·0.0186) ≈ 153.47.</summary>
    internal const double LastBranchTurningPoint = 5.709 / (2.0 * 0.0186);

    /// <summary>The p-value approximation of docs/statistics.md §6 (D'Agostino and Stephens 1986, Table 4.9, case 3),
    /// not clipped.</summary>
    /// <remarks>
    /// FinWatch convention (docs/statistics.md): the last branch exp(1.2937 − 5.709·A* + 0.0186·A*²) has its
    /// minimum at A* ≈ 153.5 and read literally rises again, passing 1 at A* ≈ 307, so clipping alone would
    /// call grossly non-normal data (large n, strong skew) "p = 1". Beyond the turning point p is held at
    /// the minimum, exp(−436.8) ≈ 1e-190, which keeps p non-increasing in A*. Up to A* ≈ 153 this is the
    /// published formula exactly, and beyond it both are below 1e-189 until the literal formula turns up.
    /// </remarks>
    internal static double PValue(double aStar) => aStar switch
    {
        < 0.2 => 1.0 - Math.Exp(-13.436 + (101.14 * aStar) - (223.73 * aStar * aStar)),
        < 0.34 => 1.0 - Math.Exp(-8.318 + (42.796 * aStar) - (59.938 * aStar * aStar)),
        < 0.6 => Math.Exp(0.9177 - (4.279 * aStar) - (1.38 * aStar * aStar)),
        _ => LastBranch(Math.Min(aStar, LastBranchTurningPoint)),
    };

    private static double LastBranch(double aStar) => Math.Exp(1.2937 - (5.709 * aStar) + (0.0186 * aStar * aStar));
}
