using FinWatch.Statistics.Capability;
using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Tests.Capability;

public class AndersonDarlingTests
{
    private static readonly double[] SmallSet = [2.1, 3.4, 1.9, 5.6, 4.4, 3.3, 2.8, 4.9, 3.9, 4.1];
    private static readonly double[] Skewed = [1, 1, 1, 1, 2, 2, 3, 5, 8, 13, 21, 34];

    // The defining formula of docs/statistics.md §6 (Stephens 1974; D'Agostino and Stephens 1986), written out here
    // independently with MathNet's Φ and a plain ln(1 − F).
    private static double DefiningFormula(double[] x)
    {
        var n = x.Length;
        var mean = x.Average();
        var s = Math.Sqrt(x.Sum(v => (v - mean) * (v - mean)) / (n - 1));
        var f = x.Order().Select(v => Normal.CDF(mean, s, v)).ToArray();
        var sum = 0.0;
        for (var i = 1; i <= n; i++)
        {
            sum += ((2 * i) - 1) * (Math.Log(f[i - 1]) + Math.Log(1 - f[n - i]));
        }

        return -n - (sum / n);
    }

    [Theory]
    [MemberData(nameof(DataSets))]
    public void Test_SmallDataSets_ASquaredMatchesDefiningFormula(double[] data)
    {
        var result = AndersonDarling.Test(data);
        Assert.Equal(DefiningFormula(data), result.ASquared!.Value, 1e-12);
        var n = data.Length;
        Assert.Equal(result.ASquared.Value * (1 + (0.75 / n) + (2.25 / (n * n))), result.AStar!.Value, 1e-12);
    }

    public static TheoryData<double[]> DataSets() => new() { SmallSet, Skewed, new[] { 10.2, 9.8, 10.1, 9.9, 10.0, 10.3, 9.7, 10.6, 9.5, 10.05, 12.0, 8.9 } };

    // Hand values (computed outside .NET with Python's math and statistics.NormalDist from the formulas of
    // docs/statistics.md §6): SmallSet A² = 0.129394799421, A* = 0.142010792365, p = 0.972263497286 (first branch);
    // Skewed A² = 1.409313175214, A* = 1.519415767028, p from the last branch.
    [Fact]
    public void Test_HandComputedSets_MatchStatisticAndPValue()
    {
        var small = AndersonDarling.Test(SmallSet);
        Assert.Equal(0.12939479942128784, small.ASquared!.Value, 1e-11);
        Assert.Equal(0.1420107923648634, small.AStar!.Value, 1e-11);
        Assert.Equal(0.972263497286044, small.PValue!.Value, 1e-10);
        Assert.Null(small.Note);
        Assert.Null(small.Reason);

        var skewed = AndersonDarling.Test(Skewed);
        Assert.Equal(1.4093131752141375, skewed.ASquared!.Value, 1e-11);
        var a = skewed.AStar!.Value;
        Assert.Equal(Math.Exp(1.2937 - (5.709 * a) + (0.0186 * a * a)), skewed.PValue!.Value, 1e-12);
        Assert.True(skewed.PValue < 0.01);
    }

    // Each branch of the p-value table of docs/statistics.md §6, at points inside and on the branch boundaries (a value
    // exactly at 0.2, 0.34 or 0.6 belongs to the branch above it). Expected values computed in Python
    // from the table.
    [Theory]
    [InlineData(0.1, 0.9961485285157409)]
    [InlineData(0.2, 0.8842497006682848)]
    [InlineData(0.25, 0.7446512446013425)]
    [InlineData(0.34, 0.49823272093443194)]
    [InlineData(0.5, 0.20871199326901024)]
    [InlineData(0.6, 0.11943249053580206)]
    [InlineData(1.0, 0.012317922048460184)]
    [InlineData(3.0, 1.5717594347363436e-07)]
    public void PValue_EachBranch_MatchesTableFormula(double aStar, double expected) =>
        Assert.Equal(expected, AndersonDarling.PValue(aStar), Math.Max(1e-12, expected * 1e-10));

