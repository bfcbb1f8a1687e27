namespace FinWatch.Physics.Solver;

/// <summary>
/// Physical constants of the 2-D solver in its internal units (docs/model.md §0 and F.1):
/// lengths in nm, densities in nm⁻³, potentials in V.
/// </summary>
public static class SolverConstants
{
    /// <summary>q/ε₀ in V·nm (section 0, derived from CODATA 2018): the source term factor when densities are in nm⁻³.</summary>
    public const double ChargeOverVacuumPermittivityVNm = 18.0951;

    /// <summary>Thermal voltage v_t = kT/q at 300 K, in V (section 0).</summary>
    public const double ThermalVoltageV = 0.0258520;

    /// <summary>Intrinsic density nᵢ at 300 K, 1.0e10 cm⁻³, expressed in nm⁻³ (section 0).</summary>
    public const double IntrinsicDensityPerNm3 = 1.0e-11;

    /// <summary>Relative permittivity of silicon, 11.7 (docs/model.md §0; Sze &amp; Ng, from memory [M]).</summary>
    public const double SiliconRelativePermittivity = 11.7;

    /// <summary>Relative permittivity of SiO₂, 3.9 (section 0); also used for the BOX / isolation oxide.</summary>
    public const double OxideRelativePermittivity = 3.9;

    /// <summary>Relative permittivity with which gate metal is sampled in the edge coefficients (F.3), 1e4.</summary>
    public const double MetalRelativePermittivity = 1.0e4;

    /// <summary>Elementary charge q in C (CODATA 2018, exact).</summary>
    public const double ElementaryChargeC = 1.602176634e-19;

    /// <summary>Conversion factor from cm⁻³ to nm⁻³ (1 cm⁻³ = 1e-21 nm⁻³).</summary>
    public const double PerCm3ToPerNm3 = 1.0e-21;

    /// <summary>Conversion factor from nm⁻¹ (per nm of channel length) to cm⁻¹ (per cm), 1e7.</summary>
    public const double PerNmToPerCm = 1.0e7;

    /// <summary>Critical sheet density of the constant-charge threshold, n_s,crit = 1e11 cm⁻², in nm⁻² (F.6).</summary>
    public const double CriticalSheetDensityPerNm2 = 1.0e-3;
}
