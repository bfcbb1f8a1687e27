namespace FinWatch.Statistics.Constants;

/// <summary>
/// The printed factors of Montgomery, <i>Introduction to Statistical Quality Control</i>, Appendix VI
/// "Factors for Constructing Variables Control Charts", as transcribed in docs/statistics.md §1.3 (the value in
/// parentheses of each cell), used by <see cref="ConstantsMode.Table"/>.
/// </summary>
/// <remarks>
/// This one table is by nature typed in: its point is to reproduce the printed digits, including the
/// eight entries marked † in docs/statistics.md §1.3 that are one unit off the exactly computed value (for example
/// D4(3) = 2.574 where the exact value rounds to 2.575). Tests check every entry against the computed
/// values. B5, B6, D1 and D2 are not printed in the table of docs/statistics.md §1.3 and are not part of this table.
/// </remarks>
internal static class PrintedChartFactors
{
    /// <summary>One printed row: d2, d3, c4 (four decimals), A2, A3, B3, B4, D3, D4 (three decimals).</summary>
    internal readonly record struct Row(int N, double D2, double D3, double C4, double A2, double A3, double B3, double B4, double LowerD3, double D4);

    /// <summary>Rows for n = 2..25, in order.</summary>
    public static readonly Row[] Rows =
    [
        new(2, 1.128, 0.853, 0.7979, 1.880, 2.659, 0.000, 3.267, 0.000, 3.267),
        new(3, 1.693, 0.888, 0.8862, 1.023, 1.954, 0.000, 2.568, 0.000, 2.574),
        new(4, 2.059, 0.880, 0.9213, 0.729, 1.628, 0.000, 2.266, 0.000, 2.282),
        new(5, 2.326, 0.864, 0.9400, 0.577, 1.427, 0.000, 2.089, 0.000, 2.114),
        new(6, 2.534, 0.848, 0.9515, 0.483, 1.287, 0.030, 1.970, 0.000, 2.004),
        new(7, 2.704, 0.833, 0.9594, 0.419, 1.182, 0.118, 1.882, 0.076, 1.924),
        new(8, 2.847, 0.820, 0.9650, 0.373, 1.099, 0.185, 1.815, 0.136, 1.864),
        new(9, 2.970, 0.808, 0.9693, 0.337, 1.032, 0.239, 1.761, 0.184, 1.816),
        new(10, 3.078, 0.797, 0.9727, 0.308, 0.975, 0.284, 1.716, 0.223, 1.777),
        new(11, 3.173, 0.787, 0.9754, 0.285, 0.927, 0.321, 1.679, 0.256, 1.744),
        new(12, 3.258, 0.778, 0.9776, 0.266, 0.886, 0.354, 1.646, 0.283, 1.717),
        new(13, 3.336, 0.770, 0.9794, 0.249, 0.850, 0.382, 1.618, 0.307, 1.693),
        new(14, 3.407, 0.763, 0.9810, 0.235, 0.817, 0.406, 1.594, 0.328, 1.672),
        new(15, 3.472, 0.756, 0.9823, 0.223, 0.789, 0.428, 1.572, 0.347, 1.653),
        new(16, 3.532, 0.750, 0.9835, 0.212, 0.763, 0.448, 1.552, 0.363, 1.637),
        new(17, 3.588, 0.744, 0.9845, 0.203, 0.739, 0.466, 1.534, 0.378, 1.622),
        new(18, 3.640, 0.739, 0.9854, 0.194, 0.718, 0.482, 1.518, 0.391, 1.608),
        new(19, 3.689, 0.734, 0.9862, 0.187, 0.698, 0.497, 1.503, 0.403, 1.597),
        new(20, 3.735, 0.729, 0.9869, 0.180, 0.680, 0.510, 1.490, 0.415, 1.585),
        new(21, 3.778, 0.724, 0.9876, 0.173, 0.663, 0.523, 1.477, 0.425, 1.575),
        new(22, 3.819, 0.720, 0.9882, 0.167, 0.647, 0.534, 1.466, 0.434, 1.566),
        new(23, 3.858, 0.716, 0.9887, 0.162, 0.633, 0.545, 1.455, 0.443, 1.557),
        new(24, 3.895, 0.712, 0.9892, 0.157, 0.619, 0.555, 1.445, 0.451, 1.548),
        new(25, 3.931, 0.708, 0.9896, 0.153, 0.606, 0.565, 1.435, 0.459, 1.541),
    ];
}
