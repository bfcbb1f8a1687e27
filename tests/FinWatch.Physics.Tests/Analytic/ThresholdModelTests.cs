using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Per-record pipeline (docs/model.md §G.2): differences against the nominal, warnings, linear estimate and stamp.</summary>
public sealed class ThresholdModelTests
{
    private static ThresholdModel Model => AnalyticFixtures.G4Model;

    private static FinMeasurement Fin(double wt, double wb, double h = 42, double r = 2, double eot = 0.9, GateFaces faces = GateFaces.TriGate) =>
        new(new FinProfile(wt, wb, h, r), eot, 2.0, faces);

    [Fact]
    public void Predict_Nominal_ShiftsAreExactlyZeroWithoutWarnings()
    {
        // G.2 step 6 property: the nominal against itself is exactly 0 (same code, same calibration).
        ThresholdPrediction p = Model.Predict(AnalyticFixtures.G4Nominal);
        Assert.Equal(0, p.DeltaThresholdLinMv);
        Assert.Equal(0, p.DeltaThresholdSatMv);
        Assert.Equal(0, p.DeltaSwingLinMvPerDecade);
        Assert.Equal(0, p.DeltaDiblMvPerV);
        Assert.Equal(0, p.LinearSat.Total);
        Assert.Equal(ModelWarnings.None, p.Warnings);
    }

    [Fact]
    public void Predict_AnyRecord_IsStampedWithParameterSetAndCode()
    {
        // G.5: stamp every prediction with the parameter set and the code version.
        ThresholdPrediction p = Model.Predict(Fin(6.4, 10.2));
        Assert.Equal("g4-example", p.ParameterSetName);
        Assert.Equal("2026.12-test", p.ParameterSetVersion);
        Assert.Equal(ThresholdModel.CodeVersion, p.CodeVersion);
    }

    [Theory]
    [InlineData(6.3, 10.1, 42, 2, 0.9)]
    [InlineData(5.6, 9.9, 43.5, 1.5, 0.95)]
    [InlineData(6.2, 10.4, 40, 2.5, 0.87)]
    public void Predict_Record_ContributionsSumToLinearEstimate(double wt, double wb, double h, double r, double eot)
    {
        // G.2 step 7 property: the per-input contributions add up to the linear estimate.
        ThresholdPrediction p = Model.Predict(Fin(wt, wb, h, r, eot));
        ShiftContributions c = p.LinearSat;
        Assert.Equal(c.MidWidth + c.Taper + c.Height + c.CornerRadius + c.Dielectric, c.Total, 1e-12);
        Assert.Equal(
            p.LinearLin.MidWidth + p.LinearLin.Taper + p.LinearLin.Height + p.LinearLin.CornerRadius + p.LinearLin.Dielectric,
            p.LinearLin.Total,
            1e-12);
    }

    [Theory]
    [InlineData(6.3, 10.3, 42, 2, 0.9)]
    [InlineData(5.8, 10.2, 42, 2, 0.9)]
    [InlineData(6, 10, 43, 2, 0.9)]
    [InlineData(6, 10, 42, 2, 0.92)]
    [InlineData(6.1, 10.15, 41.5, 2.2, 0.91)]
    public void Predict_SmallChange_LinearEstimateTracksFullModel(double wt, double wb, double h, double r, double eot)
    {
        // G.4/G.2 step 7 [D]: for steps near the G.4 ones the linear estimate is first-order accurate (here within 3 % + 0.05 mV).
        ThresholdPrediction p = Model.Predict(Fin(wt, wb, h, r, eot));
        Assert.Equal(p.DeltaThresholdLinMv, p.LinearLin.Total, (0.03 * Math.Abs(p.DeltaThresholdLinMv)) + 0.05);
        Assert.Equal(p.DeltaThresholdSatMv, p.LinearSat.Total, (0.03 * Math.Abs(p.DeltaThresholdSatMv)) + 0.05);
        Assert.False(p.Warnings.HasFlag(ModelWarnings.Nonlinear));
    }

    [Fact]
    public void Predict_WiderFin_LowersThresholdMoreInSaturation()
    {
        // H.3 [D]: dV_T/dw ≈ −15 (lin) and −27 (sat) mV/nm; DIBL rises with width.
        ThresholdPrediction p = Model.Predict(Fin(6.5, 10.5));
        Assert.True(p.DeltaThresholdSatMv < p.DeltaThresholdLinMv && p.DeltaThresholdLinMv < 0);
        Assert.True(p.DeltaDiblMvPerV > 0);
    }

