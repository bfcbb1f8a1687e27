using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Quantum confinement across the fin (docs/model.md §C.1–C.3).</summary>
public sealed class QuantumConfinementTests
{
    [Fact]
    public void BoxEnergy_Constants_Is0p37603EvNm2()
    {
        // C.1: ħ²π²/(2m₀) = 0.37603 eV·nm² (CODATA 2018 constants).
        Assert.Equal(0.37603, QuantumConfinement.BoxEnergyEvNm2, 5e-6);
    }

    [Theory]
    [InlineData(5, 47.8)]
    [InlineData(8, 18.7)]
    public void GroundStateEnergy_110Mass_MatchesNoteExamples(double w, double expectedMeV)
    {
        // C.1: E₁ = 47.8 meV at 5 nm and 18.7 meV at 8 nm for the (110) mass m_z = 2 m_l m_t/(m_l + m_t) = 0.3147 m₀
        // ("0.315" rounded; the rounded value itself gives 47.75 meV at 5 nm).
        double mz = QuantumConfinement.ValleySets(ConfinementSurface.Si110)[0].ConfinementMassRatio;
        Assert.Equal(expectedMeV, 1000 * QuantumConfinement.GroundStateEnergyEv(w, mz), 0.05);
    }

    [Fact]
    public void GroundStateEnergy_TopConfinementAt30Nm_IsAboutHalfMeV()
    {
        // C.2: height confinement with 0.916 m₀ is 0.46 meV at 30 nm (negligible for H ≥ 30 nm).
        Assert.Equal(0.46, 1000 * QuantumConfinement.GroundStateEnergyEv(30, 0.916), 0.005);
    }

    [Fact]
    public void ValleySets_110And100_MatchMassTable()
    {
        // C.2 table (Stern & Howard 1967 [M]; re-derived by the model's own computation [D]).
        ReadOnlySpan<ValleySet> s110 = QuantumConfinement.ValleySets(ConfinementSurface.Si110);
        Assert.Equal(4, s110[0].Degeneracy);
        Assert.Equal(0.315, s110[0].ConfinementMassRatio, 0.0005);
        Assert.Equal(0.324, s110[0].DensityOfStatesMassRatio, 0.0005);
        Assert.Equal(2, s110[1].Degeneracy);
        Assert.Equal(0.190, s110[1].ConfinementMassRatio, 1e-12);
        Assert.Equal(0.417, s110[1].DensityOfStatesMassRatio, 0.0005);

        ReadOnlySpan<ValleySet> s100 = QuantumConfinement.ValleySets(ConfinementSurface.Si100);
        Assert.Equal(2, s100[0].Degeneracy);
        Assert.Equal(0.916, s100[0].ConfinementMassRatio, 1e-12);
        Assert.Equal(0.190, s100[0].DensityOfStatesMassRatio, 1e-12);
        Assert.Equal(4, s100[1].Degeneracy);
        Assert.Equal(0.417, s100[1].DensityOfStatesMassRatio, 0.0005);
    }

    [Fact]
    public void BulkDensityOfStatesMass_SixValleys_Is1p06()
    {
        // C.3: m_dos = 6^{2/3}(m_l m_t²)^{1/3} = 1.06 m₀.
        Assert.Equal(1.06, QuantumConfinement.BulkDensityOfStatesMassRatio, 0.005);
    }

    [Theory]
    [InlineData(5, 42.6)]
    [InlineData(7, 23.6)]
    [InlineData(8, 19.3)]
    [InlineData(10, 14.1)]
    public void DensityOfStatesShift_110Sidewalls_MatchesNoteValues(double w, double expectedMv)
    {
        // C.3 [D] prototype, not a published source: 42.6 / 23.6 / 19.3 / 14.1 mV at 5 / 7 / 8 / 10 nm.
        Assert.Equal(expectedMv, 1000 * QuantumConfinement.DensityOfStatesShiftV(w), 0.05);
    }

    [Theory]
    [InlineData(6, -8.9)]
    [InlineData(7, -5.4)]
    [InlineData(8, -3.6)]
    [InlineData(9, -2.5)]
    public void DensityOfStatesShift_WidthSlope_MatchesNoteValues(double w, double expectedMvPerNm)
    {
        // C.3 [D] prototype, not a published source: dΔV_T,QC/dw = −8.9, −5.4, −3.6, −2.5 mV/nm at 6, 7, 8, 9 nm.
        double slope = 1000 * (QuantumConfinement.DensityOfStatesShiftV(w + 0.01) - QuantumConfinement.DensityOfStatesShiftV(w - 0.01)) / 0.02;
        Assert.Equal(expectedMvPerNm, slope, 0.1);
    }

    [Fact]
    public void DensityOfStatesShift_WideFin_TendsToClassical()
    {
        // C.3: the DOS form tends to the classical result (no shift) for wide fins.
        Assert.InRange(1000 * QuantumConfinement.DensityOfStatesShiftV(2000), 0, 0.1);
    }

    [Fact]
    public void DensityOfStatesShift_Multiplier_ScalesLinearly()
    {
        // C.4: κ_QC is a plain multiplier on ΔV_T,QC.
        double one = QuantumConfinement.DensityOfStatesShiftV(7);
        Assert.Equal(1.3 * one, QuantumConfinement.DensityOfStatesShiftV(7, ConfinementSurface.Si110, 1.3), 1e-15);
        Assert.Equal(0, QuantumConfinement.DensityOfStatesShiftV(7, ConfinementSurface.Si110, 0));
    }

    [Fact]
    public void LeadingOrderShift_110_IsGroundStateEnergy()
    {
        // C.3 leading order: ΔV_T,QC ≈ E₁/q with m_z = 2 m_l m_t/(m_l + m_t).
        Assert.Equal(QuantumConfinement.GroundStateEnergyEv(6, 2 * 0.916 * 0.19 / 1.106), QuantumConfinement.LeadingOrderShiftV(6), 1e-15);
    }

    [Theory]
    [InlineData(0)]
    [InlineData(-3)]
    [InlineData(double.NaN)]
    public void DensityOfStatesShift_InvalidWidth_Throws(double w)
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => QuantumConfinement.DensityOfStatesShiftV(w));
    }
}
