using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace FinWatch.Statistics.RunLength;

/// <summary>
/// Nyström solution of Crowder's (1987) integral equation for the ARL of an EWMA chart with asymptotic limits
/// ±h, h = L·√(λ/(2 − λ)), on standardised data x_i ~ N(δ, 1), started at z_0 = u:
/// ARL(u) = 1 + (1/λ)·∫_{−h}^{h} ARL(v)·φ((v − (1 − λ)u)/λ − δ) dv.
/// </summary>
internal static class EwmaRunLength
{
    /// <summary>Gauss–Legendre order per panel; panels are at most 2λ wide (the kernel's standard deviation is λ).</summary>
    internal const int DefaultOrder = 10;

    /// <summary>Cap on the panels (300 nodes) so that one call stays within about 10 ms.</summary>
    internal const int MaxPanels = 30;

    public static double FromTarget(double lambda, double l, double shift)
    {
        var h = l * Math.Sqrt(lambda / (2 - lambda));
        return FromTarget(lambda, l, shift, PanelsFor(h, lambda), DefaultOrder);
    }

    internal static int PanelsFor(double h, double lambda) => Math.Clamp((int)Math.Ceiling(h / lambda), 2, MaxPanels);

    internal static double FromTarget(double lambda, double l, double shift, int panels, int order)
    {
        var h = l * Math.Sqrt(lambda / (2 - lambda));
        var (nodes, weights) = NystromQuadrature.Composite(-h, h, panels, order);
        var n = nodes.Length;
        var matrix = Matrix<double>.Build.Dense(n, n);
        for (var r = 0; r < n; r++)
        {
            var centre = (1 - lambda) * nodes[r];
            for (var c = 0; c < n; c++)
            {
                matrix[r, c] = -weights[c] / lambda * Normal.PDF(0, 1, ((nodes[c] - centre) / lambda) - shift);
            }

            matrix[r, r] += 1;
        }

        var arl = matrix.Solve(Vector<double>.Build.Dense(n, 1.0));

        // Nyström interpolation at the start u = 0 (the target).
        var result = 1.0;
        for (var c = 0; c < n; c++)
        {
            result += weights[c] / lambda * Normal.PDF(0, 1, (nodes[c] / lambda) - shift) * arl[c];
        }

        return RunLengthGuard.Checked(result);
    }
}
