using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>Small helpers for hand-built series: the plotted value and z are given in sigma units unless stated.</summary>
internal static class RuleTestHelpers
{
    /// <summary>Flags of one rule for a series whose values are its z-scores (CL 0, sigma 1).</summary>
    public static int[] FlagsOf(RunRule rule, params double[] z) => FlagsOf(rule, z, z);

    /// <summary>Flags of one rule for given values and z; fails the test when the rule is reported not evaluable.</summary>
    public static int[] FlagsOf(RunRule rule, double[] values, double[] z)
    {
        var flags = RunRuleEvaluation.Evaluate(values, z, [rule]).Flags[rule];
        Assert.NotNull(flags);
        return [.. flags];
    }

    /// <summary>The signals of one rule, z-scores as values.</summary>
    public static RuleSignal[] SignalsOf(RunRule rule, params double[] z) => SignalsOf(rule, z, z);

    /// <summary>The signals of one rule for given values and z.</summary>
    public static RuleSignal[] SignalsOf(RunRule rule, double[] values, double[] z) =>
        [.. RunRuleEvaluation.Evaluate(values, z, [rule]).Signals];

    /// <summary>The pattern of the signal raised at <paramref name="index"/>.</summary>
    public static int[] PatternAt(RuleSignal[] signals, int index) => Assert.Single(signals, s => s.Index == index).Pattern;

    /// <summary>A run of <paramref name="count"/> copies of <paramref name="z"/>.</summary>
    public static double[] Repeat(double z, int count) => Enumerable.Repeat(z, count).ToArray();

    /// <summary>0, 1, …, count − 1.</summary>
    public static int[] Range(int start, int count) => Enumerable.Range(start, count).ToArray();

    /// <summary>Concatenation of pieces.</summary>
    public static double[] Concat(params double[][] pieces) => pieces.SelectMany(p => p).ToArray();

    /// <summary>A series of NaN z-scores (zone rules not evaluable) of the same length.</summary>
    public static double[] NaNs(int count) => Repeat(double.NaN, count);
}
