using FinWatch.Physics;
using FinWatch.Physics.Analytic;

namespace FinWatch.SeedDemo;

/// <summary>
/// Invents the electrical tests of the demo fab. A lot reaches electrical test <see cref="TestDelay"/> after its fin
/// profile was measured; lots whose test would fall after <see cref="DemoFab.EndUtc"/> have none yet. Four wafers of
/// each tested lot are tested. Each result is the project's analytic model (QuadratureSliceModel, G.2) evaluated on the
/// wafer's true fin (before metrology bias and site noise) under the product's <see cref="DemoElectricalTruth"/>,
/// plus wafer noise; so the results are consistent with the measured fins, and a calibration on them recovers the
/// truth to within the metrology's bias and the noise.
/// </summary>
internal static class ElectricalTestPlan
{
    public const int ElectricalStream = 4;

    private static readonly int[] CandidateSlots = [2, 9, 16, 23];

    public static readonly TimeSpan TestDelay = TimeSpan.FromDays(18);

    public static IReadOnlyList<DemoElectricalTruth> Truths { get; } =
    [
        new("TRN7", GateLengthNm: 21.5, BarrierShiftV: 0.02, ThresholdOffsetV: 0.12, WaferNoiseMv: 4.0),
        new("BRM7", GateLengthNm: 19.2, BarrierShiftV: -0.015, ThresholdOffsetV: 0.08, WaferNoiseMv: 4.0),
    ];

    /// <summary>The tested slots: 2, 9, 16 and 23, or the ones of these the lot has (slot 1 at least).</summary>
    public static int[] TestedSlots(int wafersPerLot)
    {
        int[] slots = [.. CandidateSlots.Where(s => s <= wafersPerLot)];
        return slots.Length > 0 ? slots : [1];
    }

    public static IEnumerable<DemoElectricalTest> Generate(int seed, DemoScale scale)
    {
        var models = new Dictionary<string, (CalibrationParameters Start, double[] Theta, double NoiseV)>();
        foreach (ProductRecipe recipe in ProductRecipe.All)
        {
            DemoElectricalTruth truth = Truths.Single(t => t.Product == recipe.Product.Code);
            CalibrationParameters start = PhysicsDefaults(recipe.Product);
            models[recipe.Product.Code] = (start, [truth.GateLengthNm, start.BarrierHeightV + truth.BarrierShiftV, truth.ThresholdOffsetV], truth.WaferNoiseMv / 1000.0);
        }

        int[] slots = TestedSlots(scale.WafersPerLot);
        foreach (LotPlan lot in LotPlan.PlanAll(seed, scale))
        {
            if (lot.ProfileAtUtc is not { } profiledAt || profiledAt + TestDelay + TimeSpan.FromHours(1) >= FabLayout.EndUtc)
            {
                continue;
            }

            var (start, theta, noiseV) = models[lot.Recipe.Product.Code];
            WaferState[] wafers = FinModel.Wafers(seed, lot, scale.WafersPerLot);
            Random noise = SeededRandom.Create(seed, lot.Index, ElectricalStream);
            for (int i = 0; i < slots.Length; i++)
            {
                WaferState w = wafers[slots[i] - 1];
                double radius = w.MedianCornerRadiusNm * Math.Exp(w.LogCornerRadiusOffset);
                double taperRad = Math.Atan((w.BottomWidthNm - w.TopWidthNm) / (2.0 * w.HeightNm));
                radius = Math.Min(radius, 0.97 * FinCrossSection.MaxCornerRadiusNm(w.TopWidthNm, taperRad));
                FinMeasurement fin = start.Nominal with { Profile = new FinProfile(w.TopWidthNm, w.BottomWidthNm, w.HeightNm, radius) };
                var (lin, sat) = Calibration.Predict(start, fin, theta);
                double lotWafer = noiseV * noise.NextGaussian();
                double dibl = 0.3 * noiseV * noise.NextGaussian();
                DateTime at = profiledAt + TestDelay + TimeSpan.FromMinutes(3 * i);
                yield return new DemoElectricalTest(lot.LotId, w.Slot, lot.Recipe.Product.Code,
                    Math.Round(lin + lotWafer, 4), Math.Round(sat + lotWafer + dibl, 4), at);
            }
        }
    }

    /// <summary>The physics defaults the server uses for a product created from <see cref="DemoFab.Products"/> (EOT 0.9 nm, L 20 nm, N_A 1e17 cm⁻³, (110) sidewalls).</summary>
    public static CalibrationParameters PhysicsDefaults(DemoProduct product)
    {
        DemoProfile n = product.Nominal;
        return new CalibrationParameters
        {
            Name = $"{product.Code} physics defaults",
            Version = "demo truth",
            Nominal = new FinMeasurement(new FinProfile(n.TopWidthNm, n.BottomWidthNm, n.FinHeightNm, n.CornerRadiusNm), 0.9, 0.9, product.GateFaces),
        };
    }
}
