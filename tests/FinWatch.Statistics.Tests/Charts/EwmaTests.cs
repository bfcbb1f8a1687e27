using FinWatch.Statistics.Charts;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace FinWatch.Statistics.Tests.Charts;

public class EwmaTests
{
    // NIST/SEMATECH e-Handbook §6.3.2.4 (docs/statistics.md §8 case 18): EWMA0 = 50, s = 2.0539, λ = 0.3, k = 3; the published EWMA
    // series to two decimals, as quoted in docs/statistics.md §8.
    private static readonly double[] NistPublishedEwma =
    [
        50.60, 49.52, 50.56, 50.18, 50.16, 49.21, 49.75, 49.85, 50.26, 50.33,
        50.11, 49.36, 49.52, 50.05, 49.38, 49.92, 50.73, 51.23, 51.94, 51.99,
    ];

    // The 20 data values of the same example, FROM MEMORY [M]: docs/statistics.md confirms only the first (52.0) and the last (52.1),
    // and the last ten equal the flow-rate data of NIST §6.3.2.2 quoted in docs/statistics.md case 17. Used only in the test that says
    // so; the primary check of case 18 below does not depend on them.
    private static readonly double[] NistRecalledData =
    [
        52.0, 47.0, 53.0, 49.3, 50.1, 47.0, 51.0, 50.1, 51.2, 50.5,
        49.6, 47.6, 49.9, 51.3, 47.8, 51.2, 52.6, 52.4, 53.6, 52.1,
    ];

    // NIST §6.3.2.4: UCL = 52.5884, LCL = 47.4115 from the asymptotic formula. NIST rounds √(λ/(2 − λ)) to 0.4201,
    // which moves its LCL by 7e-5 from the unrounded 47.41157 (docs/statistics.md §8 case 18), hence 1e-4 there.
    [Fact]
    public void Compute_NistSection6324Parameters_MatchesPublishedAsymptoticLimits()
    {
        var result = Ewma.Compute([], lambda: 0.3, L: 3, target: 50, sigma: 2.0539);

        Assert.Equal(52.5884, result.AsymptoticUcl, 0.5e-4);
        Assert.Equal(47.4115, result.AsymptoticLcl, 1e-4);
    }

    // NIST §6.3.2.4. The data are not all in docs/statistics.md, so they are derived here by inverting the published (rounded) EWMA
    // series, x_i = (z_i − 0.7·z_{i−1})/0.3 with z_0 = 50. The recursion run on these values must give the published
    // series back (to rounding of the inversion), stay inside the limits at every point (NIST: no point outside), and the
    // exact limits must approach the printed asymptotic ones.
    [Fact]
    public void Compute_NistSection6324DataInvertedFromPublishedSeries_ReproducesPublishedEwmaWithNoSignal()
    {
        var derived = InvertPublishedSeries(NistPublishedEwma, 0.3, 50);

        var result = Ewma.Compute(derived, lambda: 0.3, L: 3, target: 50, sigma: 2.0539);

        for (var i = 0; i < NistPublishedEwma.Length; i++)
        {
            Assert.Equal(NistPublishedEwma[i], result.Z[i], 1e-9);
        }

        Assert.Empty(result.Signals);
        Assert.Equal(52.5884, result.Ucl[^1], 0.5e-4);
        Assert.Equal(47.4115, result.Lcl[^1], 1e-4);
    }

    // NIST §6.3.2.4 with the data recalled from memory [M]: the EWMA must match the published two-decimal series within
    // rounding (0.005), and the recalled data must lie within the inversion's rounding error (≤ 0.0283) of the values
    // derived from the published series, which confirms the recall independently of the chart code.
    [Fact]
    public void Compute_NistSection6324RecalledData_MatchesPublishedSeriesToTwoDecimals()
    {
        var derived = InvertPublishedSeries(NistPublishedEwma, 0.3, 50);
        for (var i = 0; i < derived.Length; i++)
        {
            Assert.Equal(derived[i], NistRecalledData[i], 0.0284);
        }

        var result = Ewma.Compute(NistRecalledData, lambda: 0.3, L: 3, target: 50, sigma: 2.0539);

        for (var i = 0; i < NistPublishedEwma.Length; i++)
        {
            Assert.Equal(NistPublishedEwma[i], result.Z[i], 0.005 + 1e-9);
        }

        Assert.Empty(result.Signals);
    }

