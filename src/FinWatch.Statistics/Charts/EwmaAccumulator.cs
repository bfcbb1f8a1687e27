namespace FinWatch.Statistics.Charts;

/// <summary>
/// Incremental EWMA chart (Roberts 1959; limits as in Lucas &amp; Saccucci 1990 and docs/statistics.md §4.1):
/// z_0 = target, z_i = λ·x_i + (1 − λ)·z_{i−1}, with the exact limits
/// target ± L·σ·√(λ/(2 − λ)·[1 − (1 − λ)^{2i}]) and a signal when z_i is strictly outside them.
/// </summary>
/// <remarks>
/// <para>σ is the standard deviation of the plotted statistic (σ/√n for subgroup means), known or estimated
/// by the caller; the accumulator does not estimate it. Each <see cref="Append"/> is O(1).</para>
/// <para>Missing values (NaN) are skipped (docs/statistics.md §4.1 [conv]): z carries over unchanged and the index i
/// counts non-missing points only, so the limits of the next point are those of the next non-missing index.</para>
/// </remarks>
public sealed class EwmaAccumulator
{
    private readonly double halfWidthFactor;
    private readonly double decaySquared;

    /// <summary>Starts a chart at z_0 = <paramref name="target"/>.</summary>
    /// <param name="lambda">Smoothing weight λ, 0 &lt; λ ≤ 1 (λ = 1 is the individuals/Shewhart chart).</param>
    /// <param name="L">Limit width L in sigma units of z's asymptotic standard deviation, L &gt; 0 (typically 2.7–3).</param>
    /// <param name="target">Target (centre line) μ0 and starting value z_0, in data units; finite.</param>
    /// <param name="sigma">Standard deviation σ of the plotted statistic, in data units, σ &gt; 0 and finite.
    /// σ = 0 (constant data) is a data condition: the chart is not evaluable and the caller must detect it
    /// before constructing the chart; passing it is treated as a caller mistake and throws.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside its valid range or not finite.</exception>
    public EwmaAccumulator(double lambda, double L, double target, double sigma)
    {
        if (!(lambda > 0 && lambda <= 1))
        {
            throw new ArgumentOutOfRangeException(nameof(lambda), lambda, "λ must satisfy 0 < λ ≤ 1.");
        }

        if (!(L > 0) || !double.IsFinite(L))
        {
            throw new ArgumentOutOfRangeException(nameof(L), L, "L must be positive and finite.");
        }

        if (!double.IsFinite(target))
        {
            throw new ArgumentOutOfRangeException(nameof(target), target, "The target must be finite.");
        }

        if (!(sigma > 0) || !double.IsFinite(sigma))
        {
            throw new ArgumentOutOfRangeException(nameof(sigma), sigma, "σ must be positive and finite; σ = 0 is a data condition for the caller.");
        }

        Lambda = lambda;
        this.L = L;
        Target = target;
        Sigma = sigma;
        Z = target;
        halfWidthFactor = L * sigma * Math.Sqrt(lambda / (2 - lambda));
        decaySquared = (1 - lambda) * (1 - lambda);
        AsymptoticUcl = target + halfWidthFactor;
        AsymptoticLcl = target - halfWidthFactor;
    }

    /// <summary>Smoothing weight λ.</summary>
    public double Lambda { get; }

    /// <summary>Limit width L (sigma units).</summary>
    public double L { get; }

    /// <summary>Target μ0 (data units).</summary>
    public double Target { get; }

    /// <summary>Standard deviation σ of the plotted statistic (data units).</summary>
    public double Sigma { get; }

    /// <summary>Number of non-missing points appended so far (the index i of the last one).</summary>
    public long Count { get; private set; }

    /// <summary>Current EWMA z_i (z_0 = target before any non-missing point).</summary>
    public double Z { get; private set; }

    /// <summary>Asymptotic upper limit target + L·σ·√(λ/(2 − λ)), the limit the exact ones approach as i → ∞.</summary>
    public double AsymptoticUcl { get; }

    /// <summary>Asymptotic lower limit target − L·σ·√(λ/(2 − λ)).</summary>
    public double AsymptoticLcl { get; }

    /// <summary>Appends one observation and returns the plotted point.</summary>
    /// <param name="x">The observation (or subgroup mean) in data units; NaN marks a missing value, which is
    /// skipped and returns a point with NaN statistic and limits and no signal.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="x"/> is infinite.</exception>
    public EwmaPoint Append(double x)
    {
        if (double.IsNaN(x))
        {
            return new EwmaPoint(double.NaN, double.NaN, double.NaN, false);
        }

        if (double.IsInfinity(x))
        {
            throw new ArgumentOutOfRangeException(nameof(x), x, "Observations must be finite (NaN marks a missing value).");
        }

        Count++;
        Z = (Lambda * x) + ((1 - Lambda) * Z);

        // (1 − λ)^{2i} by Math.Pow rather than a running product, so that point i does not depend on rounding
        // accumulated over the earlier points.
        var halfWidth = halfWidthFactor * Math.Sqrt(1 - Math.Pow(decaySquared, Count));
        var ucl = Target + halfWidth;
        var lcl = Target - halfWidth;
        return new EwmaPoint(Z, ucl, lcl, Z > ucl || Z < lcl);
    }
}
