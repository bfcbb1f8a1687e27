using FinWatch.Statistics.Capability;

namespace FinWatch.Statistics.Tests.Capability;

public class ProcessCapabilityTests
{
    // 20 values with mean 50 and sample sd exactly 1.75 (an arithmetic sequence rescaled: the sd of
    // 1..20 is √35).
    private static double[] Case22Data() =>
        Enumerable.Range(1, 20).Select(i => 50.0 + (1.75 * (i - 10.5) / Math.Sqrt(35.0))).ToArray();

    // docs/statistics.md case 22 end to end (Montgomery ch. 8): USL 62, LSL 38, s = 1.75, n = 20.
    [Fact]
    public void Compute_MontgomeryCase22_GivesCpAndItsInterval()
    {
        var result = ProcessCapability.Compute(Case22Data(), 1.75, new SpecLimits(38, 62));

        Assert.Equal(20, result.N);
        Assert.Equal(50.0, result.Mean!.Value, 1e-12);
        Assert.Equal(1.75, result.SigmaOverall!.Value, 1e-12);
        Assert.Equal(24.0 / 10.5, result.Cp!.Value, 1e-12);
        Assert.Equal(24.0 / 10.5, result.Pp!.Value, 1e-12);
        Assert.Equal(1.565, Math.Round(result.Intervals[CapabilityIndexNames.Cp].Low, 3));
        Assert.Equal(3.01, Math.Round(result.Intervals[CapabilityIndexNames.Cp].High, 2));
        Assert.Equal(result.Intervals[CapabilityIndexNames.Cp].Low, result.Intervals[CapabilityIndexNames.Pp].Low, 1e-12);
        Assert.Equal(result.Intervals[CapabilityIndexNames.Cp].High, result.Intervals[CapabilityIndexNames.Pp].High, 1e-12);
        Assert.Equal(0.95, result.ConfidenceLevel);
        Assert.Equal(ProcessCapability.WithinIntervalNote, result.IntervalNote);
    }

    // Hand-derivable: a symmetric sample centred in the specification has Cpu = Cpl = Cpk = Cp.
    [Fact]
    public void Compute_CentredSymmetricProcess_CpkEqualsCp()
    {
        double[] values = [9.0, 9.5, 10.0, 10.5, 11.0];
        var result = ProcessCapability.Compute(values, 0.5, new SpecLimits(7.0, 13.0));

        Assert.Equal(6.0 / (6 * 0.5), result.Cp!.Value, 1e-12);
        Assert.Equal(result.Cp.Value, result.Cpk!.Value, 1e-12);
        Assert.Equal(result.Cpu!.Value, result.Cpl!.Value, 1e-12);
        Assert.Equal(result.Pp!.Value, result.Ppk!.Value, 1e-12);
    }

    // Hand-derivable: shifting the process by δ gives Cpk = Cp − |δ|/(3σ) (Kane 1986, Cpk = Cp(1 − k)).
    [Theory]
    [InlineData(0.3)]
    [InlineData(-0.7)]
    [InlineData(2.5)]
    public void Compute_ShiftedProcess_CpkIsCpMinusShiftOverThreeSigma(double delta)
    {
        double[] values = [9.0 + delta, 9.5 + delta, 10.0 + delta, 10.5 + delta, 11.0 + delta];
        const double sigma = 0.4;
        var result = ProcessCapability.Compute(values, sigma, new SpecLimits(7.0, 13.0));

        Assert.Equal(result.Cp!.Value - (Math.Abs(delta) / (3 * sigma)), result.Cpk!.Value, 1e-12);
        Assert.Equal(result.Pp!.Value - (Math.Abs(delta) / (3 * result.SigmaOverall!.Value)), result.Ppk!.Value, 1e-12);
    }

    // Normal-theory ppm: centred process with limits at ±3 sigma: Φ(−3)·10⁶ = 1349.898 ppm per side
    // (standard normal table, Φ(−3) = 0.0013498980316301).
    [Fact]
    public void Compute_LimitsAtThreeSigma_PpmWithinIsTwiceTailProbability()
    {
        double[] values = [9.0, 10.0, 11.0];
        var result = ProcessCapability.Compute(values, 1.0, new SpecLimits(7.0, 13.0));

        Assert.Equal(1349.8980316301, result.PpmWithin!.Value.BelowLower!.Value, 1e-6);
        Assert.Equal(1349.8980316301, result.PpmWithin.Value.AboveUpper!.Value, 1e-6);
        Assert.Equal(2699.7960632602, result.PpmWithin.Value.Total, 1e-6);

        // Overall sigma of {9, 10, 11} is 1 too.
        Assert.Equal(2699.7960632602, result.PpmOverall!.Value.Total, 1e-6);
    }

