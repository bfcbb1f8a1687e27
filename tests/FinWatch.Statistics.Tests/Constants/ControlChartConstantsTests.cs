using System.Diagnostics;
using System.Globalization;
using FinWatch.Statistics.Constants;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.Integration;

namespace FinWatch.Statistics.Tests.Constants;

public class ControlChartConstantsTests
{
    // Closed forms (derivable analytically; docs/statistics.md §1.2): for n = 2, R = |X1 − X2| with X1 − X2 ~ N(0, 2), so
    // E[R] = √2·√(2/π) = 2/√π and E[R²] = 2, giving d3 = √(2 − 4/π). For n = 3, E[R] = 3/√π (Tippett 1925).
    [Fact]
    public void RangeMean_N2_EqualsTwoOverSqrtPi() =>
        Assert.Equal(2.0 / Math.Sqrt(Math.PI), ControlChartConstants.Get(2).RangeMean, 1e-12);

    [Fact]
    public void RangeSd_N2_EqualsSqrtOfTwoMinusFourOverPi() =>
        Assert.Equal(Math.Sqrt(2.0 - (4.0 / Math.PI)), ControlChartConstants.Get(2).RangeSd, 1e-12);

    [Fact]
    public void RangeMean_N3_EqualsThreeOverSqrtPi() =>
        Assert.Equal(3.0 / Math.Sqrt(Math.PI), ControlChartConstants.Get(3).RangeMean, 1e-12);

    // c4 from the gamma function: c4(2) = √2·Γ(1)/Γ(1/2) = √(2/π); c4(3) = Γ(3/2)/Γ(1) = √π/2.
    // Tolerances of 1e-13: the library takes c4 from MathNet's log-gamma (docs/statistics.md §1.2), whose last digits
    // limit the relative accuracy to a few 1e-14 (measured up to 4.5e-14 at n = 24, 25).
    [Fact]
    public void C4_N2AndN3_EqualGammaClosedForms()
    {
        Assert.Equal(Math.Sqrt(2.0 / Math.PI), ControlChartConstants.Get(2).C4, 1e-13);
        Assert.Equal(Math.Sqrt(Math.PI) / 2.0, ControlChartConstants.Get(3).C4, 1e-13);
    }

    // Γ(x + 1) = x·Γ(x) gives c4(n + 1)·c4(n + 2) = √(4/(n(n + 1)))·(n/2) = √(n/(n + 1)) for every n ≥ 1.
    [Fact]
    public void C4_ConsecutiveProducts_SatisfyGammaRecurrence()
    {
        for (var n = 1; n <= 23; n++)
        {
            var product = ControlChartConstants.Get(n + 1).C4 * ControlChartConstants.Get(n + 2).C4;
            Assert.Equal(Math.Sqrt(n / (n + 1.0)), product, 1e-13);
        }
    }

    // c4 is the mean of the chi distribution with n − 1 degrees of freedom divided by √(n − 1): checked by
    // integrating s·density(s) with MathNet's adaptive Gauss–Kronrod rule, a route independent of log-gamma.
    [Theory]
    [InlineData(4)]
    [InlineData(11)]
    [InlineData(25)]
    public void C4_SelectedN_EqualsChiDistributionMean(int n)
    {
        var chi = new Chi(n - 1);
        var mean = GaussKronrodRule.Integrate(s => s * chi.Density(s), 0.0, 15.0, out _, out _, targetRelativeError: 1e-13, maximumDepth: 20, order: 21);
        Assert.Equal(mean / Math.Sqrt(n - 1), ControlChartConstants.Get(n).C4, 1e-12);
    }

    // Second route for d3 (docs/statistics.md §1.2): E[R²] = 2∫∫_{x<y}[1 − Φ(y)ⁿ − (1 − Φ(x))ⁿ + (Φ(y) − Φ(x))ⁿ] dx dy,
    // here with y = x + w on a plain rectangle by MathNet's 2-D Gauss–Legendre rule on 1.5 × 1.5 panels, and d2 by plain
    // (non-expm1) adaptive quadrature. The library uses the range-density route instead.
    [Theory]
    [InlineData(2)]
    [InlineData(5)]
    [InlineData(19)]
    [InlineData(22)]
    [InlineData(24)]
    public void RangeSd_SelectedN_AgreesWithDoubleIntegralOfSecondMoment(int n)
    {
        static double Phi(double t) => Normal.CDF(0.0, 1.0, t);

        // Powers that would underflow are set to 0 at once (subnormal arithmetic is very slow).
        double Pow(double p) => p <= 0 || n * Math.Log(p) < -700 ? 0.0 : Math.Pow(p, n);
        var d2 = GaussKronrodRule.Integrate(
            x => 1.0 - Pow(Phi(x)) - Pow(1.0 - Phi(x)), -12.0, 12.0, out _, out _, targetRelativeError: 1e-13, maximumDepth: 20, order: 21);
        var secondMoment = 0.0;
        for (var x0 = -18.0; x0 < 9.0; x0 += 1.5)
        {
            for (var w0 = 0.0; w0 < 18.0; w0 += 1.5)
            {
                secondMoment += 2.0 * GaussLegendreRule.Integrate(
                    (x, w) => 1.0 - Pow(Phi(x + w)) - Pow(1.0 - Phi(x)) + Pow(Phi(x + w) - Phi(x)),
                    x0, x0 + 1.5, w0, w0 + 1.5, 16);
            }
        }

        var d3 = Math.Sqrt(secondMoment - (d2 * d2));

        var exact = ControlChartConstants.Get(n);
        Assert.Equal(d2, exact.RangeMean, 1e-12);
        Assert.Equal(d3, exact.RangeSd, 1e-12);
    }

