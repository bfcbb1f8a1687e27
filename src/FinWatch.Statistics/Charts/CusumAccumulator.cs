namespace FinWatch.Statistics.Charts;

/// <summary>
/// Incremental two-sided tabular CUSUM (Page 1954; tabular form as in Montgomery §9.1 and NIST §6.3.2.3;
/// docs/statistics.md §4.2): C⁺_i = max(0, C⁺_{i−1} + x_i − (μ0 + K)), C⁻_i = max(0, C⁻_{i−1} + (μ0 − K) − x_i),
/// signal when a sum is strictly greater than H.
/// </summary>
/// <remarks>
/// <para>The sums are not reset after a signal (as in the published tables); restarting after an acknowledged
/// signal is an application decision (create a new accumulator).</para>
/// <para>An optional head start (fast initial response, Lucas &amp; Crosier 1982) sets C⁺_0 = C⁻_0 to it; the
/// counts N⁺, N⁻ still start at 0, so they count only periods after the start.</para>
/// <para>Missing values (NaN) are skipped: the sums and counts carry over (docs/statistics.md §4.1/§4.2 [conv]).
/// Each <see cref="Append"/> is O(1).</para>
/// </remarks>
public sealed class CusumAccumulator
{
    private readonly double upperReference;
    private readonly double lowerReference;

    /// <summary>Starts a two-sided CUSUM.</summary>
    /// <param name="k">Reference value (allowance) k ≥ 0, in the units given by <paramref name="units"/>
    /// (typically 0.5 sigma, half the shift to detect).</param>
    /// <param name="h">Decision interval h &gt; 0, same units (typically 4 or 5 sigma).</param>
    /// <param name="target">Target μ0, data units; finite.</param>
    /// <param name="sigma">Standard deviation σ of the plotted statistic, data units, σ &gt; 0; used only when
    /// <paramref name="units"/> is <see cref="CusumUnits.Sigma"/> (ignored, and not validated, for
    /// <see cref="CusumUnits.Data"/>). σ = 0 (constant data) is a data condition the caller handles; passed with
    /// sigma units it throws.</param>
    /// <param name="units">Whether k, h and the head start are sigma multiples or data units.</param>
    /// <param name="headStart">Initial value of both sums, 0 ≤ headStart ≤ h, in the same units as h
    /// (Lucas &amp; Crosier suggest h/2); 0 is the ordinary CUSUM.</param>
    /// <exception cref="ArgumentOutOfRangeException">A parameter is outside its valid range or not finite.</exception>
    public CusumAccumulator(double k, double h, double target, double sigma, CusumUnits units, double headStart = 0)
    {
        if (!(k >= 0) || !double.IsFinite(k))
        {
            throw new ArgumentOutOfRangeException(nameof(k), k, "k must be non-negative and finite.");
        }

        if (!(h > 0) || !double.IsFinite(h))
        {
            throw new ArgumentOutOfRangeException(nameof(h), h, "h must be positive and finite.");
        }

        if (!double.IsFinite(target))
        {
            throw new ArgumentOutOfRangeException(nameof(target), target, "The target must be finite.");
        }

        if (!(headStart >= 0 && headStart <= h))
        {
            throw new ArgumentOutOfRangeException(nameof(headStart), headStart, "The head start must satisfy 0 ≤ headStart ≤ h.");
        }

        double scale;
        switch (units)
        {
            case CusumUnits.Sigma:
                if (!(sigma > 0) || !double.IsFinite(sigma))
                {
                    throw new ArgumentOutOfRangeException(nameof(sigma), sigma, "σ must be positive and finite with sigma units; σ = 0 is a data condition for the caller.");
                }

                scale = sigma;
                break;
            case CusumUnits.Data:
                scale = 1;
                break;
            default:
                throw new ArgumentOutOfRangeException(nameof(units), units, "Unknown CUSUM units.");
        }

        Target = target;
        K = k * scale;
        H = h * scale;
        CPlus = headStart * scale;
        CMinus = CPlus;
        upperReference = target + K;
        lowerReference = target - K;
    }

    /// <summary>Target μ0, data units.</summary>
    public double Target { get; }

    /// <summary>Reference value K in data units.</summary>
    public double K { get; }

    /// <summary>Decision interval H in data units.</summary>
    public double H { get; }

    /// <summary>Current upper sum C⁺ (data units); the head start before any point.</summary>
    public double CPlus { get; private set; }

    /// <summary>Current lower sum C⁻ (data units); the head start before any point.</summary>
    public double CMinus { get; private set; }

    /// <summary>Current count N⁺ of consecutive non-missing periods with C⁺ &gt; 0.</summary>
    public int NPlus { get; private set; }

    /// <summary>Current count N⁻ of consecutive non-missing periods with C⁻ &gt; 0.</summary>
    public int NMinus { get; private set; }

    /// <summary>Number of non-missing values appended so far.</summary>
    public long Count { get; private set; }

    /// <summary>Appends one observation and returns the period's sums, counts and signals.</summary>
    /// <param name="x">Observation (or subgroup mean), data units; NaN marks a missing value, which is skipped and
    /// returns NaN sums, counts of −1 and no signal.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="x"/> is infinite.</exception>
    public CusumPoint Append(double x)
    {
        if (double.IsNaN(x))
        {
            return new CusumPoint(double.NaN, double.NaN, -1, -1, false, false, double.NaN, double.NaN);
        }

        if (double.IsInfinity(x))
        {
            throw new ArgumentOutOfRangeException(nameof(x), x, "Observations must be finite (NaN marks a missing value).");
        }

        Count++;
        CPlus = Math.Max(0, CPlus + (x - upperReference));
        CMinus = Math.Max(0, CMinus + (lowerReference - x));
        NPlus = CPlus > 0 ? NPlus + 1 : 0;
        NMinus = CMinus > 0 ? NMinus + 1 : 0;

        var signalUpper = CPlus > H;
        var signalLower = CMinus > H;

        // Montgomery eq. 9.4: the mean after the shift is estimated from the sum accumulated since it last left 0.
        var newMeanUpper = signalUpper ? upperReference + (CPlus / NPlus) : double.NaN;
        var newMeanLower = signalLower ? lowerReference - (CMinus / NMinus) : double.NaN;
        return new CusumPoint(CPlus, CMinus, NPlus, NMinus, signalUpper, signalLower, newMeanUpper, newMeanLower);
    }
}
