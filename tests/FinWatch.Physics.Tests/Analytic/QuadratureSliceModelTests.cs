using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>
/// The Gauss–Legendre form of the slice model (<see cref="QuadratureSliceModel"/>) against the 200-slice midpoint sum of
/// docs/model.md §E.1–E.4 (<see cref="SliceModel.Evaluate(SliceModelInput)"/>), and its exact per-node pieces against the
/// reference implementations (B.2, B.5, C.3, E.1, E.2).
/// </summary>
public sealed class QuadratureSliceModelTests
{
    private const double Barrier = 0.155;

    public static TheoryData<double, double, GateFaces> ParameterSets() => new()
    {
        { 14, 0, GateFaces.TriGate },
        { 20, 1e17, GateFaces.TriGate },
        { 26, 1e18, GateFaces.TriGate },
        { 14, 1e18, GateFaces.TriGate },
        { 20, 1e16, GateFaces.DoubleGate },
        { 26, 0, GateFaces.DoubleGate },
    };

    [Theory]
    [MemberData(nameof(ParameterSets))]
    public void Evaluate_H1Profiles_AgreesWithTwoHundredSliceSum(double gateLengthNm, double doping, GateFaces faces)
    {
        // Convergence check against the 200-slice sum (E.1: 200–400 midpoint slices converge to < 0.1 mV; the quadrature is
        // the same integral): 300 seeded H.1 profiles (w_mid 5–10, θ 0–6°, H 30–55, r 0–4, EOT 0.8–1.2), absolute values.
        var random = new Random(4242 + (int)gateLengthNm);
        int checkedCount = 0;
        foreach (SliceModelInput input in Inputs(random, 300, gateLengthNm, doping, faces))
        {
            SliceModelResult slow = SliceModel.Evaluate(input);
            SliceModelResult fast = QuadratureSliceModel.Evaluate(input);
            Assert.Equal(slow.PunchThrough, fast.PunchThrough);
            Assert.Equal(slow.CornerFraction, fast.CornerFraction, 1e-15);
            Assert.Equal(slow.MinLengthRatio, fast.MinLengthRatio, 1e-9);
            if (slow.PunchThrough)
            {
                continue;
            }

            checkedCount++;
            Assert.Equal(1000 * slow.ThresholdLowV, 1000 * fast.ThresholdLowV, 0.01);
            Assert.Equal(1000 * slow.ThresholdHighV, 1000 * fast.ThresholdHighV, 0.01);
            Assert.Equal(1000 * slow.SwingLowVPerDecade, 1000 * fast.SwingLowVPerDecade, 0.01);
            Assert.Equal(1000 * slow.SwingHighVPerDecade, 1000 * fast.SwingHighVPerDecade, 0.01);
            Assert.Equal(1000 * slow.DiblVPerV, 1000 * fast.DiblVPerV, 0.01);
        }

        Assert.True(checkedCount > 250, $"only {checkedCount} profiles without punch-through");
    }

    [Fact]
    public void Predict_H1Profiles_MatchesTwoHundredSliceDifferences()
    {
        // Convergence check against the 200-slice sum, on the reported G.2 step 6 differences (record − nominal).
        ThresholdModel model = AnalyticFixtures.G4Model;
        CalibrationParameters parameters = AnalyticFixtures.G4Parameters;
        SliceModelResult nominal = SliceModel.Evaluate(parameters.ToSliceInput(parameters.Nominal));
        var random = new Random(99);
        foreach (SliceModelInput input in Inputs(random, 200, parameters.GateLengthNm, parameters.DopingPerCm3, GateFaces.TriGate))
        {
            var fin = new FinMeasurement(input.Profile, input.EotNm, input.EotNm + 1, GateFaces.TriGate);
            SliceModelResult slow = SliceModel.Evaluate(parameters.ToSliceInput(fin));
            ThresholdPrediction p = model.Predict(fin);
            Assert.Equal(1000 * (slow.ThresholdLowV - nominal.ThresholdLowV), p.DeltaThresholdLinMv, 0.01);
            Assert.Equal(1000 * (slow.ThresholdHighV - nominal.ThresholdHighV), p.DeltaThresholdSatMv, 0.01);
            Assert.Equal(1000 * (slow.SwingLowVPerDecade - nominal.SwingLowVPerDecade), p.DeltaSwingLinMvPerDecade, 0.01);
            Assert.Equal(1000 * (slow.DiblVPerV - nominal.DiblVPerV), p.DeltaDiblMvPerV, 0.01);
            Assert.Equal(slow.MinLengthRatio, p.MinLengthRatio, 1e-9);
        }
    }

