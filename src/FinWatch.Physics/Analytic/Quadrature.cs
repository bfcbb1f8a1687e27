namespace FinWatch.Physics.Analytic;

/// <summary>
/// Fixed-order numerical quadrature: composite 5-point Gauss–Legendre (exact for polynomials of degree ≤ 9 on
/// each panel; nodes and weights from Abramowitz &amp; Stegun, table 25.4).
/// </summary>
public static class Quadrature
{
    private static readonly double[] Nodes = [0.0, -0.5384693101056831, 0.5384693101056831, -0.9061798459386640, 0.9061798459386640];
    private static readonly double[] Weights = [0.5688888888888889, 0.4786286704993665, 0.4786286704993665, 0.2369268850561891, 0.2369268850561891];

    /// <summary>∫ f(x) dx over [<paramref name="a"/>, <paramref name="b"/>] with <paramref name="panels"/> equal Gauss–Legendre panels.</summary>
    /// <param name="f">Integrand; smooth on the interval for the stated accuracy.</param>
    /// <param name="a">Lower limit (any finite value; b &lt; a gives the negated integral).</param>
    /// <param name="b">Upper limit; finite.</param>
    /// <param name="panels">Number of panels (&gt; 0).</param>
    /// <returns>The integral estimate in the units of f·x.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A limit is non-finite or <paramref name="panels"/> ≤ 0.</exception>
    public static double GaussLegendre(Func<double, double> f, double a, double b, int panels)
    {
        ArgumentNullException.ThrowIfNull(f);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(panels);
        if (!double.IsFinite(a) || !double.IsFinite(b))
        {
            throw new ArgumentOutOfRangeException(nameof(a), "Limits must be finite.");
        }

        double h = (b - a) / panels, sum = 0;
        for (int p = 0; p < panels; p++)
        {
            double mid = a + ((p + 0.5) * h);
            for (int i = 0; i < Nodes.Length; i++)
            {
                sum += Weights[i] * f(mid + (0.5 * h * Nodes[i]));
            }
        }

        return 0.5 * h * sum;
    }
}
