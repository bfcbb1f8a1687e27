namespace FinWatch.Physics.Analytic;

/// <summary>
/// Quantum confinement across the fin width (docs/model.md §C.1–C.3): particle-in-a-box subbands and
/// the density-of-states corrected threshold shift for volume inversion in a flat potential.
/// </summary>
/// <remarks>
/// Widths in nm, energies in eV, shifts in V. Infinite walls, parabolic bands, no strain (C.4: ±20 % at 5 nm).
/// Valid for undoped or lightly doped fins in subthreshold; for H ≥ 30 nm only width confinement matters.
/// Non-finite or non-positive widths throw <see cref="ArgumentOutOfRangeException"/>.
/// </remarks>
public static class QuantumConfinement
{
    private const double Ml = PhysicalConstants.LongitudinalMassRatio;
    private const double Mt = PhysicalConstants.TransverseMassRatio;

    /// <summary>ħ²π²/(2 m₀) in eV·nm² (≈ 0.37603; C.1).</summary>
    public static readonly double BoxEnergyEvNm2 =
        PhysicalConstants.ReducedPlanckJs * PhysicalConstants.ReducedPlanckJs * Math.PI * Math.PI
        / (2 * PhysicalConstants.ElectronMassKg) / PhysicalConstants.ElementaryChargeC * 1e18;

    // N_c per m³: 2(2π m kT/h²)^{3/2} = 2(m kT/(2πħ²))^{3/2}.
    internal static readonly double BulkEffectiveDensityPerM3 = 2 * Math.Pow(
        Math.Pow(6, 2.0 / 3.0) * Math.Cbrt(Ml * Mt * Mt) * PhysicalConstants.ElectronMassKg * PhysicalConstants.BoltzmannJPerK * PhysicalConstants.TemperatureK
        / (2 * Math.PI * PhysicalConstants.ReducedPlanckJs * PhysicalConstants.ReducedPlanckJs), 1.5);

    private static readonly ValleySet[] Si110Sets =
    [
        new ValleySet(4, 2 * Ml * Mt / (Ml + Mt), Math.Sqrt(Ml * Mt * Mt / (2 * Ml * Mt / (Ml + Mt)))),
        new ValleySet(2, Mt, Math.Sqrt(Ml * Mt)),
    ];

    private static readonly ValleySet[] Si100Sets =
    [
        new ValleySet(2, Ml, Mt),
        new ValleySet(4, Mt, Math.Sqrt(Ml * Mt)),
    ];

    /// <summary>Bulk density-of-states mass m_dos = 6^{2/3}(m_l m_t²)^{1/3} in units of m₀ (≈ 1.06; C.3), including the six valleys.</summary>
    public static double BulkDensityOfStatesMassRatio { get; } = Math.Pow(6, 2.0 / 3.0) * Math.Cbrt(Ml * Mt * Mt);

    /// <summary>The valley sets for a confinement surface (C.2 table), ground state first.</summary>
    /// <param name="surface">The confining surface.</param>
    /// <returns>The two valley sets.</returns>
    /// <exception cref="ArgumentOutOfRangeException"><paramref name="surface"/> is undefined.</exception>
    public static ReadOnlySpan<ValleySet> ValleySets(ConfinementSurface surface) => surface switch
    {
        ConfinementSurface.Si110 => Si110Sets,
        ConfinementSurface.Si100 => Si100Sets,
        _ => throw new ArgumentOutOfRangeException(nameof(surface)),
    };

    /// <summary>Ground-state energy E₁ = ħ²π²/(2 m_z w²) of an infinite well (C.1), in eV.</summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0.</param>
    /// <param name="confinementMassRatio">m_z/m₀; finite and &gt; 0 (0.315 for (110) sidewalls).</param>
    /// <returns>E₁ in eV.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is non-finite or ≤ 0.</exception>
    public static double GroundStateEnergyEv(double widthNm, double confinementMassRatio)
    {
        RequirePositive(widthNm);
        RequirePositive(confinementMassRatio);
        return BoxEnergyEvNm2 / (confinementMassRatio * widthNm * widthNm);
    }

    /// <summary>Leading-order shift ΔV_T,QC ≈ E₁/q with the ground-state mass of the surface (C.3; Omura et al. 1993 [M]), in V.</summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0.</param>
    /// <param name="surface">Confining surface.</param>
    /// <returns>ΔV_T,QC in V.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The width is non-finite or ≤ 0.</exception>
    public static double LeadingOrderShiftV(double widthNm, ConfinementSurface surface = ConfinementSurface.Si110) =>
        GroundStateEnergyEv(widthNm, ValleySets(surface)[0].ConfinementMassRatio);

    /// <summary>
    /// Density-of-states corrected shift (C.3, recommended): ΔV_T,QC = κ_QC·v_t·ln(N_cl/N_qm), N_cl = w·N_c,
    /// N_c = 2(2π m_dos kT/h²)^{3/2}, N_qm = Σ_sets g_v (m_d kT/(πħ²)) Σ_{j≥1} exp(−j² E₁,v/kT). In V.
    /// </summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0. Tends to 0 for wide fins.</param>
    /// <param name="surface">Confining surface (default (110) sidewalls).</param>
    /// <param name="multiplier">κ_QC calibration multiplier (default 1); finite and ≥ 0.</param>
    /// <returns>ΔV_T,QC in V (≥ 0 up to rounding).</returns>
    /// <exception cref="ArgumentOutOfRangeException">An argument is out of range.</exception>
    public static double DensityOfStatesShiftV(double widthNm, ConfinementSurface surface = ConfinementSurface.Si110, double multiplier = 1.0)
    {
        RequirePositive(widthNm);
        if (!double.IsFinite(multiplier) || multiplier < 0)
        {
            throw new ArgumentOutOfRangeException(nameof(multiplier), multiplier, "Must be finite and ≥ 0.");
        }

        double kT = PhysicalConstants.BoltzmannJPerK * PhysicalConstants.TemperatureK;
        double hbar = PhysicalConstants.ReducedPlanckJs, m0 = PhysicalConstants.ElectronMassKg;
        double wM = widthNm * 1e-9;

        double nCl = wM * BulkEffectiveDensityPerM3;

        double nQm = 0;
        double kTeV = kT / PhysicalConstants.ElementaryChargeC;
        foreach (ValleySet v in ValleySets(surface))
        {
            double x = GroundStateEnergyEv(widthNm, v.ConfinementMassRatio) / kTeV;
            double dos2d = v.DensityOfStatesMassRatio * m0 * kT / (Math.PI * hbar * hbar);
            nQm += v.Degeneracy * dos2d * SubbandSum(x);
        }

        return multiplier * PhysicalConstants.ThermalVoltageV * Math.Log(nCl / nQm);
    }

    /// <summary>Σ_{j≥1} exp(−j² x) to double precision, for x &gt; 0.</summary>
    private static double SubbandSum(double x)
    {
        double sum = 0;
        for (int j = 1; j < 1_000_000; j++)
        {
            double term = Math.Exp(-(double)j * j * x);
            sum += term;
            if (term < 1e-17 * sum)
            {
                break;
            }
        }

        return sum;
    }

    private static void RequirePositive(double value)
    {
        if (!double.IsFinite(value) || value <= 0)
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "Must be finite and > 0.");
        }
    }
}