    // Cpm (Chan, Cheng and Spiring 1988): {9, 10, 11} has x̄ = 10, s = 1; with T = 11,
    // Cpm = 12/(6·√(1 + 1)) = √2; with the default target (midpoint 10) Cpm = 12/6 = 2.
    [Fact]
    public void Compute_Cpm_UsesGivenTargetElseMidpoint()
    {
        double[] values = [9.0, 10.0, 11.0];
        var withTarget = ProcessCapability.Compute(values, 1.0, new SpecLimits(4.0, 16.0, 11.0));
        var midpoint = ProcessCapability.Compute(values, 1.0, new SpecLimits(4.0, 16.0));

        Assert.Equal(Math.Sqrt(2.0), withTarget.Cpm!.Value, 1e-12);
        Assert.Equal(11.0, withTarget.CpmTarget);
        Assert.Equal(2.0, midpoint.Cpm!.Value, 1e-12);
        Assert.Equal(10.0, midpoint.CpmTarget);
    }

    // docs/statistics.md §5.1: with only an upper limit, Cpk = Cpu and Cp, Pp (and Cpm) are undefined, with reasons.
    [Fact]
    public void Compute_UpperLimitOnly_CpNullWithReasonAndCpkEqualsCpu()
    {
        double[] values = [9.0, 10.0, 11.0];
        var result = ProcessCapability.Compute(values, 1.0, new SpecLimits(null, 14.0));

        Assert.Null(result.Cp);
        Assert.Null(result.Pp);
        Assert.Null(result.Cpl);
        Assert.Null(result.Cpm);
        Assert.Contains("one-sided", result.Reasons["Cp"], StringComparison.Ordinal);
        Assert.Contains("one-sided", result.Reasons["Pp"], StringComparison.Ordinal);
        Assert.Equal(4.0 / 3.0, result.Cpu!.Value, 1e-12);
        Assert.Equal(result.Cpu, result.Cpk);
        Assert.Null(result.PpmWithin!.Value.BelowLower);
        Assert.False(result.Intervals.ContainsKey(CapabilityIndexNames.Cp));
        Assert.True(result.Intervals.ContainsKey(CapabilityIndexNames.Cpk));
        Assert.True(result.Reasons.ContainsKey("Intervals.Cp"));
    }

    [Fact]
    public void Compute_NoSpecification_AllIndicesNullWithReason()
    {
        var result = ProcessCapability.Compute([1.0, 2.0, 3.0], 1.0, new SpecLimits(null, null));

        Assert.Null(result.Cp);
        Assert.Null(result.Cpk);
        Assert.Null(result.Ppk);
        Assert.Null(result.PpmWithin);
        Assert.Equal("no specification limit given", result.Reasons["Cpk"]);
        Assert.Empty(result.Intervals);
        AssertNoNonFinite(result);
    }

    [Fact]
    public void Compute_Empty_EverythingNullWithReasons()
    {
        var result = ProcessCapability.Compute([], 1.0, new SpecLimits(0, 10));

        Assert.Equal(0, result.N);
        Assert.Null(result.Mean);
        Assert.Null(result.Cp);
        Assert.Null(result.Pp);
        Assert.Equal("no values", result.Reasons["Cp"]);
        Assert.Empty(result.Intervals);
        Assert.Empty(result.LowerBounds);
        AssertNoNonFinite(result);
    }

    // One value: the within indices exist (sigma_w is supplied); overall sigma, Pp* and intervals do not.
    [Fact]
    public void Compute_SingleValue_WithinIndicesOnly()
    {
        var result = ProcessCapability.Compute([5.0], 1.0, new SpecLimits(2.0, 11.0));

        Assert.Equal(1.5, result.Cp!.Value, 1e-12);
        Assert.Equal(1.0, result.Cpk!.Value, 1e-12);
        Assert.Null(result.SigmaOverall);
        Assert.Null(result.Ppk);
        Assert.Contains("at least 2 values", result.Reasons["Ppk"], StringComparison.Ordinal);
        Assert.Empty(result.Intervals);
        AssertNoNonFinite(result);
    }

    // docs/statistics.md §3.3.9: constant data give undefined (null with a reason) indices, never ±infinity.
    [Fact]
    public void Compute_ConstantSeries_NullsWithReasonsNotInfinity()
    {
        var result = ProcessCapability.Compute([7.0, 7.0, 7.0, 7.0], 0.0, new SpecLimits(5.0, 9.0));

        Assert.Equal(0.0, result.SigmaOverall);
        Assert.Null(result.Cp);
        Assert.Null(result.Cpk);
        Assert.Null(result.Pp);
        Assert.Null(result.Ppk);
        Assert.Null(result.Cpm);
        Assert.Null(result.PpmOverall);
        Assert.Contains("zero", result.Reasons["Cp"], StringComparison.Ordinal);
        Assert.Contains("zero", result.Reasons["Pp"], StringComparison.Ordinal);
        Assert.Contains("infinite", result.Reasons["Cpm"], StringComparison.Ordinal);
        AssertNoNonFinite(result);
    }

