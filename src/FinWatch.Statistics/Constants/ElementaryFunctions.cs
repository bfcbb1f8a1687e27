using MathNet.Numerics;

namespace FinWatch.Statistics.Constants;

/// <summary>
/// Accurate elementary and normal-distribution functions that the BCL lacks or computes naively
/// (<c>double.ExpM1</c> and <c>double.LogP1</c> are <c>Exp(x) − 1</c> and <c>Log(1 + x)</c> in .NET 10).
/// Shared by the Constants, Capability and Forecast areas.
/// </summary>
internal static class ElementaryFunctions
{
    private const double InvSqrt2 = 0.70710678118654752440;

    /// <summary>log(1 + x) without cancellation for small x (Goldberg 1991, "What every computer
    /// scientist should know about floating-point arithmetic", Theorem 4).</summary>
    public static double Log1P(double x)
    {
        var u = 1.0 + x;
        if (u == 1.0)
        {
            return x;
        }

        return Math.Log(u) * x / (u - 1.0);
    }

    /// <summary>exp(x) − 1 without cancellation for small x (Kahan's trick, as in Goldberg 1991).</summary>
    public static double ExpM1(double x)
    {
        var u = Math.Exp(x);
        if (u == 1.0)
        {
            return x;
        }

        var um1 = u - 1.0;
        if (um1 == -1.0)
        {
            return -1.0;
        }

        return um1 * x / Math.Log(u);
    }

    /// <summary>Upper tail Q(x) = 1 − Φ(x) = Φ(−x) of the standard normal, accurate in relative terms
    /// for large x (through erfc).</summary>
    public static double NormalUpperTail(double x) => 0.5 * SpecialFunctions.Erfc(x * InvSqrt2);

    /// <summary>Φ(x), the standard normal distribution function.</summary>
    public static double NormalCdf(double x) => 0.5 * SpecialFunctions.Erfc(-x * InvSqrt2);

    /// <summary>
    /// log Φ(x), finite for every finite x: through erfc where Φ(x) does not underflow, and the asymptotic
    /// (Mills ratio) series log φ(x) − log(−x) + log(1 − 1/x² + 3/x⁴ − 15/x⁶ + 105/x⁸) for x &lt; −30,
    /// where the neglected term is below 1e-11 relative.
    /// </summary>
    public static double LogNormalCdf(double x)
    {
        if (x > 0)
        {
            return Log1P(-NormalUpperTail(x));
        }

        if (x >= -30)
        {
            return Math.Log(NormalCdf(x));
        }

        var r = 1.0 / (x * x);
        var series = 1.0 - (r * (1.0 - (r * (3.0 - (r * (15.0 - (105.0 * r)))))));
        return (-0.5 * x * x) - (0.5 * Math.Log(2.0 * Math.PI)) - Math.Log(-x) + Math.Log(series);
    }
}
