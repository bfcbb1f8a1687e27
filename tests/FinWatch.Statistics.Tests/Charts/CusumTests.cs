using FinWatch.Statistics.Charts;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace FinWatch.Statistics.Tests.Charts;

public class CusumTests
{
    // Montgomery, Introduction to SQC, Example 9.1 / Table 9.2 (docs/statistics.md §8 case 21): μ0 = 10, σ = 1, k = 0.5, h = 5.
    // The 30 values are FROM MEMORY [M] (recalled; docs/statistics.md §8 confirms only the first, 9.45, and the last, 10.52).
    private static readonly double[] MontgomeryTable92 =
    [
        9.45, 7.99, 9.29, 11.66, 12.16, 10.18, 8.04, 11.46, 9.20, 10.34,
        9.03, 11.47, 10.51, 9.40, 10.08, 9.37, 10.62, 10.31, 8.52, 10.84,
        10.90, 9.33, 12.29, 11.50, 10.60, 11.08, 10.38, 11.62, 11.31, 10.52,
    ];

    // C⁺ printed in Montgomery Table 9.2, two decimals. Periods 1–8 (0 … 1.00), 28–29 (4.47, 5.28) and 30 (5.30) are the
    // figures quoted in docs/statistics.md §8 case 21 / §4.2; periods 9–27 are the book's column as recalled [M].
    private static readonly double[] MontgomeryPrintedCPlus =
    [
        0, 0, 0, 1.16, 2.82, 2.50, 0.04, 1.00, 0, 0,
        0, 0.97, 0.98, 0, 0, 0, 0.12, 0, 0, 0.34,
        0.74, 0, 1.79, 2.79, 2.89, 3.47, 3.35, 4.47, 5.28, 5.30,
    ];

    // NIST/SEMATECH e-Handbook §6.3.2.3 (docs/statistics.md §8 case 19): target 325, k = 0.3175, h = 4.1959, in data units. The 20
    // group means are FROM MEMORY [M]; docs/statistics.md confirms the first (324.925) and the last (328.350).
    private static readonly double[] NistGroupMeans =
    [
        324.925, 324.675, 324.725, 324.350, 325.350, 325.225, 324.125, 324.525, 325.225, 324.600,
        324.625, 325.150, 328.325, 327.250, 327.825, 328.500, 326.675, 327.775, 326.875, 328.350,
    ];

    // NIST §6.3.2.3 S_hi and S_lo, printed to two decimals, as recalled [M] (docs/statistics.md quotes 19.04 for the last S_hi and
    // notes that ties such as 14.445 are printed 14.44, so the check allows half a unit either way).
    private static readonly double[] NistPrintedSHi =
    [
        0, 0, 0, 0, 0.03, 0, 0, 0, 0, 0,
        0, 0, 3.01, 4.94, 7.45, 10.63, 11.99, 14.44, 16.00, 19.04,
    ];

    private static readonly double[] NistPrintedSLo =
    [
        0, 0.01, 0, 0.33, 0, 0, 0.56, 0.72, 0.17, 0.25,
        0.31, 0, 0, 0, 0, 0, 0, 0, 0, 0,
    ];

    [Fact]
    public void Compute_MontgomeryExample91_ReproducesPrintedUpperSums()
    {
        var result = Cusum.Compute(MontgomeryTable92, k: 0.5, h: 5, target: 10, sigma: 1, CusumUnits.Sigma);

        for (var i = 0; i < MontgomeryPrintedCPlus.Length; i++)
        {
            Assert.True(
                Math.Abs(result.CPlus[i] - MontgomeryPrintedCPlus[i]) <= 0.005 + 1e-9,
                $"period {i + 1}: C+ {result.CPlus[i]:F4}, printed {MontgomeryPrintedCPlus[i]:F2}");
        }
    }

    // Montgomery Example 9.1: first signal at period 29 with N⁺ = 7, new mean ≈ 11.25 (eq. 9.4), and the sum is not
    // reset, so period 30 (C⁺ = 5.30) signals too; no lower signal.
    [Fact]
    public void Compute_MontgomeryExample91_SignalsAtPeriod29WithNewMean1125()
    {
        var result = Cusum.Compute(MontgomeryTable92, k: 0.5, h: 5, target: 10, sigma: 1, CusumUnits.Sigma);

        Assert.Equal([28, 29], result.SignalsUpper);
        Assert.Empty(result.SignalsLower);
        Assert.Equal(7, result.NPlus[28]);
        Assert.Equal(11.25, result.NewMeanUpper[28], 0.005);
        Assert.Equal(5.30, result.CPlus[29], 0.005);
        Assert.True(double.IsNaN(result.NewMeanUpper[27]));
        Assert.Equal(0.5, result.K);
        Assert.Equal(5, result.H);
    }

