using FsCheck;
using FsCheck.Fluent;

namespace FinWatch.Statistics.Tests.Charts;

/// <summary>FsCheck generators for chart inputs: finite values in [−100, 100] with about one in seven missing (NaN).</summary>
internal static class ChartGenerators
{
    public static Gen<double> Value { get; } = Gen.Choose(-100_000, 100_000).Select(i => i / 1000.0);

    public static Gen<double> ValueOrMissing { get; } = Gen.Frequency((1, Gen.Constant(double.NaN)), (6, Value));

    public static Gen<double[]> Series { get; } = Gen.Choose(0, 80).SelectMany(n => Gen.ArrayOf(ValueOrMissing, n));

    /// <summary>λ in (0, 1], in steps of 0.001.</summary>
    public static Gen<double> Lambda { get; } = Gen.Choose(1, 1000).Select(i => i / 1000.0);

    /// <summary>A positive parameter in [0.1, 6] (L, σ, h).</summary>
    public static Gen<double> Positive { get; } = Gen.Choose(1, 60).Select(i => i / 10.0);
}
