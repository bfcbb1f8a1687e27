using System.Collections.Concurrent;
using MathNet.Numerics.Distributions;
using MathNet.Numerics.LinearAlgebra;

namespace FinWatch.Statistics.RunLength;

/// <summary>
/// Exact ARL of a 3-sigma Shewhart chart with any subset of the Western Electric rules 1–4 (docs/statistics.md §3.1) and
/// Nelson's test 2 (nine in a row on one side, §3.2) by a Markov chain over the zone history (Champ &amp; Woodall 1987).
/// Each point falls into one of eight zones (beyond ±3, ±(2, 3], ±(1, 2], ±(0, 1]); the state keeps only what the
/// active rules need of the past: beyond-2-sigma sides of the last two points (WE2), beyond-1-sigma sides of the last
/// four (WE3) and the signed same-side run length, capped at 7 for WE4 and at 8 for N2.
/// Windows are truncated at the start (docs/statistics.md §3.3 item 5), so the chain starts from an empty history. States with the
/// same future are merged (Moore's partition refinement), which is exact because the zone probabilities do not
/// depend on the state.
/// </summary>
internal sealed class WesternElectricChain
{
    private const int ZoneCount = 8;
    private const int Signal = -1;

    private static readonly ConcurrentDictionary<int, WesternElectricChain> Cache = new();

    private readonly int[,] next;
    private readonly int start;

    private WesternElectricChain(int[,] next, int start)
    {
        this.next = next;
        this.start = start;
    }

    /// <summary>Number of transient states after merging.</summary>
    public int StateCount => next.GetLength(0);

    /// <summary>Bit of <c>N2</c> in a rule mask; bits 0 to 3 are WE1 to WE4.</summary>
    public const int N2Bit = 16;

    /// <summary>
    /// The chain for a rule set given as a bit mask (bit r − 1 set for rule WE r, <see cref="N2Bit"/> for N2), built once
    /// and cached.
    /// </summary>
    public static WesternElectricChain For(int ruleMask) => Cache.GetOrAdd(ruleMask, Build);

    /// <summary>ARL from an empty history when each point is N(<paramref name="shift"/>, 1) in sigma units.</summary>
    public double AverageRunLength(double shift)
    {
        var p = ZoneProbabilities(shift);
        var n = StateCount;
        var matrix = Matrix<double>.Build.Dense(n, n);
        for (var s = 0; s < n; s++)
        {
            matrix[s, s] += 1;
            for (var zone = 0; zone < ZoneCount; zone++)
            {
                var target = next[s, zone];
                if (target != Signal)
                {
                    matrix[s, target] -= p[zone];
                }
            }
        }

        return matrix.Solve(Vector<double>.Build.Dense(n, 1.0))[start];
    }

    /// <summary>
    /// Zone probabilities for z ~ N(δ, 1), zones 0..7 = (3, ∞), (2, 3], (1, 2], (0, 1], [−1, 0), [−2, −1), [−3, −2),
    /// (−∞, −3). Each is a difference of tail probabilities on its own side, to keep small ones accurate.
    /// </summary>
    private static double[] ZoneProbabilities(double shift)
    {
        double Upper(double a) => Normal.CDF(0, 1, shift - a); // P(z > a)
        double Lower(double a) => Normal.CDF(0, 1, -a - shift); // P(z < −a)
        return
        [
            Upper(3),
            Upper(2) - Upper(3),
            Upper(1) - Upper(2),
            Upper(0) - Upper(1),
            Lower(0) - Lower(1),
            Lower(1) - Lower(2),
            Lower(2) - Lower(3),
            Lower(3),
        ];
    }

