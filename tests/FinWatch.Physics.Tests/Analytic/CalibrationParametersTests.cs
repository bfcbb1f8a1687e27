using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>The SCE prefactor V_bi − φ_th from its parts or fitted directly (G.3, B.5).</summary>
public sealed class CalibrationParametersTests
{
    private const double Vt = PhysicalConstants.ThermalVoltageV;

    [Fact]
    public void BuiltInPotentialFromDoping_1e20_Is0p595V()
    {
        // B.5: n⁺ = 1e20 cm⁻³ gives V_bi ≈ v_t ln(N_SD/nᵢ) = 0.595 V (non-degenerate).
        Assert.Equal(0.595, CalibrationParameters.BuiltInPotentialFromDopingV(1e20), 0.0005);
    }

    [Fact]
    public void BarrierHeight_Default_IsBuiltInMinusUndopedVolumePotentialAtNominalMidWidth()
    {
        // B.5: φ_th ≈ v_t ln(n_th/nᵢ), here n_th = 2 n_s,crit/w_mid of the nominal (w_mid = 8 nm).
        double expected = (Vt * Math.Log(1e20 / 1e10)) - (Vt * Math.Log(2e11 / (1e10 * 8e-7)));
        Assert.Equal(expected, AnalyticFixtures.G4Parameters.BarrierHeightV, 1e-14);
    }

    [Fact]
    public void BarrierHeight_PartsAndOverride_OverrideWins()
    {
        // G.3: V_bi − φ_th may be given by its parts or fitted directly.
        CalibrationParameters parts = AnalyticFixtures.G4Parameters with { BuiltInPotentialV = 0.6, ThresholdPotentialV = 0.42 };
        Assert.Equal(0.18, parts.BarrierHeightV, 1e-15);
        Assert.Equal(0.2, (parts with { BarrierHeightOverrideV = 0.2 }).BarrierHeightV);
        Assert.Equal(0.18, parts.ToSliceInput(parts.Nominal).BarrierHeightV, 1e-15);
    }
}
