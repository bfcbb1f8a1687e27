using MathNet.Numerics.Integration;

namespace FinWatch.Statistics.RunLength;

/// <summary>Composite Gauss–Legendre nodes and weights for the Nyström solution of the ARL integral equations.</summary>
internal static class NystromQuadrature
{
    /// <summary>
    /// Nodes and weights of a composite Gauss–Legendre rule on [a, b]: <paramref name="panels"/> equal panels with
    /// <paramref name="order"/> nodes each. Panels keep the rule accurate when the kernel is narrow compared with the
    /// interval (EWMA with small λ), where one high-order rule would need many more nodes.
    /// </summary>
    public static (double[] Nodes, double[] Weights) Composite(double a, double b, int panels, int order)
    {
        var rule = new GaussLegendreRule(-1, 1, order);
        var nodes = new double[panels * order];
        var weights = new double[panels * order];
        var width = (b - a) / panels;
        for (var p = 0; p < panels; p++)
        {
            var left = a + (p * width);
            for (var j = 0; j < order; j++)
            {
                var index = (p * order) + j;
                nodes[index] = left + (0.5 * width * (rule.Abscissas[j] + 1));
                weights[index] = 0.5 * width * rule.Weights[j];
            }
        }

        return (nodes, weights);
    }
}