    [Fact]
    public void Compute_NistSection6323_ReproducesPrintedSumsAndFirstSignalAtGroup14()
    {
        var result = Cusum.Compute(NistGroupMeans, k: 0.3175, h: 4.1959, target: 325, sigma: double.NaN, CusumUnits.Data);

        for (var i = 0; i < NistGroupMeans.Length; i++)
        {
            Assert.True(Math.Abs(result.CPlus[i] - NistPrintedSHi[i]) <= 0.005 + 1e-9, $"group {i + 1}: S_hi {result.CPlus[i]:F4}");
            Assert.True(Math.Abs(result.CMinus[i] - NistPrintedSLo[i]) <= 0.005 + 1e-9, $"group {i + 1}: S_lo {result.CMinus[i]:F4}");
        }

        Assert.Equal(13, result.SignalsUpper[0]);
        Assert.Equal(Enumerable.Range(13, 7), result.SignalsUpper);
        Assert.Empty(result.SignalsLower);
    }

    [Fact]
    public void Compute_EmptySeries_ReturnsEmptyArrays()
    {
        var result = Cusum.Compute([], 0.5, 5, 10, 1, CusumUnits.Sigma);

        Assert.Empty(result.CPlus);
        Assert.Empty(result.SignalsUpper);
        Assert.Empty(result.SignalsLower);
    }

    [Fact]
    public void Compute_SinglePoint_IsDeviationBeyondReference()
    {
        var result = Cusum.Compute([13.0], k: 0.5, h: 4, target: 10, sigma: 2, CusumUnits.Sigma);

        Assert.Equal(13 - (10 + 1), result.CPlus[0], 1e-12);
        Assert.Equal(0, result.CMinus[0]);
        Assert.Equal(1, result.NPlus[0]);
        Assert.Equal(0, result.NMinus[0]);
        Assert.Empty(result.SignalsUpper);
    }

    [Fact]
    public void Compute_AllMissing_ReturnsNaNSumsAndNoSignal()
    {
        var result = Cusum.Compute([double.NaN, double.NaN], 0.5, 5, 10, 1, CusumUnits.Sigma);

        Assert.All(result.CPlus, c => Assert.True(double.IsNaN(c)));
        Assert.All(result.CMinus, c => Assert.True(double.IsNaN(c)));
        Assert.Equal([-1, -1], result.NPlus);
        Assert.Empty(result.SignalsUpper);
        Assert.Empty(result.SignalsLower);
    }

    // Signal when C > H strictly (docs/statistics.md §4.2): with k = 0 and h = 2 in data units, x = 2 gives C⁺ = H exactly.
    [Fact]
    public void Compute_SumExactlyAtH_DoesNotSignal()
    {
        var result = Cusum.Compute([2.0, 0.5], k: 0, h: 2, target: 0, sigma: 1, CusumUnits.Data);

        Assert.Equal(2.0, result.CPlus[0]);
        Assert.Equal([1], result.SignalsUpper);
    }

    // Fast initial response (Lucas & Crosier 1982): C⁺_0 = C⁻_0 = head start, in the units of h (here sigma units, so
    // times σ = 2); N counts only periods after the start.
    [Fact]
    public void Compute_HeadStartInSigmaUnits_StartsBothSumsAtHeadStartTimesSigma()
    {
        var result = Cusum.Compute([10.4], k: 0.5, h: 4, target: 10, sigma: 2, CusumUnits.Sigma, headStart: 2);

        Assert.Equal((2 * 2) + 10.4 - 11, result.CPlus[0], 1e-12);
        Assert.Equal((2 * 2) + 9 - 10.4, result.CMinus[0], 1e-12);
        Assert.Equal(1, result.NPlus[0]);
    }

    [Fact]
    public void Compute_HeadStartInDataUnits_StartsBothSumsAtHeadStart()
    {
        var result = Cusum.Compute([325.0], k: 0.3, h: 4, target: 325, sigma: double.NaN, CusumUnits.Data, headStart: 2);

        Assert.Equal(1.7, result.CPlus[0], 1e-12);
        Assert.Equal(1.7, result.CMinus[0], 1e-12);
    }

    // The head start speeds detection of a shift present from the start, which is its purpose (Lucas & Crosier 1982).
    [Fact]
    public void Compute_HeadStartWithEarlyShift_SignalsEarlier()
    {
        var shifted = Enumerable.Repeat(11.2, 20).ToArray();

        var plain = Cusum.Compute(shifted, 0.5, 5, 10, 1, CusumUnits.Sigma);
        var fir = Cusum.Compute(shifted, 0.5, 5, 10, 1, CusumUnits.Sigma, headStart: 2.5);

        Assert.True(fir.SignalsUpper[0] < plain.SignalsUpper[0]);
    }