    // Monte Carlo sanity check of d2 and d3 (docs/statistics.md §1.2 quotes 400 000 samples within 2e-3): 200 000 seeded
    // subgroups of n = 9; the standard errors are about 0.002 (d2) and 0.0015 (d3), so 0.01 is 5 sigma.
    [Fact]
    public void RangeMeanAndSd_N9_AgreeWithSeededMonteCarlo()
    {
        var random = new Random(20251202);
        var moments = new RunningMoments();
        var sample = new double[9];
        for (var k = 0; k < 200_000; k++)
        {
            Normal.Samples(random, sample, 0.0, 1.0);
            moments.Add(sample.Max() - sample.Min());
        }

        var exact = ControlChartConstants.Get(9);
        Assert.Equal(exact.RangeMean, moments.Mean, 0.01);
        Assert.Equal(exact.RangeSd, moments.SampleStandardDeviation, 0.01);
    }

    // Exact values to 6 decimals as listed in docs/statistics.md §1.3 (the reference implementation's values).
    [Fact]
    public void Exact_AllEntries_MatchNoteSixDecimalValues()
    {
        var failures = new List<string>();
        foreach (var (n, cells) in NoteTable13.Rows)
        {
            var values = Columns(ControlChartConstants.Get(n, ConstantsMode.Exact));
            for (var c = 0; c < cells.Length; c++)
            {
                var listed = double.Parse(cells[c].Exact6, CultureInfo.InvariantCulture);
                if (Math.Abs(values[c] - listed) > 5.000001e-7)
                {
                    failures.Add($"{NoteTable13.Columns[c]}({n}) = {values[c]:F9}, note {cells[c].Exact6}");
                }
            }
        }

        Assert.Empty(failures);
    }

    // Montgomery, Introduction to Statistical Quality Control, Appendix VI, as transcribed in docs/statistics.md §1.3
    // (case 24_pub_constants_table): all 216 printed entries equal the exact value rounded to the printed
    // number of decimals, except exactly the eight † entries, which are one unit off in the last place.
    [Fact]
    public void Exact_RoundedToPrintedPrecision_MatchesMontgomeryAppendixVIExceptTheEightDaggerEntries()
    {
        var checkedEntries = 0;
        var offByOne = new List<string>();
        var failures = new List<string>();
        foreach (var (n, cells) in NoteTable13.Rows)
        {
            var values = Columns(ControlChartConstants.Get(n, ConstantsMode.Exact));
            for (var c = 0; c < cells.Length; c++)
            {
                checkedEntries++;
                var decimals = cells[c].Printed.Length - cells[c].Printed.IndexOf('.', StringComparison.Ordinal) - 1;
                var printed = double.Parse(cells[c].Printed, CultureInfo.InvariantCulture);
                var rounded = Math.Round(values[c], decimals, MidpointRounding.AwayFromZero);
                var units = Math.Round(Math.Abs(rounded - printed) * Math.Pow(10, decimals));
                var name = $"{NoteTable13.Columns[c]}({n})";
                if (units == 1)
                {
                    offByOne.Add(name);
                }

                if (cells[c].Dagger ? units != 1 : units != 0)
                {
                    failures.Add($"{name}: exact {values[c]:F6} rounds to {rounded}, printed {cells[c].Printed}");
                }
            }
        }

        Assert.Equal(216, checkedEntries);
        Assert.Empty(failures);
        string[] daggers = ["D4(3)", "D4(18)", "d3(19)", "D3(19)", "D4(19)", "D3(22)", "D4(22)", "D3(24)"];
        Assert.Equal(daggers.Order(StringComparer.Ordinal), offByOne.Order(StringComparer.Ordinal));
    }

    // Table mode returns the printed values digit for digit (docs/statistics.md §1.4), † entries included.
    [Fact]
    public void Table_AllPrintedColumns_EqualMontgomeryAppendixVIAsTranscribed()
    {
        foreach (var (n, cells) in NoteTable13.Rows)
        {
            var values = Columns(ControlChartConstants.Get(n, ConstantsMode.Table));
            for (var c = 0; c < cells.Length; c++)
            {
                Assert.Equal(double.Parse(cells[c].Printed, CultureInfo.InvariantCulture), values[c]);
            }
        }

        Assert.Equal(2.574, ControlChartConstants.Get(3, ConstantsMode.Table).D4);
    }