    private static WesternElectricChain Build(int ruleMask)
    {
        var we1 = (ruleMask & 1) != 0;
        var we2 = (ruleMask & 2) != 0;
        var we3 = (ruleMask & 4) != 0;
        var we4 = (ruleMask & 8) != 0;
        var n2 = (ruleMask & N2Bit) != 0;
        // The same-side run is only counted as far as the longest run rule needs (8 points for WE4, 9 for N2).
        var runCap = n2 ? 8 : we4 ? 7 : 0;

        // Raw states by breadth-first search from the empty history.
        var index = new Dictionary<History, int>();
        var states = new List<History>();
        var raw = new List<int[]>();
        var initial = default(History);
        index[initial] = 0;
        states.Add(initial);
        for (var s = 0; s < states.Count; s++)
        {
            var successors = new int[ZoneCount];
            for (var zone = 0; zone < ZoneCount; zone++)
            {
                var side = zone < 4 ? 1 : -1;
                var depth = side > 0 ? 3 - zone : zone - 4; // 3 beyond 3 sigma, 2 beyond 2, 1 beyond 1, 0 inside 1
                var current = states[s];
                if (Signals(current, side, depth, we1, we2, we3, we4, n2))
                {
                    successors[zone] = Signal;
                    continue;
                }

                var following = current.Then(side, depth, we2, we3, runCap);
                if (!index.TryGetValue(following, out var id))
                {
                    id = states.Count;
                    index[following] = id;
                    states.Add(following);
                }

                successors[zone] = id;
            }

            raw.Add(successors);
        }

        return Minimise(raw);
    }

    private static bool Signals(History history, int side, int depth, bool we1, bool we2, bool we3, bool we4, bool n2)
    {
        if (we1 && depth >= 3)
        {
            return true;
        }

        if (we2 && depth >= 2 && (history.Beyond2Lag1 == side || history.Beyond2Lag2 == side))
        {
            return true;
        }

        if (we3 && depth >= 1)
        {
            var count = (history.Beyond1Lag1 == side ? 1 : 0) + (history.Beyond1Lag2 == side ? 1 : 0)
                + (history.Beyond1Lag3 == side ? 1 : 0) + (history.Beyond1Lag4 == side ? 1 : 0);
            if (count >= 3)
            {
                return true;
            }
        }

        return (we4 && history.Run * side >= 7) || (n2 && history.Run * side >= 8);
    }

    /// <summary>Moore's partition refinement: merge states whose successors are in the same blocks for every zone.</summary>
    private static WesternElectricChain Minimise(List<int[]> raw)
    {
        var n = raw.Count;
        var block = new int[n];
        var blockCount = 1;
        while (true)
        {
            var signatures = new Dictionary<string, int>();
            var refined = new int[n];
            for (var s = 0; s < n; s++)
            {
                var parts = new int[ZoneCount + 1];
                parts[0] = block[s];
                for (var zone = 0; zone < ZoneCount; zone++)
                {
                    parts[zone + 1] = raw[s][zone] == Signal ? Signal : block[raw[s][zone]];
                }

                var key = string.Join(',', parts);
                if (!signatures.TryGetValue(key, out var id))
                {
                    id = signatures.Count;
                    signatures[key] = id;
                }

                refined[s] = id;
            }

            block = refined;
            if (signatures.Count == blockCount)
            {
                break;
            }

            blockCount = signatures.Count;
        }

        var next = new int[blockCount, ZoneCount];
        for (var s = 0; s < n; s++)
        {
            for (var zone = 0; zone < ZoneCount; zone++)
            {
                next[block[s], zone] = raw[s][zone] == Signal ? Signal : block[raw[s][zone]];
            }
        }

        return new WesternElectricChain(next, block[0]);
    }

    /// <summary>Sides (+1, −1, 0 for neither) of the recent points beyond 2 and 1 sigma, and the signed run length.</summary>
    private readonly record struct History(
        int Beyond2Lag1,
        int Beyond2Lag2,
        int Beyond1Lag1,
        int Beyond1Lag2,
        int Beyond1Lag3,
        int Beyond1Lag4,
        int Run)
    {
        public History Then(int side, int depth, bool we2, bool we3, int runCap)
        {
            var beyond2 = depth >= 2 ? side : 0;
            var beyond1 = depth >= 1 ? side : 0;
            var run = Run * side > 0 ? Math.Clamp(Run + side, -runCap, runCap) : side;
            return new History(
                we2 ? beyond2 : 0,
                we2 ? Beyond2Lag1 : 0,
                we3 ? beyond1 : 0,
                we3 ? Beyond1Lag1 : 0,
                we3 ? Beyond1Lag2 : 0,
                we3 ? Beyond1Lag3 : 0,
                runCap > 0 ? run : 0);
        }
    }
}
