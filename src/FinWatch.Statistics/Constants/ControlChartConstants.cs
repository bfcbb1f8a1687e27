using MathNet.Numerics;

namespace FinWatch.Statistics.Constants;

/// <summary>
/// Factors for variables control charts, d2, d3, c4, A2, A3, B3..B6, D1..D4, for subgroup sizes
/// n = 2..25 (docs/statistics.md §1).
/// </summary>
/// <remarks>
/// <see cref="ConstantsMode.Exact"/> values are computed from their definitions, once, lazily and
/// thread-safely, for all n together (a few milliseconds): d2 and d3 by quadrature (Tippett 1925; see
/// docs/statistics.md §1.2), c4 = √(2/(n−1))·Γ(n/2)/Γ((n−1)/2) from log-gamma, and the other factors from those by the
/// formulas of docs/statistics.md §1.1. Accuracy is about 2e-14 absolute for d2 and d3, and a few 1e-14 relative for c4 (limited by
/// MathNet's log-gamma).
/// <see cref="ConstantsMode.Table"/> values are the printed factors (see docs/statistics.md §1.3); B5, B6, D1 and D2,
/// which docs/statistics.md §1.3 does not print, are the exact values rounded to three decimals.
/// </remarks>
public static class ControlChartConstants
{
    /// <summary>The smallest supported subgroup size.</summary>
    public const int MinSubgroupSize = 2;

    /// <summary>The largest supported subgroup size (the extent of the printed table).</summary>
    public const int MaxSubgroupSize = 25;

    private static readonly Lazy<ChartConstants[]> ExactValues = new(ComputeExact, LazyThreadSafetyMode.ExecutionAndPublication);
    private static readonly Lazy<ChartConstants[]> TableValues = new(BuildTable, LazyThreadSafetyMode.ExecutionAndPublication);

    /// <summary>The chart constants for subgroup size <paramref name="n"/>.</summary>
    /// <param name="n">Subgroup size, <see cref="MinSubgroupSize"/>..<see cref="MaxSubgroupSize"/>.</param>
    /// <param name="mode">Exact (computed) or printed table values.</param>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="n"/> is outside 2..25, or
    /// <paramref name="mode"/> is not a defined value.</exception>
    public static ChartConstants Get(int n, ConstantsMode mode = ConstantsMode.Exact)
    {
        ArgumentOutOfRangeException.ThrowIfLessThan(n, MinSubgroupSize);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(n, MaxSubgroupSize);
        return All(mode)[n - MinSubgroupSize];
    }

    /// <summary>The chart constants for every n from 2 to 25, in order of n.</summary>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="mode"/> is not a defined value.</exception>
    public static IReadOnlyList<ChartConstants> All(ConstantsMode mode) => mode switch
    {
        ConstantsMode.Exact => ExactValues.Value,
        ConstantsMode.Table => TableValues.Value,
        _ => throw new ArgumentOutOfRangeException(nameof(mode), mode, "Unknown constants mode."),
    };

    /// <summary>c4(n) = √(2/(n−1))·Γ(n/2)/Γ((n−1)/2), from log-gamma.</summary>
    internal static double C4(int n) =>
        Math.Sqrt(2.0 / (n - 1)) * Math.Exp(SpecialFunctions.GammaLn(n / 2.0) - SpecialFunctions.GammaLn((n - 1) / 2.0));

    private static ChartConstants[] ComputeExact()
    {
        var (d2, d3) = RangeMoments.Compute(MaxSubgroupSize);
        var result = new ChartConstants[MaxSubgroupSize - MinSubgroupSize + 1];
        for (var n = MinSubgroupSize; n <= MaxSubgroupSize; n++)
        {
            result[n - MinSubgroupSize] = FromBasic(n, d2[n], d3[n], C4(n));
        }

        return result;
    }

    private static ChartConstants FromBasic(int n, double d2, double d3, double c4)
    {
        var sqrtN = Math.Sqrt(n);
        var spread = Math.Sqrt(1.0 - (c4 * c4));
        return new ChartConstants(
            N: n,
            RangeMean: d2,
            RangeSd: d3,
            C4: c4,
            A2: 3.0 / (d2 * sqrtN),
            A3: 3.0 / (c4 * sqrtN),
            B3: Math.Max(0.0, 1.0 - (3.0 * spread / c4)),
            B4: 1.0 + (3.0 * spread / c4),
            B5: Math.Max(0.0, c4 - (3.0 * spread)),
            B6: c4 + (3.0 * spread),
            D1: Math.Max(0.0, d2 - (3.0 * d3)),
            D2: d2 + (3.0 * d3),
            D3: Math.Max(0.0, 1.0 - (3.0 * d3 / d2)),
            D4: 1.0 + (3.0 * d3 / d2));
    }

    private static ChartConstants[] BuildTable()
    {
        var exact = ExactValues.Value;
        var result = new ChartConstants[PrintedChartFactors.Rows.Length];
        for (var i = 0; i < result.Length; i++)
        {
            var p = PrintedChartFactors.Rows[i];
            var e = exact[i];

            // B5, B6, D1, D2 are not printed in docs/statistics.md §1.3: the exact value rounded to three decimals.
            result[i] = new ChartConstants(
                N: p.N,
                RangeMean: p.D2,
                RangeSd: p.D3,
                C4: p.C4,
                A2: p.A2,
                A3: p.A3,
                B3: p.B3,
                B4: p.B4,
                B5: Math.Round(e.B5, 3, MidpointRounding.AwayFromZero),
                B6: Math.Round(e.B6, 3, MidpointRounding.AwayFromZero),
                D1: Math.Round(e.D1, 3, MidpointRounding.AwayFromZero),
                D2: Math.Round(e.D2, 3, MidpointRounding.AwayFromZero),
                D3: p.LowerD3,
                D4: p.D4);
        }

        return result;
    }
}
