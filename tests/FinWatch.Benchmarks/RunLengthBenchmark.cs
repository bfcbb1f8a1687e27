using System.Diagnostics;
using System.Globalization;
using FinWatch.Statistics.Rules;
using FinWatch.Statistics.RunLength;

namespace FinWatch.Benchmarks;

/// <summary>
/// The alarm budget's run lengths (docs/statistics.md §4.5), one thread, in a fresh process so the cache is empty: for
/// each rule set the time of a first answer (in control, 1σ and 2σ, as the limits page asks) and of a repeated one.
/// Target: a first answer well under 1 s.
/// </summary>
public static class RunLengthBenchmark
{
    private static readonly (string Name, RunRule[] Rules)[] Sets =
    [
        ("WE1–WE4 (exact chain)", [.. RunRules.WesternElectric]),
        ("N1–N8", [.. RunRules.Nelson]),
        ("WE1 + N3 + N4", [RunRule.WE1, RunRule.N3, RunRule.N4]),
        ("WE1–WE4 + N7 + N8", [.. RunRules.WesternElectric, RunRule.N7, RunRule.N8]),
        ("N3 alone (no shift changes it)", [RunRule.N3]),
        ("N8 alone (ARL ≈ 14 000)", [RunRule.N8]),
        ("N7 alone (blind to shifts)", [RunRule.N7]),
    ];

    public static int Run()
    {
        Console.WriteLine($"Run-length benchmark: one thread, {(Debugger.IsAttached ? "debugger attached" : "no debugger")}, "
            + $"budget {RunLengthSimulation.DefaultPointBudget:N0} points or {RunLengthSimulation.DefaultMaxRuns:N0} runs per figure");
        RuleSetRunLength.Estimate([RunRule.WE1, RunRule.N4], 0.5); // JIT warm-up on a key the sets below do not use
        foreach (var (name, rules) in Sets)
        {
            var stopwatch = Stopwatch.StartNew();
            var figures = new[] { 0.0, 1.0, 2.0 }.Select(d => RuleSetRunLength.Estimate(rules, d)).ToList();
            var first = stopwatch.Elapsed.TotalMilliseconds;
            stopwatch.Restart();
            _ = new[] { 0.0, 1.0, 2.0 }.Select(d => RuleSetRunLength.Estimate(rules, d)).ToList();
            var again = stopwatch.Elapsed.TotalMilliseconds;
            var arls = string.Join(", ", figures.Select(f => f.IsResolved
                ? string.Create(CultureInfo.InvariantCulture, $"{f.Points:G4} ± {f.StandardError:G2}")
                : "not resolved"));
            Console.WriteLine(string.Create(CultureInfo.InvariantCulture,
                $"{name,-32} first {first,7:F0} ms, cached {again,6:F3} ms; ARL at 0, 1σ, 2σ: {arls} points ({figures[0].Method})"));
        }

        return 0;
    }
}