    [Fact]
    public void Evaluate_WithDetails_StillListsEverySliceAndAgreesWithQuadrature()
    {
        // E.1/E.2: the detailed path keeps 200 slices plus the corner device (shares sum to 1) and is the same result.
        SliceModelInput input = AnalyticFixtures.G4Parameters.ToSliceInput(AnalyticFixtures.G4Nominal);
        var details = new List<SliceDetail>();
        SliceModelResult withDetails = SliceModel.Evaluate(input, details);
        Assert.Equal(201, details.Count);
        Assert.True(details[^1].IsCorner);
        Assert.Equal(1, details.Sum(d => d.CurrentShareLin), 1e-9);
        Assert.Equal(SliceModel.Evaluate(input), withDetails);
        SliceModelResult fast = QuadratureSliceModel.Evaluate(input);
        Assert.Equal(1000 * withDetails.ThresholdLowV, 1000 * fast.ThresholdLowV, 0.01);
        Assert.Equal(1000 * withDetails.ThresholdHighV, 1000 * fast.ThresholdHighV, 0.01);
    }

    [Fact]
    public void Evaluate_ShortGate_PunchesThroughLikeTheSliceSum()
    {
        // B.5: no barrier at L/λ ≈ 0.64 (L = 3 nm) in both forms (NaN results, flag set).
        SliceModelInput input = AnalyticFixtures.G4Parameters.ToSliceInput(AnalyticFixtures.G4Nominal, gateLengthNm: 3);
        SliceModelResult slow = SliceModel.Evaluate(input);
        SliceModelResult fast = QuadratureSliceModel.Evaluate(input);
        Assert.True(slow.PunchThrough);
        Assert.True(fast.PunchThrough);
        Assert.True(double.IsNaN(fast.ThresholdLowV));
        Assert.Equal(slow.MinLengthRatio, fast.MinLengthRatio, 1e-9);
    }

