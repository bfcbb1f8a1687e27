using FinWatch.Statistics.Capability;

namespace FinWatch.Statistics.Tests.Capability;

public class CapabilityConfidenceTests
{
    // docs/statistics.md case 22 (Montgomery, Introduction to SQC, ch. 8, setup confirmed in a secondary source; printed
    // interval from memory): USL 62, LSL 38, n = 20, s = 1.75 → Ĉp = 24/10.5 = 2.2857; the book's
    // 1.57 ≤ Cp ≤ 3.01 uses the rounded 2.29; from the unrounded Ĉp the lower limit is 1.565 (docs/statistics.md case 22).
    [Fact]
    public void CpInterval_MontgomeryCase22_ReproducesPrintedLimits()
    {
        var cpHat = (62.0 - 38.0) / (6 * 1.75);
        Assert.Equal(2.2857, cpHat, 1e-4);

        var unrounded = CapabilityConfidence.CpInterval(cpHat, 20, 0.95);
        Assert.Equal(1.565, Math.Round(unrounded.Low, 3));
        Assert.Equal(3.01, Math.Round(unrounded.High, 2));

        var rounded = CapabilityConfidence.CpInterval(2.29, 20, 0.95);
        Assert.Equal(1.57, Math.Round(rounded.Low, 2));
        Assert.Equal(3.01, Math.Round(rounded.High, 2));
    }

    // Independent check of the chi-square quantiles through printed table values (standard chi-square
    // table, from memory): χ²_{0.025,19} = 8.907, χ²_{0.975,19} = 32.852, χ²_{0.05,19} = 10.117.
    [Fact]
    public void CpIntervalAndLowerBound_NineteenDegreesOfFreedom_MatchChiSquareTableValues()
    {
        var interval = CapabilityConfidence.CpInterval(1.0, 20, 0.95);
        Assert.Equal(Math.Sqrt(8.907 / 19), interval.Low, 1e-4);
        Assert.Equal(Math.Sqrt(32.852 / 19), interval.High, 1e-4);
        Assert.Equal(Math.Sqrt(10.117 / 19), CapabilityConfidence.CpLowerBound(1.0, 20, 0.95), 1e-4);
    }

    // docs/statistics.md case 22, second part (Montgomery ch. 8, from memory [M]): Ĉpk = 1.33, n = 20 →
    // 0.88 ≤ Cpk ≤ 1.78 by Bissell's formula. Hand value with z = 1.959964 (exact quantile, as the
    // reference implementation): 1.33·(1 ∓ 1.959964·√(1/(9·20·1.33²) + 1/38)) = 0.882606 / 1.777394.
    [Fact]
    public void CpkInterval_MontgomeryCase22_ReproducesBissellLimits()
    {
        var interval = CapabilityConfidence.CpkInterval(1.33, 20, 0.95);
        Assert.Equal(0.88, Math.Round(interval.Low, 2));
        Assert.Equal(1.78, Math.Round(interval.High, 2));
        Assert.Equal(0.8826060505594018, interval.Low, 1e-12);
        Assert.Equal(1.7773939494405984, interval.High, 1e-12);
    }

    // One-sided lower bound, hand value with z_0.95 = 1.644854: 1.33·(1 − 1.644854·√(…)) = 0.954535.
    [Fact]
    public void CpkLowerBound_Cpk133N20_MatchesHandValue() =>
        Assert.Equal(0.954535161759003, CapabilityConfidence.CpkLowerBound(1.33, 20, 0.95), 1e-12);

    // FinWatch convention: for Ĉpk ≤ 0 the algebraically identical form Ĉpk ∓ z·√(1/(9N) + Ĉpk²/(2(N−1)))
    // keeps the interval finite and ordered; at Ĉpk = 0 its half-width is z/(3√N).
    [Fact]
    public void CpkInterval_ZeroAndNegativeEstimate_FiniteAndOrdered()
    {
        var atZero = CapabilityConfidence.CpkInterval(0.0, 25, 0.95);
        Assert.Equal(-1.959963984540054 / 15.0, atZero.Low, 1e-12);
        Assert.Equal(1.959963984540054 / 15.0, atZero.High, 1e-12);

        var negative = CapabilityConfidence.CpkInterval(-0.5, 25, 0.95);
        Assert.True(negative.Low < -0.5 && negative.High > -0.5);
    }

    [Fact]
    public void Intervals_HigherConfidence_AreWider()
    {
        var i90 = CapabilityConfidence.CpkInterval(1.2, 30, 0.90);
        var i99 = CapabilityConfidence.CpkInterval(1.2, 30, 0.99);
        Assert.True(i99.Low < i90.Low && i99.High > i90.High);
        var c90 = CapabilityConfidence.CpInterval(1.2, 30, 0.90);
        var c99 = CapabilityConfidence.CpInterval(1.2, 30, 0.99);
        Assert.True(c99.Low < c90.Low && c99.High > c90.High);
    }

    [Theory]
    [InlineData(1.0, 1, 0.95)]
    [InlineData(1.0, 20, 1.0)]
    [InlineData(1.0, 20, 0.0)]
    [InlineData(double.NaN, 20, 0.95)]
    [InlineData(-1.0, 20, 0.95)]
    public void CpInterval_InvalidArguments_Throw(double cp, int n, double confidence) =>
        Assert.Throws<ArgumentOutOfRangeException>(() => CapabilityConfidence.CpInterval(cp, n, confidence));
}
