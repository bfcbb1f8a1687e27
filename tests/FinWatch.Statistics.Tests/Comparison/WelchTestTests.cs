using FinWatch.Statistics.Comparison;

namespace FinWatch.Statistics.Tests.Comparison;

public class WelchTestTests
{
    // Reference: SciPy 1.10.1, scipy.stats.ttest_ind(second, first, equal_var=False) (Debian's python3-scipy), and ν
    // by the Welch–Satterthwaite formula in NumPy; invented top widths in nm, 8 before and 6 after a shift.
    [Fact]
    public void Compare_ShiftedSecondSample_MatchesSciPy()
    {
        double[] before = [6.02, 5.97, 6.05, 5.99, 6.01, 6.03, 5.96, 6.00];
        double[] after = [6.10, 6.18, 6.07, 6.15, 6.21, 6.12];

        var r = WelchTest.Compare(before, after);

        Assert.Equal((8, 6), (r.FirstCount, r.SecondCount));
        Assert.Equal(6.00375, r.FirstMean, 1e-12);
        Assert.Equal(6.138333333333333, r.SecondMean, 1e-12);
        Assert.Equal(0.0009125, r.FirstVariance, 1e-14);
        Assert.Equal(0.0026966666666666666, r.SecondVariance, 1e-14);
        Assert.Equal(5.669459331983296, r.T, 1e-9);
        Assert.Equal(7.5141995885237005, r.DegreesOfFreedom, 1e-9);
        Assert.Equal(0.0005898636509735571, r.PValue, 1e-10);
    }

    // Reference: SciPy 1.10.1 as above; unequal sizes and variances, no shift worth the name.
    [Fact]
    public void Compare_NoisySamplesWithoutShift_MatchSciPy()
    {
        double[] before = [10.1, 9.8, 10.4, 9.9, 10.2];
        double[] after = [10.0, 10.9, 9.5, 10.6, 9.7, 10.3, 10.8];

        var r = WelchTest.Compare(before, after);

        Assert.Equal(0.764335872818601, r.T, 1e-9);
        Assert.Equal(8.719218199066308, r.DegreesOfFreedom, 1e-9);
        Assert.Equal(0.46484814920762807, r.PValue, 1e-9);
    }

    // Analytic: {0, 2} against {4, 6}: means 1 and 5, variances 2 and 2, SE = √(2/2 + 2/2) = √2, t = 4/√2 = 2√2;
    // ν = (1 + 1)²/(1/1 + 1/1) = 2 exactly. Student's t with ν = 2 has F(t) = 1/2 + t/(2√(2 + t²)), so
    // p = 1 − t/√(2 + t²) = 1 − √(8/10) = 1 − 2/√5.
    [Fact]
    public void Compare_TwoValuesEach_GivesTheClosedFormForTwoDegreesOfFreedom()
    {
        var r = WelchTest.Compare([0, 2], [4, 6]);

        Assert.Equal(4.0, r.Difference, 1e-15);
        Assert.Equal(Math.Sqrt(2), r.StandardError, 1e-15);
        Assert.Equal(2 * Math.Sqrt(2), r.T, 1e-14);
        Assert.Equal(2.0, r.DegreesOfFreedom, 1e-14);
        Assert.Equal(1 - (2 / Math.Sqrt(5)), r.PValue, 1e-12);
    }

    // Analytic: equal sizes and equal variances make Welch's t the pooled Student t and ν = 2n − 2. {1, 2, 3} against
    // {4, 5, 6}: t = 3/√(2/3), ν = 4; for ν = 4, F(t) = 1/2 + (3/4)·x·(1 − x²/3) with x = t/√(4 + t²).
    [Fact]
    public void Compare_EqualSizesAndVariances_IsThePooledTestWithFourDegreesOfFreedom()
    {
        var r = WelchTest.Compare([1, 2, 3], [4, 5, 6]);

        var t = 3 / Math.Sqrt(2.0 / 3.0);
        var x = t / Math.Sqrt(4 + (t * t));
        Assert.Equal(t, r.T, 1e-13);
        Assert.Equal(4.0, r.DegreesOfFreedom, 1e-13);
        Assert.Equal(2 * (0.5 - (0.75 * x * (1 - (x * x / 3)))), r.PValue, 1e-12);
    }

    // Analytic: swapping the samples changes the sign of t and nothing else.
    [Fact]
    public void Compare_SwappedSamples_NegatesTAndKeepsP()
    {
        double[] a = [10.1, 9.8, 10.4, 9.9, 10.2];
        double[] b = [10.0, 10.9, 9.5, 10.6, 9.7, 10.3, 10.8];

        var ab = WelchTest.Compare(a, b);
        var ba = WelchTest.Compare(b, a);

        Assert.Equal(-ab.T, ba.T, 1e-14);
        Assert.Equal(ab.DegreesOfFreedom, ba.DegreesOfFreedom, 1e-12);
        Assert.Equal(ab.PValue, ba.PValue, 1e-14);
    }

    [Fact]
    public void Compare_MissingValues_AreSkipped()
    {
        var r = WelchTest.Compare([0, double.NaN, 2], [4, 6, double.NaN]);

        Assert.Equal((2, 2), (r.FirstCount, r.SecondCount));
        Assert.Equal(2 * Math.Sqrt(2), r.T, 1e-14);
    }

    [Fact]
    public void Compare_FewerThanTwoValues_GivesNaN()
    {
        var r = WelchTest.Compare([5.0], [4, 6]);

        Assert.Equal(5.0, r.FirstMean);
        Assert.True(double.IsNaN(r.FirstVariance));
        Assert.True(double.IsNaN(r.T));
        Assert.True(double.IsNaN(r.PValue));
        Assert.True(double.IsNaN(WelchTest.Compare([], []).FirstMean));
    }

    // Constant samples: no spread, so any difference is certain and no difference says nothing.
    [Fact]
    public void Compare_NoSpread_IsCertainWhenMeansDifferAndUndecidedWhenEqual()
    {
        var differ = WelchTest.Compare([3, 3, 3], [4, 4]);
        Assert.Equal(double.PositiveInfinity, differ.T);
        Assert.Equal(0.0, differ.PValue);

        var equal = WelchTest.Compare([3, 3, 3], [3, 3]);
        Assert.True(double.IsNaN(equal.T));
        Assert.True(double.IsNaN(equal.PValue));
    }

    // Huge magnitude: an offset of 1e9 changes neither t nor ν (the moments are accumulated about the running mean).
    [Fact]
    public void Compare_LargeOffset_KeepsTheResult()
    {
        double[] a = [6.02, 5.97, 6.05, 5.99, 6.01, 6.03, 5.96, 6.00];
        double[] b = [6.10, 6.18, 6.07, 6.15, 6.21, 6.12];

        var shifted = WelchTest.Compare([.. a.Select(v => v + 1e9)], [.. b.Select(v => v + 1e9)]);

        Assert.Equal(5.669459331983296, shifted.T, 1e-4);
        Assert.Equal(7.5141995885237005, shifted.DegreesOfFreedom, 1e-3);
    }

    [Fact]
    public void Compare_InfiniteValue_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => WelchTest.Compare([1, double.PositiveInfinity], [1, 2]));
}