    [Fact]
    public void Predict_WidthOutsideRange_WarnsButStillPredicts()
    {
        // H.1: fin width 5–10 nm; outside, warn.
        ThresholdPrediction p = Model.Predict(Fin(10, 13));
        Assert.True(p.Warnings.HasFlag(ModelWarnings.WidthOutOfRange));
        Assert.True(double.IsFinite(p.DeltaThresholdSatMv));
    }

    [Fact]
    public void Predict_RangesOutside_RaiseEachWarning()
    {
        // H.1 ranges and A.4 r ≤ r_max.
        Assert.True(Model.Predict(Fin(6, 10, h: 60)).Warnings.HasFlag(ModelWarnings.HeightOutOfRange));
        Assert.True(Model.Predict(Fin(3, 13)).Warnings.HasFlag(ModelWarnings.TaperOutOfRange));
        Assert.True(Model.Predict(Fin(9, 9, r: 4.5)).Warnings.HasFlag(ModelWarnings.RadiusOutOfRange));
        Assert.True(Model.Predict(Fin(6, 10, r: 3.5)).Warnings.HasFlag(ModelWarnings.RadiusExceedsMax));
        Assert.True(Model.Predict(Fin(6, 10, eot: 1.3)).Warnings.HasFlag(ModelWarnings.EotOutOfRange));
        Assert.True(Model.Predict(Fin(6, 10) with { PhysicalThicknessNm = 0.5 }).Warnings.HasFlag(ModelWarnings.DielectricInconsistent));
    }

    [Fact]
    public void Predict_InvalidProfile_ReturnsNaNWithWarningInsteadOfThrowing()
    {
        // G.2 step 1: a record that is not a fin is flagged, never a silent number.
        ThresholdPrediction p = Model.Predict(Fin(0, 10));
        Assert.True(p.Warnings.HasFlag(ModelWarnings.InvalidInput));
        Assert.True(double.IsNaN(p.DeltaThresholdLinMv));
        Assert.True(Model.Predict(Fin(6, 10, eot: double.NaN)).Warnings.HasFlag(ModelWarnings.InvalidInput));
    }

    [Fact]
    public void Predict_VeryWideRecord_FlagsPunchThroughWithNaN()
    {
        // B.5 / H.4.7: a 300 nm wide "fin" has L/λ ≪ 3 and no barrier at V_DS,sat: warnings, NaN, no exception.
        ThresholdPrediction p = Model.Predict(Fin(300, 300, r: 0));
        Assert.True(p.Warnings.HasFlag(ModelWarnings.LengthToScaleBelowThree));
        Assert.True(p.Warnings.HasFlag(ModelWarnings.PunchThrough));
        Assert.True(double.IsNaN(p.DeltaThresholdSatMv));
    }

    [Fact]
    public void Predict_ShortGateParameterSet_WarnsLengthToScaleBelowThree()
    {
        // B.5 validity / H.4.7: not meaningful for L_eff/λ < 3; the result carries the warning.
        var model = new ThresholdModel(AnalyticFixtures.G4Parameters with { GateLengthNm = 11 });
        ThresholdPrediction p = model.Predict(AnalyticFixtures.G4Nominal);
        Assert.True(p.MinLengthRatio < 3);
        Assert.True(p.Warnings.HasFlag(ModelWarnings.LengthToScaleBelowThree));
        Assert.True(p.Warnings.HasFlag(ModelWarnings.GateLengthOutOfRange));
    }

    [Fact]
    public void Predict_HardMaskRecordAgainstTriGateNominal_FlagsNonlinear()
    {
        // A.7: a hard-mask record is outside the tri-gate sensitivity basis, so the linear estimate is not applicable.
        ThresholdPrediction p = Model.Predict(Fin(6, 10, faces: GateFaces.DoubleGate));
        Assert.True(p.Warnings.HasFlag(ModelWarnings.Nonlinear));
        Assert.True(p.DeltaThresholdSatMv < 0);
    }

    [Theory]
    [InlineData(10, 7.9, true)]
    [InlineData(10, 8.1, false)]
    [InlineData(40, 34.9, true)]
    [InlineData(40, 35.1, false)]
    [InlineData(0, 0, false)]
    public void IsNonlinear_Gap_FollowsTwentyPercentOrFiveMillivoltRule(double full, double linear, bool expected)
    {
        // G.2 step 7: flag when |full − linear| exceeds 20 % or 5 mV.
        Assert.Equal(expected, ThresholdModel.IsNonlinear(full, linear));
    }

    [Fact]
    public void Constructor_NominalThatPunchesThrough_Throws()
    {
        // B.5: no threshold exists for the nominal; the parameter set is unusable.
        Assert.Throws<ArgumentException>(() => new ThresholdModel(AnalyticFixtures.G4Parameters with { GateLengthNm = 1.5 }));
    }
}
