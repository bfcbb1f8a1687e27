using System.Diagnostics;
using FinWatch.Physics;
using FinWatch.Physics.Analytic;

namespace FinWatch.Benchmarks;

/// <summary>
/// Analytic threshold model cost per record (plain Stopwatch, one thread): <see cref="ThresholdModel.Predict"/> over
/// 100,000 seeded random profiles inside the H.1 ranges (warm-up, best of 5; target ≤ 5 µs per record), and the old
/// 200-slice path (<see cref="SliceModel.Evaluate(SliceModelInput)"/> for the record and its nominal difference) on the
/// first profiles of the same set in the same run, with the largest difference between the two.
/// </summary>
public static class ModelBenchmark
{
    private const int Seed = 20261202;
    private const int Records = 100_000;
    private const int OldRecords = 2_000;

    public static int Run()
    {
        var parameters = new CalibrationParameters
        {
            Name = "benchmark",
            Version = "1",
            Nominal = new FinMeasurement(new FinProfile(6, 10, 42, 2), 0.9, 2.0, GateFaces.TriGate),
        };
        var model = new ThresholdModel(parameters);
        var fins = Profiles(Records, new Random(Seed));
        Console.WriteLine($"Analytic model benchmark: {Records:N0} seeded H.1 profiles, one thread, {(Debugger.IsAttached ? "debugger attached" : "no debugger")}");

        double sink = 0;
        var fast = BestOf(5, () =>
        {
            for (var i = 0; i < fins.Length; i++)
            {
                sink += model.Predict(fins[i]).DeltaThresholdLinMv;
            }
        });

        // The ingest case: the record's profile varies, its gate dielectric is the product's (so the width table applies).
        var ingestFins = fins.Select(f => f with { EotNm = parameters.Nominal.EotNm, PhysicalThicknessNm = parameters.Nominal.PhysicalThicknessNm }).ToArray();
        var ingest = BestOf(5, () =>
        {
            for (var i = 0; i < ingestFins.Length; i++)
            {
                sink += model.Predict(ingestFins[i]).DeltaThresholdLinMv;
            }
        });

        // The old path: the 200-slice midpoint sum for the record, minus the 200-slice nominal (what Predict reported before).
        var nominal = SliceModel.Evaluate(parameters.ToSliceInput(parameters.Nominal));
        var old = BestOf(3, () =>
        {
            for (var i = 0; i < OldRecords; i++)
            {
                sink += SliceModel.Evaluate(parameters.ToSliceInput(fins[i])).ThresholdLowV - nominal.ThresholdLowV;
            }
        });

        double maxLin = 0, maxSat = 0, maxSwing = 0, maxDibl = 0;
        for (var i = 0; i < OldRecords; i++)
        {
            var r = SliceModel.Evaluate(parameters.ToSliceInput(fins[i]));
            var p = model.Predict(fins[i]);
            maxLin = Math.Max(maxLin, Math.Abs((1000 * (r.ThresholdLowV - nominal.ThresholdLowV)) - p.DeltaThresholdLinMv));
            maxSat = Math.Max(maxSat, Math.Abs((1000 * (r.ThresholdHighV - nominal.ThresholdHighV)) - p.DeltaThresholdSatMv));
            maxSwing = Math.Max(maxSwing, Math.Abs((1000 * (r.SwingLowVPerDecade - nominal.SwingLowVPerDecade)) - p.DeltaSwingLinMvPerDecade));
            maxDibl = Math.Max(maxDibl, Math.Abs((1000 * (r.DiblVPerV - nominal.DiblVPerV)) - p.DeltaDiblMvPerV));
        }

        var fastUs = fast / Records * 1e6;
        var oldUs = old / OldRecords * 1e6;
        Console.WriteLine($"    ThresholdModel.Predict (quadrature): best of 5 {fast * 1e3:F1} ms = {fastUs:F2} µs per record (target ≤ 5)");
        Console.WriteLine($"    ThresholdModel.Predict, product's EOT (the ingest case): {ingest / Records * 1e6:F2} µs per record");
        Console.WriteLine($"    old 200-slice SliceModel.Evaluate:   best of 3 over the first {OldRecords:N0} = {oldUs:F1} µs per record");
        Console.WriteLine($"    speed-up {oldUs / fastUs:F0}×; largest difference over those {OldRecords:N0}: ΔV_T,lin {maxLin:E2} mV, ΔV_T,sat {maxSat:E2} mV, ΔS {maxSwing:E2} mV/dec, ΔDIBL {maxDibl:E2} mV/V");
        Console.WriteLine($"    (checksum {sink:E3})");
        return fastUs <= 5 ? 0 : 1;
    }

    /// <summary>Seeded profiles inside H.1: w_mid 5–10, θ 0–6°, H 30–55, r 0–4 (≤ W_t/2), EOT 0.8–1.2; W_t ≥ 1 nm.</summary>
    private static FinMeasurement[] Profiles(int count, Random random)
    {
        var fins = new FinMeasurement[count];
        for (var i = 0; i < count;)
        {
            double mid = 5 + (5 * random.NextDouble()), theta = 6 * random.NextDouble(), h = 30 + (25 * random.NextDouble());
            double half = h * Math.Tan(theta * Math.PI / 180), top = mid - half;
            if (top < 1)
            {
                continue;
            }

            double r = Math.Min(4, 0.5 * top) * random.NextDouble(), eot = 0.8 + (0.4 * random.NextDouble());
            fins[i++] = new FinMeasurement(new FinProfile(top, mid + half, h, r), eot, eot + 1, GateFaces.TriGate);
        }

        return fins;
    }

    private static double BestOf(int runs, Action action)
    {
        action();
        var best = double.MaxValue;
        for (var i = 0; i < runs; i++)
        {
            var sw = Stopwatch.StartNew();
            action();
            best = Math.Min(best, sw.Elapsed.TotalSeconds);
        }

        return best;
    }
}
