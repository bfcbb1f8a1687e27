using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Stability;

/// <summary>
/// The Mann–Kendall test for a monotonic trend in a series taken in time order (Mann 1945, Econometrica 13:245–259;
/// Kendall, Rank Correlation Methods, 4th ed. 1975): S = Σ_{i&lt;j} sgn(x_j − x_i), its variance under "no trend"
/// Var S = [n(n−1)(2n+5) − Σ_t t(t−1)(2t+5)] / 18 (t: the size of each group of tied values), and the continuity-corrected
/// normal score Z = (S − sgn S) / √Var S with a two-sided p-value. Distribution-free: it needs neither normality nor a
/// linear trend, which suits a baseline whose shape is unknown. Missing values (NaN) are left out.
/// </summary>
public static class MannKendall
{
    /// <summary>Below this many values the normal approximation is not used (common practice: n ≥ 10).</summary>
    public const int MinimumSize = 10;

    public static TrendResult Test(ReadOnlySpan<double> series)
    {
        var x = new List<double>(series.Length);
        foreach (var v in series)
        {
            if (!double.IsNaN(v))
            {
                x.Add(v);
            }
        }

        var n = x.Count;
        long s = 0;
        for (var i = 0; i < n - 1; i++)
        {
            var xi = x[i];
            for (var j = i + 1; j < n; j++)
            {
                s += Math.Sign(x[j] - xi);
            }
        }

        var variance = Variance(x);
        if (n < MinimumSize || !(variance > 0))
        {
            return new TrendResult(n, s, variance, double.NaN, double.NaN, Pairs(n) == 0 ? double.NaN : s / Pairs(n));
        }

        var z = (s - Math.Sign(s)) / Math.Sqrt(variance);
        var p = 2 * Normal.CDF(0, 1, -Math.Abs(z));
        return new TrendResult(n, s, variance, z, p, s / Pairs(n));
    }

    /// <summary>Var S under the null hypothesis, with the correction for ties.</summary>
    public static double Variance(IReadOnlyCollection<double> values)
    {
        double n = values.Count;
        var ties = values.GroupBy(v => v).Select(g => (double)g.Count()).Where(t => t > 1).Sum(t => t * (t - 1) * ((2 * t) + 5));
        return ((n * (n - 1) * ((2 * n) + 5)) - ties) / 18;
    }

    private static double Pairs(int n) => n * (n - 1) / 2.0;
}

/// <summary>
/// A Mann–Kendall result: the number of values, S, Var S, the normal score Z and the two-sided p-value (NaN below
/// <see cref="MannKendall.MinimumSize"/> values or when every value is tied), and Kendall's τ = S / (n(n−1)/2) against time.
/// </summary>
public readonly record struct TrendResult(int N, long S, double VarianceS, double Z, double PValue, double Tau)
{
    /// <summary>"rising", "falling" or "none" at the given significance level.</summary>
    public string Direction(double alpha) => !(PValue < alpha) ? "none" : S > 0 ? "rising" : "falling";
}