    // B5, B6, D1, D2 are not printed in docs/statistics.md §1.3: table mode rounds the exact values to three decimals.
    [Fact]
    public void Table_UnprintedFactors_AreExactRoundedToThreeDecimals()
    {
        for (var n = ControlChartConstants.MinSubgroupSize; n <= ControlChartConstants.MaxSubgroupSize; n++)
        {
            var exact = ControlChartConstants.Get(n, ConstantsMode.Exact);
            var table = ControlChartConstants.Get(n, ConstantsMode.Table);
            Assert.Equal(Math.Round(exact.B5, 3, MidpointRounding.AwayFromZero), table.B5);
            Assert.Equal(Math.Round(exact.B6, 3, MidpointRounding.AwayFromZero), table.B6);
            Assert.Equal(Math.Round(exact.D1, 3, MidpointRounding.AwayFromZero), table.D1);
            Assert.Equal(Math.Round(exact.D2, 3, MidpointRounding.AwayFromZero), table.D2);
            Assert.Equal(n, table.N);
        }
    }

    // The derived factors follow the formulas of docs/statistics.md §1.1 from d2, d3 and c4, checked on
    // values recomputed here (n = 7 has every max(0, ·) branch positive; n = 2 has all of them at 0).
    [Theory]
    [InlineData(2)]
    [InlineData(7)]
    [InlineData(25)]
    public void Exact_DerivedFactors_FollowDefinitions(int n)
    {
        var k = ControlChartConstants.Get(n);
        var spread = Math.Sqrt(1 - (k.C4 * k.C4));
        Assert.Equal(3 / (k.RangeMean * Math.Sqrt(n)), k.A2, 1e-15);
        Assert.Equal(3 / (k.C4 * Math.Sqrt(n)), k.A3, 1e-15);
        Assert.Equal(Math.Max(0, 1 - (3 * spread / k.C4)), k.B3, 1e-15);
        Assert.Equal(1 + (3 * spread / k.C4), k.B4, 1e-15);
        Assert.Equal(Math.Max(0, k.C4 - (3 * spread)), k.B5, 1e-15);
        Assert.Equal(k.C4 + (3 * spread), k.B6, 1e-15);
        Assert.Equal(Math.Max(0, k.RangeMean - (3 * k.RangeSd)), k.D1, 1e-15);
        Assert.Equal(k.RangeMean + (3 * k.RangeSd), k.D2, 1e-15);
        Assert.Equal(Math.Max(0, 1 - (3 * k.RangeSd / k.RangeMean)), k.D3, 1e-15);
        Assert.Equal(1 + (3 * k.RangeSd / k.RangeMean), k.D4, 1e-15);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(1)]
    [InlineData(26)]
    [InlineData(-5)]
    public void Get_SubgroupSizeOutsideTwoToTwentyFive_Throws(int n) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => ControlChartConstants.Get(n));

    [Fact]
    public void Get_UndefinedMode_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => ControlChartConstants.Get(5, (ConstantsMode)7));

    [Fact]
    public void All_BothModes_ListTwentyFourSizesInOrder()
    {
        foreach (var mode in new[] { ConstantsMode.Exact, ConstantsMode.Table })
        {
            var all = ControlChartConstants.All(mode);
            Assert.Equal(Enumerable.Range(2, 24), all.Select(k => k.N));
        }
    }

    [Fact]
    public void Get_ConcurrentFirstUse_ReturnsTheSameInstances()
    {
        var seen = new ChartConstants[64];
        Parallel.For(0, seen.Length, i => seen[i] = ControlChartConstants.Get(2 + (i % 24)));
        for (var i = 0; i < seen.Length; i++)
        {
            Assert.Same(ControlChartConstants.Get(2 + (i % 24)), seen[i]);
        }
    }

    // Target (common practice for an interactive page, no source): the whole exact table in under 50 ms (about 4 ms on an idle machine after JIT
    // warm-up). The best of three runs is taken so that a busy build machine does not fail the test.
    [Fact]
    public void RangeMoments_AllSizes_ComputeInUnderFiftyMilliseconds()
    {
        _ = RangeMoments.Compute(ControlChartConstants.MaxSubgroupSize);
        var best = double.PositiveInfinity;
        for (var run = 0; run < 3; run++)
        {
            var watch = Stopwatch.StartNew();
            _ = RangeMoments.Compute(ControlChartConstants.MaxSubgroupSize);
            best = Math.Min(best, watch.Elapsed.TotalMilliseconds);
        }

        Assert.True(best < 50, $"took {best:F1} ms");
    }

    private static double[] Columns(ChartConstants k) =>
        [k.RangeMean, k.RangeSd, k.C4, k.A2, k.A3, k.B3, k.B4, k.D3, k.D4];
}
