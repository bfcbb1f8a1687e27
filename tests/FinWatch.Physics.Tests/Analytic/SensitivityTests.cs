using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>
/// G.4 sensitivity table. Expected values are the example table of docs/model.md §G.4: [D] prototype, not a published source;
/// each is checked to the precision that table quotes (half a unit of its last digit).
/// </summary>
public sealed class SensitivityTests
{
    public static TheoryData<SensitivityParameter, double, double, double, double, double> G4Table => new()
    {
        // parameter, dV_T,lin (mV), dV_T,sat (mV), dS_lin (mV/dec), dDIBL (mV/V), tolerance (half the last quoted digit)
        { SensitivityParameter.MidWidth, -14.8, -26.5, 2.9, 16.7, 0.05 },
        { SensitivityParameter.Taper, -2.3, -8.2, 1.3, 8.4, 0.05 },
        { SensitivityParameter.Height, -0.06, -0.16, 0.02, 0.13, 0.005 },
        { SensitivityParameter.GateLength, 5.7, 14.0, -2.0, -11.9, 0.05 },
    };

    [Theory]
    [MemberData(nameof(G4Table))]
    public void Compute_G4Nominal_MatchesNoteExampleTable(SensitivityParameter p, double lin, double sat, double swing, double dibl, double tol)
    {
        // G.4 example table [D] prototype, not a published source.
        SensitivityRow row = AnalyticFixtures.G4Model.Sensitivities[p];
        Assert.Equal(lin, row.ThresholdLinMv, tol);
        Assert.Equal(sat, row.ThresholdSatMv, tol);
        Assert.Equal(swing, row.SwingLinMvPerDecade, tol);
        Assert.Equal(dibl, row.DiblMvPerV, tol);
    }

    [Fact]
    public void Compute_G4Nominal_EotRowMatchesNoteExampleTable()
    {
        // G.4 [D] prototype, not a published source: EOT −37, −93, +13.8, +80 per nm.
        SensitivityRow row = AnalyticFixtures.G4Model.Sensitivities[SensitivityParameter.Eot];
        Assert.Equal(-37, row.ThresholdLinMv, 0.5);
        Assert.Equal(-93, row.ThresholdSatMv, 0.5);
        Assert.Equal(13.8, row.SwingLinMvPerDecade, 0.05);
        Assert.Equal(80, row.DiblMvPerV, 0.5);
    }

    [Fact]
    public void Compute_G4Nominal_DopingAndRadiusRowsMatchNoteExampleTable()
    {
        // G.4 [D] prototype, not a published source: N_A per 1e17: +2.7, +2.9, ≈ 0, −0.2; r: ≈ 0 for all four (N_A = 1e17).
        SensitivityRow na = AnalyticFixtures.G4Model.Sensitivities[SensitivityParameter.Doping];
        Assert.Equal(2.7, na.ThresholdLinMv, 0.05);
        Assert.Equal(2.9, na.ThresholdSatMv, 0.05);
        Assert.InRange(na.SwingLinMvPerDecade, -0.1, 0.1);
        Assert.Equal(-0.2, na.DiblMvPerV, 0.05);

        SensitivityRow r = AnalyticFixtures.G4Model.Sensitivities[SensitivityParameter.CornerRadius];
        Assert.InRange(r.ThresholdLinMv, -0.05, 0.05);
        Assert.InRange(r.ThresholdSatMv, -0.05, 0.05);
        Assert.InRange(r.SwingLinMvPerDecade, -0.05, 0.05);
        Assert.InRange(r.DiblMvPerV, -0.05, 0.05);
        Assert.False(r.OneSided);
    }

    [Fact]
    public void Evaluate_G4Nominal_MatchesNoteNominalValues()
    {
        // G.4 [D] prototype, not a published source: the nominal gives V_T,lin − V_T,sat = 52 mV, DIBL = 75 mV/V, S_lin = 73 mV/dec.
        CalibrationParameters ps = AnalyticFixtures.G4Parameters;
        SliceModelResult r = SliceModel.Evaluate(ps.ToSliceInput(ps.Nominal));
        Assert.Equal(52, 1000 * (r.ThresholdLowV - r.ThresholdHighV), 0.5);
        Assert.Equal(75, 1000 * r.DiblVPerV, 0.5);
        Assert.Equal(73, 1000 * r.SwingLowVPerDecade, 0.5);
    }

