using FinWatch.Statistics.Capability;
using MathNet.Numerics.Distributions;

namespace FinWatch.Statistics.Tests.Capability;

public class PercentileCapabilityTests
{
    // Hand-computed 5-point set (docs/statistics.md §7): x = e^0, e^0.5, e^1, e^1.5, e^2, so mu = 1 and
    // sigma = √(mean of 1, 0.25, 0, 0.25, 1) = √0.5 (divisor n). With Φ⁻¹(0.99865) = 2.999976992703
    // (Python statistics.NormalDist): x_0.00135 = 0.325854578635, x_0.99865 = 22.675931484165,
    // median e = 2.718281828459; for LSL 0.5, USL 40: Cp = 1.767331726283, Cpu = 1.868041518651,
    // Cpl = Cpk = 0.927209731716.
    [Fact]
    public void Lognormal_FivePointSet_MatchesHandComputation()
    {
        double[] values = [1.0, Math.Exp(0.5), Math.E, Math.Exp(1.5), Math.Exp(2.0)];
        var r = PercentileCapability.Lognormal(values, new SpecLimits(0.5, 40.0));

        Assert.Equal(PercentileCapability.MethodLabel, r.Method);
        Assert.Equal("percentile method, fitted lognormal (overall variation)", r.Method);
        Assert.Equal(5, r.N);
        Assert.Equal(1.0, r.Mu!.Value, 1e-14);
        Assert.Equal(Math.Sqrt(0.5), r.Sigma!.Value, 1e-14);
        Assert.Equal(Math.E, r.Median!.Value, 1e-13);
        Assert.Equal(0.32585457863509293, r.LowerPercentile!.Value, 1e-11);
        Assert.Equal(22.6759314841646, r.UpperPercentile!.Value, 1e-10);
        Assert.Equal(1.7673317262826744, r.CpPercentile!.Value, 1e-10);
        Assert.Equal(1.868041518650606, r.CpuPercentile!.Value, 1e-10);
        Assert.Equal(0.9272097317158874, r.CplPercentile!.Value, 1e-10);
        Assert.Equal(r.CplPercentile, r.CpkPercentile);
        Assert.Empty(r.Reasons);
    }

    // Data generated as exp(N(mu, sigma)) with seeded draws: the indices recover the analytic values of the
    // generating lognormal. With n = 20 000 the standard error of the fitted sigma is sigma/√(2n), 0.5 %,
    // which moves the indices by about 0.5 %; the stated tolerance is 2 % relative (about 4 standard errors).
    [Theory]
    [InlineData(1.0, 0.25, 1.2, 6.5)]
    [InlineData(3.0, 0.6, 2.0, 150.0)]
    public void Lognormal_ExpOfNormalData_RecoversAnalyticIndices(double mu, double sigma, double lsl, double usl)
    {
        var logs = new double[20000];
        Normal.Samples(new Random(42), logs, mu, sigma);
        var values = logs.Select(Math.Exp).ToArray();
        var r = PercentileCapability.Lognormal(values, new SpecLimits(lsl, usl));

        var z = Normal.InvCDF(0, 1, 0.99865);
        var lo = Math.Exp(mu - (sigma * z));
        var hi = Math.Exp(mu + (sigma * z));
        var med = Math.Exp(mu);
        AssertRelative((usl - lsl) / (hi - lo), r.CpPercentile!.Value, 0.02);
        AssertRelative((usl - med) / (hi - med), r.CpuPercentile!.Value, 0.02);
        AssertRelative((med - lsl) / (med - lo), r.CplPercentile!.Value, 0.02);
        AssertRelative(sigma, r.Sigma!.Value, 0.02);
    }

    // docs/statistics.md §7: p = 0.00135 and 0.99865 exactly, not Φ(∓3); the percentiles use those probabilities.
    [Fact]
    public void Lognormal_Percentiles_UseExactTailProbabilities()
    {
        double[] values = [2.0, 3.0, 5.0, 4.0, 2.5, 3.5];
        var r = PercentileCapability.Lognormal(values, new SpecLimits(1.0, 9.0));
        var logUpper = Math.Log(r.UpperPercentile!.Value);
        Assert.Equal(0.99865, Normal.CDF(r.Mu!.Value, r.Sigma!.Value, logUpper), 1e-12);
        Assert.Equal(0.00135, Normal.CDF(r.Mu.Value, r.Sigma.Value, Math.Log(r.LowerPercentile!.Value)), 1e-12);
    }

