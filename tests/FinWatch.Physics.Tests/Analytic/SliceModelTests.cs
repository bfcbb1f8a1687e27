using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Tapered fin as parallel slices (docs/model.md §E.1–E.4).</summary>
public sealed class SliceModelTests
{
    private const double Vt = PhysicalConstants.ThermalVoltageV;
    private const double Barrier = 0.155;

    private static SliceModelInput Input(FinProfile p, GateFaces faces, double eot = 0.9, double l = 20, double na = 1e17, int slices = 200) =>
        new(p, eot, faces, l, 0.05, 0.75, na, Barrier, 1e11, 1, ConfinementSurface.Si110, CornerCoefficients.Default, slices);

    [Fact]
    public void LinearProfileThreshold_NoteExample_Is35p52Mv()
    {
        // E.2 [D] check: V_a = 0, ΔV = 100 mV, n = 1 gives 35.52 mV.
        Assert.Equal(0.03552, SliceModel.LinearProfileThresholdV(0, 0.1, 1), 5e-6);
    }

    [Fact]
    public void EffectiveThreshold_LinearSlices_MatchesClosedForm()
    {
        // E.2 [D]: the slice root with a common n reduces to the closed form (midpoint rule, 400 slices).
        const int n = 400;
        var vt = new double[n];
        var ideality = new double[n];
        var g = new double[n];
        for (int i = 0; i < n; i++)
        {
            vt[i] = 0.1 * (i + 0.5) / n;
            ideality[i] = 1;
            g[i] = 1.0 / n;
        }

        Assert.Equal(SliceModel.LinearProfileThresholdV(0, 0.1, 1), SliceModel.EffectiveThresholdV(vt, ideality, g), 1e-6);
    }

    [Fact]
    public void EffectiveThreshold_SoftMinimum_LiesBetweenMinAndMeanAndSwingIsHarmonic()
    {
        // E.2/E.3 [D]: V_T,eff is a soft minimum; equal n ⇒ S_eff = n v_t ln 10.
        double[] vt = [0.30, 0.35, 0.40];
        double[] n = [1.1, 1.1, 1.1];
        double[] g = [1.0 / 3, 1.0 / 3, 1.0 / 3];
        double v = SliceModel.EffectiveThresholdV(vt, n, g);
        Assert.InRange(v, 0.30, 0.35);
        Assert.Equal(1.1 * Vt * Math.Log(10), SliceModel.EffectiveSwingVPerDecade(vt, n, g, v), 1e-14);
    }

    [Fact]
    public void EffectiveThreshold_NearlyEqualThresholds_ReturnsCommonValue()
    {
        // E.2: equal slices ⇒ V_T,eff = V_T; rounding-level differences must not break the bracket.
        double[] vt = [0.3, 0.3 + 1e-14, 0.3 - 1e-14];
        double[] n = [1.2, 1.2, 1.2];
        double[] g = [0.25, 0.5, 0.25];
        Assert.Equal(0.3, SliceModel.EffectiveThresholdV(vt, n, g), 1e-11);
    }

    [Theory]
    [InlineData(7, 9)]
    [InlineData(5, 10)]
    public void LongChannelThreshold_UndopedWidthChange_IsVolumeInversionTerm(double w1, double w2)
    {
        // E.1: the volume-inversion term changes V_T by −v_t·ln(w₂/w₁) (undoped; the depletion term is 0).
        double d = SliceModel.LongChannelThresholdV(w2, 1, 0, 1e11) - SliceModel.LongChannelThresholdV(w1, 1, 0, 1e11);
        Assert.Equal(-Vt * Math.Log(w2 / w1), d, 1e-14);
    }

