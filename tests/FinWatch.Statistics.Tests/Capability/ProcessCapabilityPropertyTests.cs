using FinWatch.Statistics.Capability;
using FsCheck;
using FsCheck.Fluent;
using FsCheck.Xunit;

namespace FinWatch.Statistics.Tests.Capability;

public class ProcessCapabilityPropertyTests
{
    /// <summary>A random capability case: values, within sigma, LSL, USL, target.</summary>
    public sealed record Case(double[] Values, double Sigma, double Lower, double Upper, double Target);

    private static readonly Gen<double> Unit = Gen.Choose(-1_000_000, 1_000_000).Select(i => i / 1e6);

    private static Arbitrary<Case> Cases() =>
        (from count in Gen.Choose(2, 40)
         from values in Gen.ArrayOf(Unit, count)
         from sigma in Gen.Choose(1, 1000)
         from lower in Unit
         from width in Gen.Choose(1, 4000)
         from target in Unit
         select new Case(
             values.Select(v => 10 * v).ToArray(),
             sigma / 100.0,
             (10 * lower) - 5,
             (10 * lower) - 5 + (width / 100.0),
             10 * target)).ToArbitrary();

    // Multiplying values, limits, target and sigma by c > 0 leaves every index unchanged (they are ratios
    // of lengths), and so the intervals and the ppm.
    [Property(MaxTest = 200)]
    public Property Compute_ScaledByPositiveConstant_IndicesUnchanged() =>
        Prop.ForAll(Cases(), Gen.Choose(-30, 30).Select(e => Math.Pow(10, e / 10.0)).ToArbitrary(), (c, scale) =>
        {
            var a = Run(c);
            var b = ProcessCapability.Compute(
                c.Values.Select(v => v * scale).ToArray(),
                c.Sigma * scale,
                new SpecLimits(c.Lower * scale, c.Upper * scale, c.Target * scale));
            AssertSame(a, b);
        });

    // Adding a constant to values, limits and target leaves every index unchanged.
    [Property(MaxTest = 200)]
    public Property Compute_ShiftedByConstant_IndicesUnchanged() =>
        Prop.ForAll(Cases(), Gen.Choose(-1_000_000, 1_000_000).Select(i => i * 1.0).ToArbitrary(), (c, shift) =>
        {
            var a = Run(c);
            var b = ProcessCapability.Compute(
                c.Values.Select(v => v + shift).ToArray(),
                c.Sigma,
                new SpecLimits(c.Lower + shift, c.Upper + shift, c.Target + shift));
            AssertSame(a, b);
        });

    private static CapabilityResult Run(Case c) =>
        ProcessCapability.Compute(c.Values, c.Sigma, new SpecLimits(c.Lower, c.Upper, c.Target));

    private static void AssertSame(CapabilityResult a, CapabilityResult b)
    {
        double?[] left = [a.Cp, a.Cpu, a.Cpl, a.Cpk, a.Pp, a.Ppu, a.Ppl, a.Ppk, a.Cpm, a.PpmWithin?.Total, a.PpmOverall?.Total];
        double?[] right = [b.Cp, b.Cpu, b.Cpl, b.Cpk, b.Pp, b.Ppu, b.Ppl, b.Ppk, b.Cpm, b.PpmWithin?.Total, b.PpmOverall?.Total];
        for (var i = 0; i < left.Length; i++)
        {
            Close(left[i], right[i]);
        }

        Assert.Equal(a.Intervals.Keys.Order(StringComparer.Ordinal), b.Intervals.Keys.Order(StringComparer.Ordinal));
        foreach (var key in a.Intervals.Keys)
        {
            Close(a.Intervals[key].Low, b.Intervals[key].Low);
            Close(a.Intervals[key].High, b.Intervals[key].High);
        }
    }

    // Relative 1e-7: a shift of up to 1e6 on values of about 10 costs about 1e-11 relative in x̄ − LSL.
    private static void Close(double? x, double? y)
    {
        Assert.Equal(x.HasValue, y.HasValue);
        if (x is { } u && y is { } v)
        {
            Assert.True(Math.Abs(u - v) <= 1e-7 * Math.Max(1.0, Math.Abs(u)), $"{u} vs {v}");
        }
    }
}