    [Fact]
    public void Lognormal_UpperLimitOnly_CpNullAndCpkIsCpu()
    {
        var r = PercentileCapability.Lognormal([2.0, 3.0, 5.0, 4.0, 2.5], new SpecLimits(null, 20.0));
        Assert.Null(r.CpPercentile);
        Assert.Null(r.CplPercentile);
        Assert.Contains("one-sided", r.Reasons["CpPercentile"], StringComparison.Ordinal);
        Assert.Equal(r.CpuPercentile, r.CpkPercentile);
    }

    [Theory]
    [InlineData(0.0)]
    [InlineData(-1.5)]
    public void Lognormal_NonPositiveValue_FitUndefinedWithReason(double bad)
    {
        var r = PercentileCapability.Lognormal([2.0, 3.0, bad, 4.0], new SpecLimits(1.0, 9.0));
        Assert.Null(r.Mu);
        Assert.Null(r.CpkPercentile);
        Assert.Contains("<= 0", r.Reasons["CpkPercentile"], StringComparison.Ordinal);
        Assert.Equal(4, r.N);
    }

    [Fact]
    public void Lognormal_EmptyOrSingleValue_NullWithReason()
    {
        foreach (var data in new[] { Array.Empty<double>(), [3.0] })
        {
            var r = PercentileCapability.Lognormal(data, new SpecLimits(1.0, 9.0));
            Assert.Null(r.Sigma);
            Assert.Null(r.CpkPercentile);
            Assert.Contains("at least 2", r.Reasons["CpkPercentile"], StringComparison.Ordinal);
        }
    }

    [Fact]
    public void Lognormal_ConstantSeries_FitGivenIndicesNullWithReason()
    {
        var r = PercentileCapability.Lognormal([3.0, 3.0, 3.0, 3.0], new SpecLimits(1.0, 9.0));
        Assert.Equal(0.0, r.Sigma);
        Assert.Equal(3.0, r.Median!.Value, 1e-14);
        Assert.Null(r.CpPercentile);
        Assert.Null(r.CpkPercentile);
        Assert.Contains("zero", r.Reasons["CpkPercentile"], StringComparison.Ordinal);
    }

    [Fact]
    public void Lognormal_NoSpecification_FitGivenIndicesNull()
    {
        var r = PercentileCapability.Lognormal([2.0, 3.0, 4.0], new SpecLimits(null, null));
        Assert.NotNull(r.Sigma);
        Assert.Null(r.CpkPercentile);
        Assert.Equal("no specification limit given", r.Reasons["CpkPercentile"]);
    }

    // Huge magnitudes: values 1e9 + d with |d| ≤ 1 have a tiny relative spread, where the lognormal is
    // practically normal, so Cp_percentile ≈ (USL − LSL)/(6·s_n) with s_n the divisor-n sd of the values
    // (the lognormal's skew enters at relative order 1e-9). Tolerance 1e-4 relative covers the rounding
    // of ln and exp near 1e9.
    [Fact]
    public void Lognormal_BillionOffset_ReducesToNormalPerformanceIndex()
    {
        double[] d = [0.1, -0.3, 0.25, 0.05, -0.12, 0.33, -0.2, 0.0, 0.7, -0.55];
        var values = d.Select(v => 1e9 + v).ToArray();
        var mean = d.Average();
        var sn = Math.Sqrt(d.Sum(v => (v - mean) * (v - mean)) / d.Length);
        var r = PercentileCapability.Lognormal(values, new SpecLimits(1e9 - 2.0, 1e9 + 2.0));
        AssertRelative(4.0 / (6.0 * sn), r.CpPercentile!.Value, 1e-4);
        AssertRelative((2.0 + mean) / (3.0 * sn), r.CplPercentile!.Value, 1e-4);
    }

    [Fact]
    public void Lognormal_MissingValues_AreSkipped()
    {
        var a = PercentileCapability.Lognormal([2.0, 3.0, 5.0], new SpecLimits(1.0, 9.0));
        var b = PercentileCapability.Lognormal([double.NaN, 2.0, 3.0, double.NaN, 5.0], new SpecLimits(1.0, 9.0));
        Assert.Equal(a.CpkPercentile, b.CpkPercentile);
        Assert.Equal(3, b.N);
    }

    [Fact]
    public void Lognormal_InfiniteValue_Throws() =>
        Assert.Throws<ArgumentOutOfRangeException>(() => PercentileCapability.Lognormal([1.0, double.PositiveInfinity], new SpecLimits(0.5, 3.0)));

    private static void AssertRelative(double expected, double actual, double relative) =>
        Assert.True(Math.Abs(actual - expected) <= relative * Math.Abs(expected), $"expected {expected}, actual {actual}");
}