    [Theory]
    [InlineData(7, -3.7)]
    [InlineData(8, -3.2)]
    public void LongChannelThreshold_UndopedSlope_IsMinusVtOverW(double w, double expectedMvPerNm)
    {
        // E.1: −v_t/w per nm: −3.7 mV/nm at 7 nm, −3.2 at 8 nm.
        double slope = 1000 * (SliceModel.LongChannelThresholdV(w + 0.01, 1, 0, 1e11) - SliceModel.LongChannelThresholdV(w - 0.01, 1, 0, 1e11)) / 0.02;
        Assert.Equal(expectedMvPerNm, slope, 0.05);
    }

    [Fact]
    public void VolumeInversionPotential_UndopedEightNm_IsAbout0p44V()
    {
        // B.5: φ_th ≈ v_t ln(n_th/nᵢ) ≈ 0.44 V at n_th ≈ 2.5e17–3e17 cm⁻³ (2·1e11 cm⁻² over 8 nm).
        Assert.Equal(Vt * Math.Log(2e11 / (1e10 * 8e-7)), SliceModel.VolumeInversionPotentialV(8, 0, 1e11), 1e-14);
        Assert.Equal(0.44, SliceModel.VolumeInversionPotentialV(8, 0, 1e11), 0.005);
    }

    [Theory]
    [InlineData(8, 1e17)]
    [InlineData(10, 1e18)]
    [InlineData(8, 5e18)]
    public void EffectiveWidth_Doped_MatchesSeries(double w, double na)
    {
        // E.1: W_eff = 2e^{−ac²}∫₀^c e^{ax²}dx, c = w/2, with ∫₀^c e^{ax²}dx = Σ aⁿc^{2n+1}/(n!(2n+1)) (term-wise integration).
        double a = 1.602176634e-19 * na / (2 * 11.7 * 8.8541878128e-14 * Vt) * 1e-14;
        double c = w / 2, sum = 0, term = c;
        for (int n = 0; n < 60; n++)
        {
            sum += term / ((2 * n) + 1);
            term *= a * c * c / (n + 1);
        }

        // 4 Gauss–Legendre panels: ≤ 1e-10 relative up to 5e18 cm⁻³.
        Assert.Equal(2 * Math.Exp(-a * c * c) * sum, SliceModel.EffectiveWidthNm(w, na), 1e-9);
        Assert.Equal(w, SliceModel.EffectiveWidthNm(w, 0));
    }

    [Fact]
    public void Evaluate_UniformHardMaskFin_EqualsSingleSlice()
    {
        // E.1/E.2: an untapered fin has identical slices, so the slice model equals one slice; no corners under a hard mask.
        var p = new FinProfile(8, 8, 42, 0);
        SliceModelResult r = SliceModel.Evaluate(Input(p, GateFaces.DoubleGate));
        double ratio = 20 / ScaleLength.DoubleGateExactNm(8, 0.9);
        double vBase = SliceModel.LongChannelThresholdV(8, 0.9, 1e17, 1e11) + QuantumConfinement.DensityOfStatesShiftV(8);
        ShortChannelThreshold lo = ShortChannel.Threshold(Barrier, 0.05, ratio);
        ShortChannelThreshold hi = ShortChannel.Threshold(Barrier, 0.75, ratio);
        Assert.Equal(0, r.CornerFraction);
        Assert.Equal(vBase + lo.ShiftV, r.ThresholdLowV, 1e-11);
        Assert.Equal(vBase + hi.ShiftV, r.ThresholdHighV, 1e-11);
        Assert.Equal(lo.SwingVPerDecade, r.SwingLowVPerDecade, 1e-11);
        Assert.Equal(-(hi.ShiftV - lo.ShiftV) / 0.7, r.DiblVPerV, 1e-9);
        Assert.Equal(ratio, r.MinLengthRatio, 1e-12);
    }

