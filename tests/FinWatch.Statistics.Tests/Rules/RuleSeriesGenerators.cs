using FinWatch.Statistics.Rules;
using FsCheck;
using FsCheck.Fluent;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>
/// FsCheck generators for series that exercise the rules and their edges: z drawn mostly from zone lines and zone
/// middles (±0, ±1, ±2, ±3 exactly, and values between), sometimes continuous, in regimes (wide, mostly zone C,
/// mostly one side, all NaN as for sigma_point = 0) so every zone rule fires; values from regimes (trending,
/// alternating, small integers with ties) so N3 and N4 fire; some rows missing and some z NaN.
/// </summary>
internal static class RuleSeriesGenerators
{
    private static readonly double[] ZoneValues = [0, 0.5, -0.5, 1, -1, 1.5, -1.5, 2, -2, 2.5, -2.5, 3, -3, 3.5, -3.5];

    public static Gen<double> ZScore { get; } = Gen.Frequency(
        (8, Gen.Elements(ZoneValues)),
        (3, Gen.Choose(-4000, 4000).Select(i => i / 1000.0)),
        (1, Gen.Constant(double.NaN)));

    private static readonly double[] ZoneCValues = [0, 0.5, -0.5, 1, -1, 0.25, -0.75];

    private static Gen<double> NarrowZ { get; } = Gen.Frequency((12, Gen.Elements(ZoneCValues)), (1, ZScore));

    private static Gen<double> OneSidedZ { get; } = Gen.Frequency((6, ZScore.Select(Math.Abs)), (1, ZScore));

    private static Gen<double[]> ZScores(int length) => Gen.Frequency(
        (4, ZScore.ArrayOf(length)),
        (3, NarrowZ.ArrayOf(length)),
        (2, OneSidedZ.ArrayOf(length)),
        (1, Gen.Constant(double.NaN).ArrayOf(length)));

    public static Gen<RunRule[]> RuleSubset { get; } =
        Gen.SubListOf(Enum.GetValues<RunRule>()).Select(l => l.ToArray());

    private static Gen<double[]> Values(int length) => Gen.Choose(0, 2).SelectMany(regime => regime switch
    {
        // Trending: mostly up with occasional ties and reversals.
        0 => Gen.Frequency((8, Gen.Constant(1.0)), (1, Gen.Constant(0.0)), (1, Gen.Constant(-1.0))).ArrayOf(length).Select(Cumulate),
        // Alternating: sign flips with probability 0.9, step sizes 1..3, occasional zero.
        1 => Gen.Zip(Gen.Choose(0, 19), Gen.Choose(1, 3)).ArrayOf(length).Select(Alternate),
        // Small integers: many ties.
        _ => Gen.Choose(0, 3).Select(i => (double)i).ArrayOf(length),
    });

    public static Gen<RuleSeries> Series { get; } =
        from length in Gen.Choose(0, 150)
        from values in Values(length)
        from missing in Gen.Frequency((9, Gen.Constant(false)), (1, Gen.Constant(true))).ArrayOf(length)
        from z in ZScores(length)
        from rules in RuleSubset
        select new RuleSeries(
            values.Select((v, i) => missing[i] ? double.NaN : v).ToArray(), z, rules);

    public static Arbitrary<RuleSeries> SeriesArb { get; } = Series.ToArbitrary();

    private static double[] Cumulate(double[] steps)
    {
        var values = new double[steps.Length];
        var sum = 0.0;
        for (var i = 0; i < steps.Length; i++)
        {
            sum += steps[i];
            values[i] = sum;
        }

        return values;
    }

    private static double[] Alternate((int Flip, int Size)[] steps)
    {
        var values = new double[steps.Length];
        var sign = 1;
        var v = 0.0;
        for (var i = 0; i < steps.Length; i++)
        {
            if (steps[i].Flip < 18)
            {
                sign = -sign;
            }

            v += steps[i].Flip == 19 ? 0 : sign * steps[i].Size;
            values[i] = v;
        }

        return values;
    }
}