    [Fact]
    public void Evaluate_InvalidInputs_ThrowAsTheSliceSum()
    {
        // E.1 input validation: slice count outside 200–400, and a width that reaches zero inside the fin.
        SliceModelInput input = AnalyticFixtures.G4Parameters.ToSliceInput(AnalyticFixtures.G4Nominal);
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadratureSliceModel.Evaluate(input with { SliceCount = 100 }));
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadratureSliceModel.Evaluate(input with { EotNm = -1 }));
        Assert.Throws<ArgumentOutOfRangeException>(() => QuadratureSliceModel.Evaluate(input with { Profile = new FinProfile(-1, 10, 42, 0) }));
        Assert.Throws<ArgumentNullException>(() => QuadratureSliceModel.Evaluate(null!));
    }

    [Fact]
    public void ThresholdClosedForm_MatchesBrentRoot()
    {
        // B.5: the closed-form root of ψ_min(ψ_L*) = φ_th equals the Brent root (tolerance 1e-13 V) and the same slope.
        int compared = 0;
        foreach (double d in new[] { 0.02, 0.155, 0.4, 1.0 })
        {
            foreach (double v in new[] { 0.0, 0.05, 0.3, 0.75, 1.5 })
            {
                for (double ell = 0.2; ell < 60; ell *= 1.13)
                {
                    ShortChannelThreshold brent = ShortChannel.Threshold(d, v, ell);
                    ShortChannelThreshold closed = ShortChannel.ThresholdClosedForm(d, v, ell);
                    Assert.Equal(brent.PunchThrough, closed.PunchThrough);
                    if (brent.PunchThrough)
                    {
                        continue;
                    }

                    compared++;
                    Assert.Equal(brent.ShiftV, closed.ShiftV, 1e-11);
                    Assert.Equal(brent.BarrierSlope, closed.BarrierSlope, 1e-9);
                    Assert.Equal(brent.SwingVPerDecade, closed.SwingVPerDecade, 1e-9);
                }
            }
        }

        Assert.True(compared > 500);
    }

    [Fact]
    public void ThresholdClosedForm_LargeLengthRatio_IsLongChannel()
    {
        // B.5: above ℓ ≈ 700 the channel is treated as long (no shift, slope 1), through the Brent path's rule.
        ShortChannelThreshold t = ShortChannel.ThresholdClosedForm(0.155, 0.75, 800);
        Assert.Equal(0, t.ShiftV);
        Assert.Equal(1, t.BarrierSlope);
    }

    [Theory]
    [InlineData(5, 0)]
    [InlineData(7.5, 1e16)]
    [InlineData(10, 1e17)]
    [InlineData(16, 1e18)]
    [InlineData(0.8, 1e18)]
    public void EffectiveWidthSeries_MatchesQuadrature(double width, double doping)
    {
        double a = PhysicalConstants.ElementaryChargeC * doping
            / (2 * PhysicalConstants.SiliconPermittivityFPerCm * PhysicalConstants.ThermalVoltageV) * 1e-14;
        // E.1: W_eff by the exact Dawson series equals a converged 200-panel quadrature of the same integral to 1e-13,
        // and the model's 4-panel quadrature to its own 1e-10 quadrature error (≈ 1e-12 V in V_T).
        double half = 0.5 * width;
        double converged = 2 * Quadrature.GaussLegendre(x => Math.Exp(-a * ((half * half) - (x * x))), 0, half, 200);
        double series = QuadratureSliceModel.EffectiveWidthSeriesNm(width, a);
        Assert.Equal(converged, series, 1e-13 * width);
        Assert.Equal(SliceModel.EffectiveWidthNm(width, doping), series, 1e-10 * width);
    }

    [Fact]
    public void SubbandSum_MatchesDirectSum()
    {
        // C.3: Σ_{j≥1} exp(−j² x), through the theta identity for x ≤ 1, equals the direct sum to 1e-14 relative.
        for (double x = 0.005; x < 6; x *= 1.07)
        {
            double direct = 0;
            for (int j = 1; j < 20000; j++)
            {
                direct += Math.Exp(-(double)j * j * x);
            }

            Assert.Equal(direct, QuadratureSliceModel.SubbandSum(x), 1e-14 * direct);
        }
    }

    private static IEnumerable<SliceModelInput> Inputs(Random random, int count, double gateLengthNm, double doping, GateFaces faces)
    {
        for (int i = 0; i < count;)
        {
            double mid = 5 + (5 * random.NextDouble()), theta = 6 * random.NextDouble(), h = 30 + (25 * random.NextDouble());
            double half = h * Math.Tan(theta * Math.PI / 180), top = mid - half;
            if (top < 1)
            {
                continue;
            }

            double r = Math.Min(4, 0.5 * top) * random.NextDouble(), eot = 0.8 + (0.4 * random.NextDouble());
            i++;
            yield return new SliceModelInput(
                new FinProfile(top, mid + half, h, r), eot, faces, gateLengthNm, 0.05, 0.75, doping, Barrier, 1e11, 1,
                ConfinementSurface.Si110, CornerCoefficients.Default, 200);
        }
    }
}
