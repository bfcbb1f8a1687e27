using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace FinWatch.Statistics.RunLength;

/// <summary>
/// Nyström solution of Page's (1954) integral equation for the ARL of the one-sided upper CUSUM
/// S_i = max(0, S_{i−1} + x_i − k), signal when S_i &gt; h, x_i ~ N(δ, 1):
/// ARL(u) = 1 + ARL(0)·Φ(k − u − δ) + ∫_0^h ARL(v)·φ(v − u + k − δ) dv.
/// The atom at 0 (all the probability of S falling to 0) is the separate unknown ARL(0).
/// </summary>
internal static class CusumRunLength
{
    /// <summary>Gauss–Legendre order per panel; panels are at most one sigma wide (the kernel's standard deviation).</summary>
    internal const int DefaultOrder = 12;

    public static double UpperOneSided(double k, double h, double shift, double headStart) =>
        UpperOneSided(k, h, shift, headStart, PanelsFor(h), DefaultOrder);

    internal static int PanelsFor(double h) => Math.Max(2, (int)Math.Ceiling(h));

    internal static double UpperOneSided(double k, double h, double shift, double headStart, int panels, int order)
    {
        var (nodes, weights) = NystromQuadrature.Composite(0, h, panels, order);
        var n = nodes.Length;

        // Unknown 0 is ARL(0), unknowns 1..n are ARL(v_j). Row r states a_r − Σ_c K_rc a_c = 1.
        var matrix = Matrix<double>.Build.Dense(n + 1, n + 1);
        for (var r = 0; r <= n; r++)
        {
            var u = r == 0 ? 0.0 : nodes[r - 1];
            matrix[r, 0] = -Normal.CDF(0, 1, k - u - shift);
            for (var c = 1; c <= n; c++)
            {
                matrix[r, c] = -weights[c - 1] * Normal.PDF(0, 1, nodes[c - 1] - u + k - shift);
            }

            matrix[r, r] += 1;
        }

        var arl = matrix.Solve(Vector<double>.Build.Dense(n + 1, 1.0));
        if (headStart == 0)
        {
            return RunLengthGuard.Checked(arl[0]);
        }

        // Nyström interpolation: the integral equation itself evaluated at u = headStart.
        var result = 1 + (arl[0] * Normal.CDF(0, 1, k - headStart - shift));
        for (var c = 1; c <= n; c++)
        {
            result += weights[c - 1] * Normal.PDF(0, 1, nodes[c - 1] - headStart + k - shift) * arl[c];
        }

        return RunLengthGuard.Checked(result);
    }
}