    [Fact]
    public void Compute_SharpNominal_UsesForwardDifferenceForRadius()
    {
        // G.4 steps with a nominal at r = 0: r − 0.1 nm is not a fin, so the radius row is one-sided.
        CalibrationParameters ps = AnalyticFixtures.G4Parameters with
        {
            Nominal = AnalyticFixtures.G4Nominal with { Profile = new FinProfile(6, 10, 42, 0) },
        };
        SensitivityTable t = Sensitivity.Compute(ps);
        Assert.True(t[SensitivityParameter.CornerRadius].OneSided);
        Assert.False(t[SensitivityParameter.MidWidth].OneSided);
    }

    [Fact]
    public void PropagateVariance_DiagonalCovariance_IsSumOfSquaredContributions()
    {
        // G.4: σ² = Sᵀ Σ S; diagonal Σ ⇒ Σ Sᵢ² σᵢ².
        double[] s = [-14.8, -2.3, -0.06];
        double[] cov = [0.04, 0, 0, 0, 0.25, 0, 0, 0, 1.0];
        Assert.Equal((14.8 * 14.8 * 0.04) + (2.3 * 2.3 * 0.25) + (0.06 * 0.06), Sensitivity.PropagateVariance(s, cov), 1e-12);
    }

    [Fact]
    public void PropagateVariance_PerfectlyAnticorrelatedEqualSensitivities_Cancels()
    {
        // G.4: correlated metrology errors must not be added as independent: S = (a, a), ρ = −1 ⇒ σ² = 0.
        double[] s = [3, 3];
        double[] cov = [0.5, -0.5, -0.5, 0.5];
        Assert.Equal(0, Sensitivity.PropagateVariance(s, cov), 1e-15);
    }

    [Fact]
    public void PropagateVariance_MismatchedSizes_Throws()
    {
        Assert.Throws<ArgumentException>(() => Sensitivity.PropagateVariance([1, 2], [1, 0, 0]));
    }

    [Fact]
    public void MetrologySd_OnlyHeight_IsDerivativeTimesSigma()
    {
        // σ² = Sᵀ Σ S with Σ = diag(0, …, σ_H², …) is (dV/dH · σ_H)² exactly (G.4).
        var table = Sensitivity.Compute(AnalyticFixtures.G4Parameters);
        double expected = Math.Abs(table[SensitivityParameter.Height].Derivative(ModelOutput.ThresholdSat)) * 0.8;
        Assert.Equal(expected, table.MetrologySd(ModelOutput.ThresholdSat, 0, 0, 0.8, 0), 1e-12);
    }

    [Fact]
    public void MetrologySd_WidthErrors_MatchMonteCarloOfTheLinearEstimate()
    {
        // The propagated σ against the sample σ of the linear estimate (G.2 step 7) over 20,000 fins with normal errors on
        // W_t and W_b (0.3 and 0.5 nm) and r (0.2 nm): a sample σ from 20,000 draws is within about 1 % (3 σ of its own error).
        var parameters = AnalyticFixtures.G4Parameters;
        var table = Sensitivity.Compute(parameters);
        double propagated = table.MetrologySd(ModelOutput.ThresholdLin, 0.3, 0.5, 0, 0.2);
        var random = new Random(11);
        var values = new double[20_000];
        for (int i = 0; i < values.Length; i++)
        {
            var p = parameters.Nominal.Profile;
            var fin = parameters.Nominal with
            {
                Profile = new FinProfile(p.TopWidthNm + (0.3 * Normal(random)), p.BottomWidthNm + (0.5 * Normal(random)), p.HeightNm, p.CornerRadiusNm + (0.2 * Normal(random))),
            };
            values[i] = table.Contributions(ProfileCoordinates.From(fin), ModelOutput.ThresholdLin).Total;
        }

        double mean = values.Average();
        double sd = Math.Sqrt(values.Sum(v => (v - mean) * (v - mean)) / (values.Length - 1));
        Assert.Equal(propagated, sd, 0.015 * propagated);
    }

    private static double Normal(Random r) => Math.Sqrt(-2 * Math.Log(1 - r.NextDouble())) * Math.Cos(2 * Math.PI * r.NextDouble());
}