    [Fact]
    public void Evaluate_UniformTriGateFin_EqualsSingleSlicePlusCornerDevice()
    {
        // E.4 with D.2: uniform slices plus the corner term (weight f_c, same n, V_T − ΔV_c) reproduce the D.2 closed form.
        var p = new FinProfile(8, 8, 42, 1);
        SliceModelResult r = SliceModel.Evaluate(Input(p, GateFaces.TriGate, na: 1e18));
        double ratio = 20 / ScaleLength.RectangularFinNm(8, 42, 0.9, GateFaces.TriGate);
        double vBase = SliceModel.LongChannelThresholdV(8, 0.9, 1e18, 1e11) + QuantumConfinement.DensityOfStatesShiftV(8);
        ShortChannelThreshold lo = ShortChannel.Threshold(Barrier, 0.05, ratio);
        double fc = Corner.CurrentFraction(0.5, FinCrossSection.GatedPerimeterNm(p, GateFaces.TriGate), GateFaces.TriGate);
        double dvc = Corner.LocalLoweringV(1, 8, 0.9, 1e18, CornerCoefficients.Default);
        double expected = vBase + lo.ShiftV + Corner.ThresholdShiftV(fc, dvc, 1 / lo.BarrierSlope);
        Assert.Equal(fc, r.CornerFraction, 1e-15);
        Assert.Equal(expected, r.ThresholdLowV, 1e-11);
        Assert.Equal(lo.SwingVPerDecade, r.SwingLowVPerDecade, 1e-11);
    }

    [Fact]
    public void Evaluate_SliceCount200Versus400_AgreesWithinTenthMillivolt()
    {
        // E.1: 200–400 slices; the result converges to < 0.1 mV.
        var p = new FinProfile(5, 11, 40, 0);
        SliceModelResult a = SliceModel.Evaluate(Input(p, GateFaces.TriGate, eot: 1, slices: 200));
        SliceModelResult b = SliceModel.Evaluate(Input(p, GateFaces.TriGate, eot: 1, slices: 400));
        Assert.Equal(b.ThresholdLowV, a.ThresholdLowV, 1e-4);
        Assert.Equal(b.ThresholdHighV, a.ThresholdHighV, 1e-4);
    }

    [Fact]
    public void Evaluate_TaperedFin_SoftMinimumBelowMidWidthValue()
    {
        // E.2 [D] prototype, not a published source: a 5/11 nm fin (w_mid 8, H 40, L 20, EOT 1) has V_T,eff 8 mV (lin) and
        // 27 mV (sat) below the uniform 8 nm fin. With the constant V_bi − φ_th that reproduces the G.4 table this
        // implementation gives 7.1 and 26.0 mV, hence the ±1.5 mV tolerance (see the report).
        SliceModelResult t = SliceModel.Evaluate(Input(new FinProfile(5, 11, 40, 0), GateFaces.TriGate, eot: 1));
        SliceModelResult u = SliceModel.Evaluate(Input(new FinProfile(8, 8, 40, 0), GateFaces.TriGate, eot: 1));
        Assert.Equal(-8, 1000 * (t.ThresholdLowV - u.ThresholdLowV), 1.5);
        Assert.Equal(-27, 1000 * (t.ThresholdHighV - u.ThresholdHighV), 1.5);
    }

    [Fact]
    public void Evaluate_GateShorterThanBarrierAllows_FlagsPunchThroughWithNaN()
    {
        // B.5 validity: the barrier is gone at L ≪ λ; flagged, never a silent number.
        SliceModelResult r = SliceModel.Evaluate(Input(new FinProfile(8, 8, 42, 0), GateFaces.TriGate, l: 1.5));
        Assert.True(r.PunchThrough);
        Assert.True(double.IsNaN(r.ThresholdHighV));
        Assert.True(r.MinLengthRatio < 3);
    }

    [Theory]
    [InlineData(199)]
    [InlineData(401)]
    public void Evaluate_SliceCountOutsideRange_Throws(int slices)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => SliceModel.Evaluate(Input(new FinProfile(8, 8, 42, 0), GateFaces.TriGate, slices: slices)));
    }
}