    // FinWatch convention (docs/statistics.md): past the turning point of the last branch (A* ≈ 153.5) p is held at its
    // minimum instead of rising to 1 (the literal formula exceeds 1 for A* > 307).
    [Fact]
    public void PValue_BeyondLastBranchTurningPoint_StaysAtMinimum()
    {
        Assert.True(AndersonDarling.PValue(400) < 1e-180);
        Assert.Equal(AndersonDarling.PValue(AndersonDarling.LastBranchTurningPoint), AndersonDarling.PValue(400));
        Assert.True(AndersonDarling.PValue(100) > AndersonDarling.PValue(150));
    }

    // Grossly non-normal data with many points: p in [0, 1] and tiny.
    [Fact]
    public void Test_LargeExponentialSample_PValueClippedAndTiny()
    {
        var random = new Random(7);
        var data = Enumerable.Range(0, 20000).Select(_ => -Math.Log(1 - random.NextDouble())).ToArray();
        var result = AndersonDarling.Test(data);
        Assert.True(result.AStar > 100);
        Assert.InRange(result.PValue!.Value, 0.0, 1e-100);
    }

    [Fact]
    public void Test_SeededNormalSample_DoesNotRejectAtOnePercent()
    {
        var data = new double[200];
        Normal.Samples(new Random(11), data, 5.0, 2.0);
        var result = AndersonDarling.Test(data);
        Assert.True(result.PValue > 0.01, $"p = {result.PValue}");
    }

    [Fact]
    public void Test_FewerThanEightValues_CarriesNote()
    {
        var result = AndersonDarling.Test([1.0, 2.5, 2.0, 4.0, 3.1]);
        Assert.NotNull(result.PValue);
        Assert.Contains("n >= 8", result.Note, StringComparison.Ordinal);
    }

    [Theory]
    [InlineData(new double[0])]
    [InlineData(new[] { 1.0 })]
    [InlineData(new[] { 1.0, 2.0 })]
    [InlineData(new[] { 1.0, double.NaN, 2.0 })]
    public void Test_FewerThanThreeValues_NullWithReason(double[] data)
    {
        var result = AndersonDarling.Test(data);
        Assert.Null(result.ASquared);
        Assert.Null(result.PValue);
        Assert.Contains("at least 3", result.Reason, StringComparison.Ordinal);
    }

    [Fact]
    public void Test_ConstantSeries_NullWithReason()
    {
        var result = AndersonDarling.Test([4.2, 4.2, 4.2, 4.2, 4.2, 4.2, 4.2, 4.2, 4.2]);
        Assert.Null(result.ASquared);
        Assert.Null(result.PValue);
        Assert.Contains("zero", result.Reason, StringComparison.Ordinal);
    }

    // A* is location and scale invariant, so a 1e9 offset changes nothing (to the input's resolution).
    [Fact]
    public void Test_BillionOffset_SameStatistic()
    {
        var shifted = SmallSet.Select(v => v + 1e9).ToArray();
        Assert.Equal(AndersonDarling.Test(SmallSet).ASquared!.Value, AndersonDarling.Test(shifted).ASquared!.Value, 1e-6);
    }

    // One far outlier puts F within rounding of 1; ln(1 − F) is evaluated as ln Φ(−z), so A² stays finite.
    [Fact]
    public void Test_ExtremeOutlierInLargeSample_FiniteStatistic()
    {
        var data = Enumerable.Range(0, 5000).Select(i => (double)(i % 7)).Append(1e6).ToArray();
        var result = AndersonDarling.Test(data);
        Assert.True(double.IsFinite(result.ASquared!.Value));
        Assert.Equal(0.0, result.PValue!.Value, 1e-100);
    }

    [Fact]
    public void Test_MissingValues_AreSkipped()
    {
        var withGaps = SmallSet.Prepend(double.NaN).Append(double.NaN).ToArray();
        Assert.Equal(AndersonDarling.Test(SmallSet), AndersonDarling.Test(withGaps) with { N = 10 });
        Assert.Equal(10, AndersonDarling.Test(withGaps).N);
    }

    [Fact]
    public void Test_InfiniteValue_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => AndersonDarling.Test([1.0, 2.0, double.NegativeInfinity]));
}