    [Fact]
    public void Compute_MissingInMiddle_CarriesSumsAndCounts()
    {
        var result = Cusum.Compute([12.0, double.NaN, 12.0], k: 0.5, h: 5, target: 10, sigma: 1, CusumUnits.Sigma);

        Assert.True(double.IsNaN(result.CPlus[1]));
        Assert.Equal(-1, result.NPlus[1]);
        Assert.Equal(3.0, result.CPlus[2], 1e-12);
        Assert.Equal(2, result.NPlus[2]);
    }

    [Theory]
    [InlineData(-0.1, 5, 1, CusumUnits.Sigma, 0)]
    [InlineData(0.5, 0, 1, CusumUnits.Sigma, 0)]
    [InlineData(0.5, -1, 1, CusumUnits.Sigma, 0)]
    [InlineData(0.5, 5, 0, CusumUnits.Sigma, 0)]
    [InlineData(0.5, 5, double.NaN, CusumUnits.Sigma, 0)]
    [InlineData(0.5, 5, 1, CusumUnits.Sigma, -0.1)]
    [InlineData(0.5, 5, 1, CusumUnits.Sigma, 5.1)]
    [InlineData(0.5, 5, 1, (CusumUnits)7, 0)]
    public void Compute_InvalidParameter_Throws(double k, double h, double sigma, CusumUnits units, double headStart) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => Cusum.Compute([1.0], k, h, 0, sigma, units, headStart));

    [Fact]
    public void Append_InfiniteValue_Throws()
    {
        var accumulator = new CusumAccumulator(0.5, 5, 0, 1, CusumUnits.Sigma);

        Assert.Throws<ArgumentOutOfRangeException>(() => accumulator.Append(double.NegativeInfinity));
    }

    [Property(MaxTest = 200)]
    public Property Compute_AnySeries_EqualsIncrementalAppend()
    {
        var cases = from values in ChartGenerators.Series
                    from k in ChartGenerators.Positive
                    from h in ChartGenerators.Positive
                    from sigma in ChartGenerators.Positive
                    from target in ChartGenerators.Value
                    from units in Gen.Elements(CusumUnits.Sigma, CusumUnits.Data)
                    select (values, k, h, sigma, target, units);
        return Prop.ForAll(cases.ToArbitrary(), c =>
        {
            var batch = Cusum.Compute(c.values, c.k, c.h, c.target, c.sigma, c.units, c.h / 2);
            var accumulator = new CusumAccumulator(c.k, c.h, c.target, c.sigma, c.units, c.h / 2);
            var upper = new List<int>();
            var lower = new List<int>();
            for (var i = 0; i < c.values.Length; i++)
            {
                var p = accumulator.Append(c.values[i]);
                if (!p.CPlus.Equals(batch.CPlus[i]) || !p.CMinus.Equals(batch.CMinus[i]) || p.NPlus != batch.NPlus[i]
                    || p.NMinus != batch.NMinus[i] || !p.NewMeanUpper.Equals(batch.NewMeanUpper[i])
                    || !p.NewMeanLower.Equals(batch.NewMeanLower[i]))
                {
                    return false;
                }

                if (p.SignalUpper)
                {
                    upper.Add(i);
                }

                if (p.SignalLower)
                {
                    lower.Add(i);
                }
            }

            return upper.SequenceEqual(batch.SignalsUpper) && lower.SequenceEqual(batch.SignalsLower);
        });
    }

    // Values are within ±100 and series at most 80 long, so |C| ≤ 80·200 = 16 000 < H = 1e6·σ (σ ≥ 0.1).
    [Property(MaxTest = 200)]
    public Property Compute_HugeH_NeverSignals()
    {
        var cases = from values in ChartGenerators.Series
                    from sigma in ChartGenerators.Positive
                    select (values, sigma);
        return Prop.ForAll(cases.ToArbitrary(), c =>
        {
            var result = Cusum.Compute(c.values, 0.5, 1e6, 0, c.sigma, CusumUnits.Sigma);
            return result.SignalsUpper.Length == 0 && result.SignalsLower.Length == 0;
        });
    }

    // Reflecting the data about the target swaps the two sums (the scheme is symmetric); to rounding, since 2μ0 − x is rounded.
    [Property(MaxTest = 200)]
    public Property Compute_ReflectedSeries_SwapsUpperAndLowerSums()
    {
        var cases = from values in ChartGenerators.Series
                    from target in ChartGenerators.Value
                    select (values, target);
        return Prop.ForAll(cases.ToArbitrary(), c =>
        {
            var reflected = c.values.Select(x => (2 * c.target) - x).ToArray();
            var a = Cusum.Compute(c.values, 0.5, 4, c.target, 1.5, CusumUnits.Sigma);
            var b = Cusum.Compute(reflected, 0.5, 4, c.target, 1.5, CusumUnits.Sigma);
            return a.CPlus.Zip(b.CMinus).All(p => double.IsNaN(p.First) ? double.IsNaN(p.Second) : Math.Abs(p.First - p.Second) <= 1e-9);
        });
    }
}
