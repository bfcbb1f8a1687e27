namespace FinWatch.Statistics;

/// <summary>
/// Single-pass mean and variance accumulator (Welford, Technometrics 4(3) 419, 1962), with the pairwise
/// combination of Chan, Golub and LeVeque (The American Statistician 37(3) 242, 1983) for partitioned data.
/// Never forms the sum of squares minus the square of the sum.
/// </summary>
public struct RunningMoments
{
    private double mean;
    private double m2;

    /// <summary>Number of finite values added.</summary>
    public long Count { readonly get; private set; }

    /// <summary>Arithmetic mean; <see cref="double.NaN"/> when empty.</summary>
    public readonly double Mean => Count == 0 ? double.NaN : mean;

    /// <summary>Sample variance with Bessel's correction (divisor n − 1); <see cref="double.NaN"/> for fewer than two values.</summary>
    public readonly double SampleVariance => Count < 2 ? double.NaN : m2 / (Count - 1);

    /// <summary>Population variance (divisor n); <see cref="double.NaN"/> when empty.</summary>
    public readonly double PopulationVariance => Count == 0 ? double.NaN : m2 / Count;

    /// <summary>Sample standard deviation, √<see cref="SampleVariance"/>.</summary>
    public readonly double SampleStandardDeviation => Math.Sqrt(SampleVariance);

    /// <summary>Adds one value. Non-finite values are a caller mistake.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is NaN or infinite.</exception>
    public void Add(double value)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "Only finite values can be accumulated.");
        }

        Count++;
        var delta = value - mean;
        mean += delta / Count;
        m2 += delta * (value - mean);
    }

    /// <summary>Adds every value of the span.</summary>
    public void AddRange(ReadOnlySpan<double> values)
    {
        foreach (var v in values)
        {
            Add(v);
        }
    }

    /// <summary>The moments of the union of two disjoint samples.</summary>
    public static RunningMoments Combine(in RunningMoments a, in RunningMoments b)
    {
        if (a.Count == 0)
        {
            return b;
        }

        if (b.Count == 0)
        {
            return a;
        }

        var n = a.Count + b.Count;
        var delta = b.mean - a.mean;
        return new RunningMoments
        {
            Count = n,
            mean = a.mean + (delta * b.Count / n),
            m2 = a.m2 + b.m2 + (delta * delta * a.Count * b.Count / n),
        };
    }
}
