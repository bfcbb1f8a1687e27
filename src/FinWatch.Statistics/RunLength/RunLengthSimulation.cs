using FinWatch.Statistics.Rules;
using MathNet.Numerics.Random;

namespace FinWatch.Statistics.RunLength;

/// <summary>
/// Seeded Monte Carlo average run length of a 3-sigma Shewhart chart with any set of run rules (docs/statistics.md §4.5):
/// independent N(δ, 1) points in sigma units of the plotted statistic, known centre line and σ, each run judged by
/// the same <see cref="RunRuleEvaluator"/> the monitor uses (so the conventions of §3.3 apply exactly), from an empty
/// history until the first signal of any enabled rule.
/// </summary>
/// <remarks>
/// <para>Random numbers: xoshiro256** (Blackman &amp; Vigna 2021; MathNet's implementation) seeded with the given seed,
/// turned into normal deviates by the Box–Muller transform (Box &amp; Muller 1958), both deviates of each pair used.
/// The same seed and arguments give the same result every time (another platform's math library may round log, sin or
/// cos differently in the last bit, which can move a rare run by a point).</para>
/// <para>Stopping: runs are started until <c>maxRuns</c> runs have signalled or the simulated points reach
/// <c>pointBudget</c>; a run still going when the points reach twice the budget is cut. When fewer than
/// <see cref="MinRuns"/> runs signalled (or a run was cut) the ARL is not resolved: the result is +∞ with a NaN standard
/// error, meaning the ARL is larger than about <c>pointBudget</c>/<see cref="MinRuns"/> points. Otherwise the estimate
/// is the mean run length and its standard error the sample standard deviation over √runs (running moments, §2.6).
/// Speed: about 45 ns per simulated point on one core (Release build), so one estimate with the default budget takes
/// at most about 0.1 s, or 0.2 s when it ends unresolved (docs/statistics.md §4.5 gives measured times).</para>
/// </remarks>
public static class RunLengthSimulation
{
    /// <summary>Default number of runs: standard error about 0.7 % of the ARL.</summary>
    public const int DefaultMaxRuns = 20_000;

    /// <summary>Default budget of simulated points per estimate.</summary>
    public const long DefaultPointBudget = 2_000_000;

    /// <summary>Fewest signalled runs for a resolved estimate.</summary>
    public const int MinRuns = 30;

    /// <summary>Simulated ARL of a 3-sigma chart with <paramref name="rules"/> at mean shift <paramref name="shift"/>.</summary>
    /// <param name="rules">The enabled rules; at least one (duplicates allowed).</param>
    /// <param name="shift">Mean shift δ in sigma units of the plotted statistic; finite.</param>
    /// <param name="seed">Seed of the random number generator.</param>
    /// <param name="maxRuns">Runs to simulate at most, <see cref="MinRuns"/> to 10⁷.</param>
    /// <param name="pointBudget">Simulated points after which no new run is started, 10³ to 10⁹.</param>
    /// <returns>The estimate with <see cref="RunLengthMethod.Simulation"/>; see remarks for an unresolved one.</returns>
    /// <exception cref="ArgumentException">No rule is given.</exception>
    /// <exception cref="ArgumentOutOfRangeException">δ is not finite, or a count is outside its range.</exception>
    public static RunLengthEstimate AverageRunLength(
        IEnumerable<RunRule> rules, double shift, int seed, int maxRuns = DefaultMaxRuns, long pointBudget = DefaultPointBudget)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var set = rules.Distinct().ToArray();
        if (set.Length == 0)
        {
            throw new ArgumentException("At least one rule is needed; with none the chart never signals.", nameof(rules));
        }

        RunLength.AverageRunLength.RequireFinite(shift, nameof(shift));

        ArgumentOutOfRangeException.ThrowIfLessThan(maxRuns, MinRuns);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(maxRuns, 10_000_000);
        ArgumentOutOfRangeException.ThrowIfLessThan(pointBudget, 1_000);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(pointBudget, 1_000_000_000);

        var normal = new NormalDeviates(seed);
        var signals = new List<RuleSignal>(4);
        var lengths = new RunningMoments();
        long points = 0;
        var cut = false;
        while (lengths.Count < maxRuns && points < pointBudget && !cut)
        {
            var evaluator = new RunRuleEvaluator(set);
            signals.Clear();
            var length = 0;
            while (signals.Count == 0)
            {
                if (points >= 2 * pointBudget)
                {
                    cut = true;
                    break;
                }

                var x = shift + normal.Next();
                evaluator.Append(length, x, x, signals);
                length++;
                points++;
            }

            if (!cut)
            {
                lengths.Add(length);
            }
        }

        var runs = (int)lengths.Count;
        return cut || runs < MinRuns
            ? new RunLengthEstimate(double.PositiveInfinity, double.NaN, RunLengthMethod.Simulation, runs)
            : new RunLengthEstimate(lengths.Mean, lengths.SampleStandardDeviation / Math.Sqrt(runs), RunLengthMethod.Simulation, runs);
    }

    /// <summary>Standard normal deviates by the Box–Muller transform, both of each pair, from a seeded xoshiro256**.</summary>
    private sealed class NormalDeviates(int seed)
    {
        private readonly Xoshiro256StarStar uniform = new(seed, threadSafe: false);
        private double spare;
        private bool hasSpare;

        public double Next()
        {
            if (hasSpare)
            {
                hasSpare = false;
                return spare;
            }

            var radius = Math.Sqrt(-2 * Math.Log(1 - uniform.NextDouble())); // 1 − u lies in (0, 1]: no log of 0
            var angle = 2 * Math.PI * uniform.NextDouble();
            spare = radius * Math.Sin(angle);
            hasSpare = true;
            return radius * Math.Cos(angle);
        }
    }
}
