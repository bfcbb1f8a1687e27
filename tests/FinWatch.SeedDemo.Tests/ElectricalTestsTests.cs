using FinWatch.Physics;
using FinWatch.Physics.Analytic;

namespace FinWatch.SeedDemo.Tests;

public class ElectricalTestsTests
{
    private static readonly DemoScale Scale = new(Days: 40, LotsPerDay: 3, WafersPerLot: 25);

    [Fact]
    public void ElectricalTests_AreDeterministic_InTheWindow_AndOnMeasuredWafers()
    {
        DemoElectricalTest[] a = [.. DemoFab.GenerateElectricalTests(DemoFab.DefaultSeed, Scale)];
        DemoElectricalTest[] b = [.. DemoFab.GenerateElectricalTests(DemoFab.DefaultSeed, Scale)];
        Assert.Equal(a, b);
        Assert.NotEmpty(a);
        Assert.All(a, t => Assert.True(t.TestedAtUtc < DemoFab.EndUtc));
        Assert.All(a, t => Assert.InRange(t.VtLinV, -1, 2));
        var profiled = DemoFab.GenerateRows(DemoFab.DefaultSeed, Scale).Where(r => r.Step == DemoFab.ProfileStep)
            .Select(r => (r.LotId, r.WaferSlot)).ToHashSet();
        Assert.All(a, t => Assert.Contains((t.LotId, t.WaferSlot), profiled));
        // A threshold falls as the drain voltage rises (DIBL, docs/model.md §B.4): saturation below linear on every wafer.
        Assert.All(a, t => Assert.True(t.VtSatV < t.VtLinV));
    }

    [Fact]
    public void ElectricalTests_CalibratedOnTheMeasuredFins_RecoverTheInventedTruth()
    {
        // Consistency of the demo: fitting the model (docs/model.md §G.3) to the tests, with each wafer's mean *measured* fin
        // (metrology bias and site noise included), lands near the invented truth. Tolerances: 1.5 nm in L_eff and 20 mV in
        // the offset, the size of the profile tools' bias effect on the fit (an estimate, no external source).
        var means = DemoFab.GenerateRows(DemoFab.DefaultSeed, Scale).Where(r => r.Step == DemoFab.ProfileStep)
            .GroupBy(r => (r.LotId, r.WaferSlot))
            .ToDictionary(g => g.Key, g => new FinProfile(g.Average(r => r.TopWidthNm!.Value), g.Average(r => r.BottomWidthNm!.Value),
                g.Average(r => r.FinHeightNm!.Value), g.Average(r => r.CornerRadiusNm!.Value)));
        foreach (DemoElectricalTruth truth in DemoFab.ElectricalTruths)
        {
            DemoProduct product = DemoFab.Products.Single(p => p.Code == truth.Product);
            var start = new CalibrationParameters
            {
                Name = "defaults",
                Version = "test",
                Nominal = new FinMeasurement(new FinProfile(product.Nominal.TopWidthNm, product.Nominal.BottomWidthNm,
                    product.Nominal.FinHeightNm, product.Nominal.CornerRadiusNm), 0.9, 0.9,
                    product.GateFaces),
            };
            var observations = DemoFab.GenerateElectricalTests(DemoFab.DefaultSeed, Scale).Where(t => t.Product == truth.Product)
                .Select(t => new ElectricalObservation(start.Nominal with { Profile = means[(t.LotId, t.WaferSlot)] }, t.VtLinV, t.VtSatV)).ToList();
            Assert.True(observations.Count > 20, $"{truth.Product}: {observations.Count} tests");
            CalibrationFit fit = Calibration.Fit(start, observations, "fit", "1");
            Assert.Equal(truth.GateLengthNm, fit.GateLengthNm, 1.5);
            Assert.Equal(truth.ThresholdOffsetV, fit.ThresholdOffsetV, 0.02);
            Assert.True(fit.RmsResidualAfterMv < 2 * truth.WaferNoiseMv, $"{truth.Product}: rms {fit.RmsResidualAfterMv} mV");
        }
    }
}
