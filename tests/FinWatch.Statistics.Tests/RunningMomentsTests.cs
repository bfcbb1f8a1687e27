namespace FinWatch.Statistics.Tests;

public class RunningMomentsTests
{
    // NIST StRD univariate summary statistics, certified values (https://www.itl.nist.gov/div898/strd/univ/):
    // "NumAcc1": 10000001, 10000003, 10000002 → mean 10000002, sd 1. The datasets are recalled from memory; their certified
    // values follow from them exactly (deviations of ±1 and 0), so the check does not depend on recall of digits.
    [Fact]
    public void Add_NistNumAcc1_MatchesCertifiedMeanAndSd()
    {
        var m = new RunningMoments();
        m.AddRange([10000001, 10000003, 10000002]);
        Assert.Equal(10000002, m.Mean, 1e-9);
        Assert.Equal(1.0, m.SampleStandardDeviation, 1e-12);
    }

    // NIST StRD "NumAcc4": 1000000000.2 followed by 1000 pairs of 1000000000.1 and 1000000000.3; certified mean
    // 1000000000.2, certified standard deviation 0.1 (sample, n − 1: 0.1 × sqrt(2000/2000) to the printed precision).
    [Fact]
    public void Add_NistNumAcc4LargeMagnitude_MatchesCertifiedValues()
    {
        var m = new RunningMoments();
        m.Add(1000000000.2);
        for (var i = 0; i < 1000; i++)
        {
            m.Add(1000000000.1);
            m.Add(1000000000.3);
        }

        Assert.Equal(1000000000.2, m.Mean, 1e-6);
        Assert.Equal(0.1, m.SampleStandardDeviation, 1e-7);
    }

    [Fact]
    public void Empty_HasNaNMeanAndVariance()
    {
        var m = new RunningMoments();
        Assert.Equal(0, m.Count);
        Assert.True(double.IsNaN(m.Mean));
        Assert.True(double.IsNaN(m.SampleVariance));
    }

    [Fact]
    public void SingleValue_HasMeanAndNaNSampleVariance()
    {
        var m = new RunningMoments();
        m.Add(4.2);
        Assert.Equal(4.2, m.Mean);
        Assert.True(double.IsNaN(m.SampleVariance));
        Assert.Equal(0, m.PopulationVariance);
    }

    [Fact]
    public void Constant_HasZeroVariance()
    {
        var m = new RunningMoments();
        m.AddRange([7.5, 7.5, 7.5, 7.5]);
        Assert.Equal(0, m.SampleVariance);
    }

    // Consistency: accumulating in pieces and combining equals accumulating in one go, within 1e-12.
    [Fact]
    public void Combine_TwoParts_EqualsOnePass()
    {
        var random = new Random(7);
        var values = Enumerable.Range(0, 1001).Select(_ => 6.0 + random.NextDouble()).ToArray();
        var whole = new RunningMoments();
        whole.AddRange(values);
        var a = new RunningMoments();
        a.AddRange(values.AsSpan(0, 377));
        var b = new RunningMoments();
        b.AddRange(values.AsSpan(377));
        var combined = RunningMoments.Combine(a, b);
        Assert.Equal(whole.Count, combined.Count);
        Assert.Equal(whole.Mean, combined.Mean, 1e-12);
        Assert.Equal(whole.SampleVariance, combined.SampleVariance, 1e-12);
    }

    [Fact]
    public void Add_NaN_Throws()
    {
        var m = new RunningMoments();
        Assert.Throws<ArgumentOutOfRangeException>(() => m.Add(double.NaN));
    }
}
