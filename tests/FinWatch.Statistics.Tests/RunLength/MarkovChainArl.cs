using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace FinWatch.Statistics.Tests.RunLength;

/// <summary>
/// Independent Markov-chain approximations of the ARL, used only to cross-check the library's Nyström solutions:
/// Brook &amp; Evans (1972) for the one-sided CUSUM, Lucas &amp; Saccucci (1990) for the EWMA. Both discretise the
/// continuous state into m cells with the cell midpoint as representative; the error falls like 1/m², so the result
/// is Richardson-extrapolated from m and 2m cells.
/// </summary>
internal static class MarkovChainArl
{
    public static double CusumUpper(double k, double h, double shift, int cells) =>
        Richardson(CusumUpperRaw(k, h, shift, cells), CusumUpperRaw(k, h, shift, 2 * cells));

    public static double Ewma(double lambda, double l, double shift, int halfCells) =>
        Richardson(EwmaRaw(lambda, l, shift, halfCells), EwmaRaw(lambda, l, shift, 2 * halfCells));

    private static double Richardson(double coarse, double fine) => ((4 * fine) - coarse) / 3;

    /// <summary>Brook &amp; Evans: cell 0 is [0, w/2] (it holds the atom at 0), cell i is ((i − ½)w, (i + ½)w], h = (m − ½)w.</summary>
    private static double CusumUpperRaw(double k, double h, double shift, int m)
    {
        var w = 2 * h / ((2 * m) - 1);
        var a = Matrix<double>.Build.Dense(m, m);
        for (var i = 0; i < m; i++)
        {
            var c = i * w;
            a[i, 0] -= Normal.CDF(0, 1, (0.5 * w) - c + k - shift);
            for (var j = 1; j < m; j++)
            {
                a[i, j] -= Normal.CDF(0, 1, ((j + 0.5) * w) - c + k - shift) - Normal.CDF(0, 1, ((j - 0.5) * w) - c + k - shift);
            }

            a[i, i] += 1;
        }

        return a.Solve(Vector<double>.Build.Dense(m, 1.0))[0];
    }

    /// <summary>Lucas &amp; Saccucci: 2r + 1 equal cells on [−h, h]; the chart starts in the middle cell (the target).</summary>
    private static double EwmaRaw(double lambda, double l, double shift, int r)
    {
        var h = l * Math.Sqrt(lambda / (2 - lambda));
        var m = (2 * r) + 1;
        var w = 2 * h / m;
        var a = Matrix<double>.Build.Dense(m, m);
        for (var i = 0; i < m; i++)
        {
            var from = (1 - lambda) * (-h + ((i + 0.5) * w));
            for (var j = 0; j < m; j++)
            {
                var lower = -h + (j * w);
                a[i, j] -= Normal.CDF(0, 1, ((lower + w - from) / lambda) - shift) - Normal.CDF(0, 1, ((lower - from) / lambda) - shift);
            }

            a[i, i] += 1;
        }

        return a.Solve(Vector<double>.Build.Dense(m, 1.0))[r];
    }
}
