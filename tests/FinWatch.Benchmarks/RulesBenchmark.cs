using System.Diagnostics;
using FinWatch.Statistics.Rules;

namespace FinWatch.Benchmarks;

/// <summary>
/// Run-rule engine throughput (plain Stopwatch, one thread): (a) all 12 rules over a seeded 1,000,000-point
/// in-control series, as point-rule checks per second (target ≥ 50 million/s); (b) a live chart of 100,000 points:
/// appending one point to the existing evaluator against re-evaluating the whole 100,001-point series, in the same
/// run (target ratio ≥ 100×).
/// </summary>
public static class RulesBenchmark
{
    private const int Seed = 20260101;

    public static int Run()
    {
        var rules = Enum.GetValues<RunRule>();
        Console.WriteLine($"Run rules benchmark: {rules.Length} rules, one thread, {(Debugger.IsAttached ? "debugger attached" : "no debugger")}");

        // (a) Throughput over 1,000,000 in-control points (z = value, CL 0, sigma 1).
        const int n = 1_000_000;
        var z = InControl(n, new Random(Seed));
        var signals = new List<RuleSignal>(1 << 16);
        long signalCount = 0;
        var batchBest = BestOf(5, () => signalCount = RunRuleEvaluation.Evaluate(z, z, rules).Signals.Count);
        var appendBest = BestOf(5, () =>
        {
            var evaluator = new RunRuleEvaluator(rules);
            signals.Clear();
            for (var i = 0; i < z.Length; i++)
            {
                evaluator.Append(i, z[i], z[i], signals);
            }
        });
        var checks = (double)n * rules.Length;
        Console.WriteLine($"(a) {n:N0} points × {rules.Length} rules = {checks:N0} point-rule checks; {signalCount:N0} signals raised");
        Console.WriteLine($"    batch RunRuleEvaluation.Evaluate:   best of 5 {batchBest * 1e3:F1} ms = {checks / batchBest / 1e6:F0} million checks/s (target ≥ 50)");
        Console.WriteLine($"    RunRuleEvaluator.Append into a list: best of 5 {appendBest * 1e3:F1} ms = {checks / appendBest / 1e6:F0} million checks/s");

        // (b) Live chart: 100,000 points already evaluated, then one more.
        const int live = 100_000;
        const int appends = 1_000_000;
        var series = InControl(live + 1 + appends, new Random(Seed + 1));
        var liveSeries = series.AsSpan(0, live + 1).ToArray();
        var reevaluateBest = BestOf(5, () => RunRuleEvaluation.Evaluate(liveSeries, liveSeries, rules));

        double appendSeconds = double.MaxValue;
        var liveSignals = new List<RuleSignal>();
        for (var round = 0; round < 5; round++)
        {
            var evaluator = new RunRuleEvaluator(rules);
            for (var i = 0; i < live; i++)
            {
                evaluator.Append(i, series[i], series[i], liveSignals);
            }

            // Each repetition appends the next point to the same growing evaluator (≥ 100,000 points already in it).
            var stopwatch = Stopwatch.StartNew();
            for (var i = live; i < live + appends; i++)
            {
                evaluator.Append(i, series[i], series[i], liveSignals);
            }

            appendSeconds = Math.Min(appendSeconds, stopwatch.Elapsed.TotalSeconds / appends);
            liveSignals.Clear();
        }

        Console.WriteLine($"(b) live chart of {live:N0} points, all {rules.Length} rules");
        Console.WriteLine($"    append one point:          {appendSeconds * 1e9:F1} ns (best of 5 rounds, mean of {appends:N0} appends each)");
        Console.WriteLine($"    re-evaluate {live + 1:N0} points: {reevaluateBest * 1e3:F2} ms (best of 5)");
        Console.WriteLine($"    ratio re-evaluate / append: {reevaluateBest / appendSeconds:N0}× (target ≥ 100×)");

        // (c) The whole live chart, not only its rules: an I-MR chart with frozen limits (ShewhartMonitor: limits, zone
        // score, moving range, beyond-limit tests and all 12 rules) against recharting all 100,001 points and re-running
        // the rules over them.
        var known = new Statistics.Shewhart.LimitRequest(Statistics.Shewhart.LimitSource.Known, KnownMean: 0, KnownSigma: 1);
        var rechartBest = BestOf(5, () =>
        {
            var chart = Statistics.Shewhart.ShewhartCharts.Individuals(liveSeries, known);
            RunRuleEvaluation.Evaluate(chart.Primary.Values, chart.ZoneScores, rules);
        });
        double monitorSeconds = double.MaxValue;
        for (var round = 0; round < 5; round++)
        {
            var monitor = new Statistics.Shewhart.ShewhartMonitor(Statistics.Shewhart.ShewhartChartType.IndividualsMovingRange, 0, 1, rules);
            for (var i = 0; i < live; i++)
            {
                monitor.Append(series[i], liveSignals);
            }

            var stopwatch = Stopwatch.StartNew();
            for (var i = live; i < live + appends; i++)
            {
                monitor.Append(series[i], liveSignals);
            }

            monitorSeconds = Math.Min(monitorSeconds, stopwatch.Elapsed.TotalSeconds / appends);
            liveSignals.Clear();
        }

        Console.WriteLine($"(c) live I-MR chart of {live:N0} points with frozen limits and all {rules.Length} rules");
        Console.WriteLine($"    append one point (ShewhartMonitor): {monitorSeconds * 1e9:F1} ns");
        Console.WriteLine($"    rechart + re-evaluate {live + 1:N0} points: {rechartBest * 1e3:F2} ms (best of 5)");
        Console.WriteLine($"    ratio: {rechartBest / monitorSeconds:N0}× (target ≥ 100×)");
        return 0;
    }

    // Best wall time of `repetitions` timed calls, after one untimed warm-up call.
    private static double BestOf(int repetitions, Action action)
    {
        action();
        var best = double.MaxValue;
        for (var r = 0; r < repetitions; r++)
        {
            var stopwatch = Stopwatch.StartNew();
            action();
            best = Math.Min(best, stopwatch.Elapsed.TotalSeconds);
        }

        return best;
    }

    // Independent standard normal values (Box–Muller, both of each pair).
    private static double[] InControl(int count, Random random)
    {
        var values = new double[count];
        for (var i = 0; i < count; i += 2)
        {
            var r = Math.Sqrt(-2.0 * Math.Log(1.0 - random.NextDouble()));
            var t = 2.0 * Math.PI * random.NextDouble();
            values[i] = r * Math.Cos(t);
            if (i + 1 < count)
            {
                values[i + 1] = r * Math.Sin(t);
            }
        }

        return values;
    }
}