    // docs/statistics.md §4.1: at i = 1 the exact half-width is L·σ·√(λ/(2 − λ)·[1 − (1 − λ)²]) = L·σ·λ (algebra), and z_1 = λx + (1 − λ)μ0.
    [Fact]
    public void Compute_SinglePoint_HasFirstPointLimitsLSigmaLambda()
    {
        var result = Ewma.Compute([17.0], lambda: 0.2, L: 3, target: 10, sigma: 2);

        Assert.Equal((0.2 * 17) + (0.8 * 10), result.Z[0], 1e-12);
        Assert.Equal(10 + (3 * 2 * 0.2), result.Ucl[0], 1e-12);
        Assert.Equal(10 - (3 * 2 * 0.2), result.Lcl[0], 1e-12);
        Assert.Equal([0], result.Signals);
    }

    [Fact]
    public void Compute_EmptySeries_ReturnsEmptyArraysAndAsymptoticLimits()
    {
        var result = Ewma.Compute([], lambda: 0.1, L: 2.7, target: 5, sigma: 1);

        Assert.Empty(result.Z);
        Assert.Empty(result.Ucl);
        Assert.Empty(result.Lcl);
        Assert.Empty(result.Signals);
        Assert.Equal(5 + (2.7 * Math.Sqrt(0.1 / 1.9)), result.AsymptoticUcl, 1e-12);
        Assert.Equal(5 - (2.7 * Math.Sqrt(0.1 / 1.9)), result.AsymptoticLcl, 1e-12);
    }

    [Fact]
    public void Compute_AllMissing_ReturnsNaNEverywhereAndNoSignal()
    {
        var result = Ewma.Compute([double.NaN, double.NaN, double.NaN], lambda: 0.2, L: 3, target: 0, sigma: 1);

        Assert.All(result.Z, z => Assert.True(double.IsNaN(z)));
        Assert.All(result.Ucl, u => Assert.True(double.IsNaN(u)));
        Assert.All(result.Lcl, l => Assert.True(double.IsNaN(l)));
        Assert.Empty(result.Signals);
    }

    // docs/statistics.md §4.1 [conv]: a missing value is skipped; z carries over and i counts non-missing points, so the point after
    // the gap has the limits of index 2, not 3.
    [Fact]
    public void Compute_MissingInMiddle_CarriesZAndCountsOnlyNonMissingPoints()
    {
        var withGap = Ewma.Compute([11.0, double.NaN, 9.5], lambda: 0.25, L: 3, target: 10, sigma: 1);
        var compact = Ewma.Compute([11.0, 9.5], lambda: 0.25, L: 3, target: 10, sigma: 1);

        Assert.True(double.IsNaN(withGap.Z[1]));
        Assert.Equal(compact.Z[1], withGap.Z[2]);
        Assert.Equal(compact.Ucl[1], withGap.Ucl[2]);
        Assert.Equal(compact.Lcl[1], withGap.Lcl[2]);
    }

    // Signal only when strictly outside (docs/statistics.md §4.1): with λ = 1 the chart is the individuals chart and the first
    // limit is target ± L·σ exactly; a point on the limit does not signal, one just beyond does.
    [Fact]
    public void Compute_PointExactlyOnLimit_DoesNotSignal()
    {
        var on = Ewma.Compute([13.0], lambda: 1, L: 3, target: 10, sigma: 1);
        var beyond = Ewma.Compute([13.0000001], lambda: 1, L: 3, target: 10, sigma: 1);

        Assert.Equal(13.0, on.Ucl[0]);
        Assert.Empty(on.Signals);
        Assert.Equal([0], beyond.Signals);
    }

    [Fact]
    public void Compute_ShiftDown_SignalsBelowLowerLimit()
    {
        double[] values = [10, 10, 7, 7, 7, 7];

        var result = Ewma.Compute(values, lambda: 0.3, L: 3, target: 10, sigma: 1);

        Assert.NotEmpty(result.Signals);
        Assert.All(result.Signals, i => Assert.True(result.Z[i] < result.Lcl[i]));
    }

    [Fact]
    public void Compute_ExactLimits_WidenMonotonicallyTowardAsymptoticLimits()
    {
        var result = Ewma.Compute(new double[200], lambda: 0.05, L: 2.6, target: 0, sigma: 1.5);

        for (var i = 1; i < result.Ucl.Length; i++)
        {
            Assert.True(result.Ucl[i] >= result.Ucl[i - 1]);
            Assert.True(result.Ucl[i] <= result.AsymptoticUcl);
        }

        Assert.Equal(result.AsymptoticUcl, result.Ucl[^1], 1e-4);
    }

