using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>
/// The G.3 calibration (docs/model.md): a ridge fit of L_eff, the barrier height V_bi − φ_th and the threshold offset.
/// Checked on synthetic electrical tests made by the model itself with known parameters and seeded noise — a consistency
/// check of the estimator (it must recover what generated the data within its own stated uncertainty), not a published value.
/// </summary>
public sealed class CalibrationTests
{
    private static readonly CalibrationParameters Start = new()
    {
        Name = "defaults",
        Version = "0",
        Nominal = new FinMeasurement(new FinProfile(6, 10, 42, 2), 0.9, 0.9, GateFaces.TriGate),
    };

    private static List<ElectricalObservation> Synthetic(double gateLengthNm, double barrierV, double offsetV, int count, double noiseV, int seed)
    {
        var random = new Random(seed);
        double Normal() => Math.Sqrt(-2 * Math.Log(1 - random.NextDouble())) * Math.Cos(2 * Math.PI * random.NextDouble());
        var list = new List<ElectricalObservation>();
        for (var i = 0; i < count; i++)
        {
            var mid = 7 + (2 * random.NextDouble());
            var half = 1 + (1.5 * random.NextDouble());
            var fin = Start.Nominal with { Profile = new FinProfile(mid - half, mid + half, 40 + (4 * random.NextDouble()), 1 + (2 * random.NextDouble())) };
            var (lin, sat) = Calibration.Predict(Start, fin, [gateLengthNm, barrierV, offsetV]);
            list.Add(new ElectricalObservation(fin, lin + (noiseV * Normal()), sat + (noiseV * Normal())));
        }

        return list;
    }

    [Fact]
    public void Fit_SyntheticTestsWithKnownParameters_RecoversThemWithinTheirUncertainty()
    {
        var trueBarrier = Start.BarrierHeightV + 0.02;
        var data = Synthetic(21.5, trueBarrier, 0.030, 80, 0.002, 17);
        var fit = Calibration.Fit(Start, data, "fitted", "1");
        Assert.InRange(Math.Abs(fit.GateLengthNm - 21.5), 0, (3 * fit.GateLengthSdNm) + 0.05);
        Assert.InRange(Math.Abs(fit.BarrierHeightV - trueBarrier), 0, (3 * fit.BarrierHeightSdV) + 0.002);
        Assert.InRange(Math.Abs(fit.ThresholdOffsetV - 0.030), 0, (3 * fit.ThresholdOffsetSdV) + 0.002);
        // The residual falls to about the 2 mV noise that was added.
        Assert.True(fit.RmsResidualAfterMv < fit.RmsResidualBeforeMv);
        Assert.InRange(fit.RmsResidualAfterMv, 1.0, 3.5);
        Assert.Equal("fitted", fit.Parameters.Name);
        Assert.Equal(fit.ThresholdOffsetV, fit.Parameters.ThresholdOffsetV);
    }

    [Fact]
    public void Fit_NoObservations_ReturnsThePrior()
    {
        var fit = Calibration.Fit(Start, [], "empty", "1");
        Assert.Equal(Start.GateLengthNm, fit.GateLengthNm, 12);
        Assert.Equal(Start.BarrierHeightV, fit.BarrierHeightV, 12);
        Assert.Equal(0, fit.ThresholdOffsetV, 12);
        Assert.True(double.IsNaN(fit.RmsResidualAfterMv));
        Assert.Equal(Calibration.DefaultPriorSd[0], fit.GateLengthSdNm, 9);
    }

    [Fact]
    public void Fit_StrongPrior_StaysNearTheDefaults()
    {
        // A ridge prior pulls the estimate toward its centre; with tiny prior sds the data cannot move it (G.3).
        var data = Synthetic(24, Start.BarrierHeightV + 0.05, 0.08, 30, 0.002, 3);
        var fit = Calibration.Fit(Start, data, "strong", "1", priorSd: [1e-4, 1e-6, 1e-6]);
        Assert.Equal(Start.GateLengthNm, fit.GateLengthNm, 3);
        Assert.Equal(0, fit.ThresholdOffsetV, 4);
    }
}