    [Fact]
    public void Compute_WithinSigmaNaN_WithinIndicesNullOverallComputed()
    {
        var result = ProcessCapability.Compute([9.0, 10.0, 11.0], double.NaN, new SpecLimits(7.0, 13.0));

        Assert.Null(result.SigmaWithin);
        Assert.Null(result.Cpk);
        Assert.Equal(1.0, result.Ppk!.Value, 1e-12);
        AssertNoNonFinite(result);
    }

    // Huge magnitudes (STYLE 3.12): a 1e9 offset on data, limits and target changes nothing beyond the
    // representation of the inputs (doubles near 1e9 are spaced 1.2e-7 apart, so USL − LSL = 2.2 is itself
    // known to about 5e-8 relative).
    [Fact]
    public void Compute_BillionOffset_SameIndicesAsWithoutOffset()
    {
        double[] small = [0.1, -0.3, 0.25, 0.05, -0.12, 0.33, -0.2, 0.0];
        var offset = small.Select(v => v + 1e9).ToArray();
        var a = ProcessCapability.Compute(small, 0.2, new SpecLimits(-1.0, 1.2, 0.1));
        var b = ProcessCapability.Compute(offset, 0.2, new SpecLimits(1e9 - 1.0, 1e9 + 1.2, 1e9 + 0.1));

        Assert.Equal(a.Cpk!.Value, b.Cpk!.Value, 1e-6);
        Assert.Equal(a.Ppk!.Value, b.Ppk!.Value, 1e-6);
        Assert.Equal(a.Cp!.Value, b.Cp!.Value, 1e-6);
        Assert.Equal(a.Cpm!.Value, b.Cpm!.Value, 1e-6);
        Assert.Equal(a.SigmaOverall!.Value, b.SigmaOverall!.Value, 1e-7);
    }

    [Fact]
    public void Compute_MissingValues_AreSkipped()
    {
        double[] values = [9.0, double.NaN, 10.0, 11.5, double.NaN];
        var withGaps = ProcessCapability.Compute(values, 1.0, new SpecLimits(7.0, 13.0));
        var without = ProcessCapability.Compute([9.0, 10.0, 11.5], 1.0, new SpecLimits(7.0, 13.0));

        Assert.Equal(3, withGaps.N);
        Assert.Equal(without.Ppk, withGaps.Ppk);
        Assert.Equal(without.Cpk, withGaps.Cpk);
    }

    // A one-sided 95 % lower bound is above the lower limit of the two-sided 95 % interval.
    [Fact]
    public void Compute_LowerBounds_LieInsideTwoSidedInterval()
    {
        var result = ProcessCapability.Compute(Case22Data(), 1.75, new SpecLimits(38, 62));
        foreach (var key in new[] { CapabilityIndexNames.Cp, CapabilityIndexNames.Cpk, CapabilityIndexNames.Pp, CapabilityIndexNames.Ppk })
        {
            Assert.InRange(result.LowerBounds[key], result.Intervals[key].Low, result.Intervals[key].High);
        }
    }

    [Fact]
    public void Compute_CallerMistakes_Throw()
    {
        double[] values = [1.0, 2.0];
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute(values, -1.0, new SpecLimits(0, 3)));
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute(values, double.PositiveInfinity, new SpecLimits(0, 3)));
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute(values, 1.0, new SpecLimits(3, 3)));
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute(values, 1.0, new SpecLimits(4, 3)));
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute(values, 1.0, new SpecLimits(double.NaN, 3)));
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute(values, 1.0, new SpecLimits(0, 3), 1.0));
        Assert.Throws<ArgumentOutOfRangeException>(() => ProcessCapability.Compute([1.0, double.PositiveInfinity], 1.0, new SpecLimits(0, 3)));
    }

    internal static void AssertNoNonFinite(CapabilityResult result)
    {
        double?[] members =
        [
            result.Mean, result.SigmaWithin, result.SigmaOverall, result.Cp, result.Cpu, result.Cpl, result.Cpk,
            result.Pp, result.Ppu, result.Ppl, result.Ppk, result.Cpm, result.CpmTarget,
            result.PpmWithin?.Total, result.PpmOverall?.Total,
        ];
        Assert.All(members, m => Assert.True(m is null || double.IsFinite(m.Value)));
        Assert.All(result.Intervals.Values, i => Assert.True(double.IsFinite(i.Low) && double.IsFinite(i.High)));
        Assert.All(result.LowerBounds.Values, b => Assert.True(double.IsFinite(b)));
    }
}