    [Theory]
    [InlineData(0.0, 3, 1)]
    [InlineData(-0.1, 3, 1)]
    [InlineData(1.0001, 3, 1)]
    [InlineData(double.NaN, 3, 1)]
    [InlineData(0.2, 0, 1)]
    [InlineData(0.2, -3, 1)]
    [InlineData(0.2, double.PositiveInfinity, 1)]
    [InlineData(0.2, 3, 0)]
    [InlineData(0.2, 3, -1)]
    [InlineData(0.2, 3, double.NaN)]
    public void Compute_InvalidParameter_Throws(double lambda, double l, double sigma) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => Ewma.Compute([1.0], lambda, l, 0, sigma));

    [Fact]
    public void Append_InfiniteValue_Throws()
    {
        var accumulator = new EwmaAccumulator(0.2, 3, 0, 1);

        Assert.Throws<ArgumentOutOfRangeException>(() => accumulator.Append(double.PositiveInfinity));
    }

    [Fact]
    public void Append_MissingValue_LeavesStateUnchanged()
    {
        var accumulator = new EwmaAccumulator(0.2, 3, 0, 1);
        accumulator.Append(1.5);
        var z = accumulator.Z;

        var point = accumulator.Append(double.NaN);

        Assert.True(point.IsMissing);
        Assert.False(point.Signal);
        Assert.Equal(z, accumulator.Z);
        Assert.Equal(1, accumulator.Count);
    }

    // STYLE 3.3.12 consistency: the batch is the accumulator by construction; the property guards that (bit-for-bit).
    [Property(MaxTest = 200)]
    public Property Compute_AnySeries_EqualsIncrementalAppend()
    {
        var cases = from values in ChartGenerators.Series
                    from lambda in ChartGenerators.Lambda
                    from l in ChartGenerators.Positive
                    from sigma in ChartGenerators.Positive
                    from target in ChartGenerators.Value
                    select (values, lambda, l, sigma, target);
        return Prop.ForAll(cases.ToArbitrary(), c =>
        {
            var batch = Ewma.Compute(c.values, c.lambda, c.l, c.target, c.sigma);
            var accumulator = new EwmaAccumulator(c.lambda, c.l, c.target, c.sigma);
            var signals = new List<int>();
            for (var i = 0; i < c.values.Length; i++)
            {
                var point = accumulator.Append(c.values[i]);
                if (!Same(point.Z, batch.Z[i]) || !Same(point.Ucl, batch.Ucl[i]) || !Same(point.Lcl, batch.Lcl[i]))
                {
                    return false;
                }

                if (point.Signal)
                {
                    signals.Add(i);
                }
            }

            return signals.SequenceEqual(batch.Signals);
        });
    }

    // λ = 1: z_i = 1·x_i + 0·z_{i−1} = x_i exactly (docs/statistics.md §4.1; the chart is the individuals chart).
    [Property(MaxTest = 200)]
    public Property Compute_LambdaOne_EqualsRawValues()
    {
        var cases = from values in ChartGenerators.Series
                    from target in ChartGenerators.Value
                    select (values, target);
        return Prop.ForAll(cases.ToArbitrary(), c =>
        {
            var result = Ewma.Compute(c.values, lambda: 1, L: 3, target: c.target, sigma: 1);
            return c.values.Select((x, i) => Same(x, result.Z[i])).All(b => b);
        });
    }

    // Removing the missing rows changes nothing but the row numbers (docs/statistics.md §4.1 [conv]).
    [Property(MaxTest = 200)]
    public Property Compute_MissingRows_EqualCompactedSeriesAtTheirRows()
    {
        var cases = from values in ChartGenerators.Series
                    from lambda in ChartGenerators.Lambda
                    select (values, lambda);
        return Prop.ForAll(cases.ToArbitrary(), c =>
        {
            var full = Ewma.Compute(c.values, c.lambda, 3, 0, 2);
            var rows = Enumerable.Range(0, c.values.Length).Where(i => !double.IsNaN(c.values[i])).ToArray();
            var compact = Ewma.Compute(rows.Select(i => c.values[i]).ToArray(), c.lambda, 3, 0, 2);
            return rows.Select((row, j) => full.Z[row] == compact.Z[j] && full.Ucl[row] == compact.Ucl[j]).All(b => b)
                && full.Signals.SequenceEqual(compact.Signals.Select(j => rows[j]));
        });
    }

    private static bool Same(double a, double b) => a.Equals(b);

    private static double[] InvertPublishedSeries(double[] published, double lambda, double z0)
    {
        var x = new double[published.Length];
        var previous = z0;
        for (var i = 0; i < published.Length; i++)
        {
            x[i] = (published[i] - ((1 - lambda) * previous)) / lambda;
            previous = published[i];
        }

        return x;
    }
}
