namespace FinWatch.Physics.Analytic;

/// <summary>
/// Physical constants of the analytic model (docs/model.md §0). Fundamental constants are
/// CODATA 2018; material values as chosen in docs/model.md §0 (Sze &amp; Ng; Stern &amp; Howard; nᵢ = 1.0e10 cm⁻³).
/// </summary>
/// <remarks>Internal electrostatics use cm (ε in F/cm, densities in cm⁻³); every public model interface uses nm.</remarks>
public static class PhysicalConstants
{
    /// <summary>Elementary charge q, in C (CODATA 2018, exact).</summary>
    public const double ElementaryChargeC = 1.602176634e-19;

    /// <summary>Boltzmann constant k_B, in J/K (CODATA 2018, exact).</summary>
    public const double BoltzmannJPerK = 1.380649e-23;

    /// <summary>Reduced Planck constant ħ, in J·s (CODATA 2018).</summary>
    public const double ReducedPlanckJs = 1.054571817e-34;

    /// <summary>Electron rest mass m₀, in kg (CODATA 2018).</summary>
    public const double ElectronMassKg = 9.1093837015e-31;

    /// <summary>Vacuum permittivity ε₀, in F/cm (CODATA 2018).</summary>
    public const double VacuumPermittivityFPerCm = 8.8541878128e-14;

    /// <summary>Model temperature T, in K (docs/model.md §0: T = 300 K).</summary>
    public const double TemperatureK = 300.0;

    /// <summary>Thermal voltage v_t = k_B T/q at 300 K, in V (≈ 0.0258520 V).</summary>
    public const double ThermalVoltageV = BoltzmannJPerK * TemperatureK / ElementaryChargeC;

    /// <summary>Relative permittivity of silicon, 11.7 (Sze &amp; Ng [M]).</summary>
    public const double SiliconRelativePermittivity = 11.7;

    /// <summary>Relative permittivity of SiO₂, 3.9 (also the EOT convention).</summary>
    public const double OxideRelativePermittivity = 3.9;

    /// <summary>Silicon permittivity ε_Si, in F/cm.</summary>
    public const double SiliconPermittivityFPerCm = SiliconRelativePermittivity * VacuumPermittivityFPerCm;

    /// <summary>SiO₂ permittivity ε_ox, in F/cm.</summary>
    public const double OxidePermittivityFPerCm = OxideRelativePermittivity * VacuumPermittivityFPerCm;

    /// <summary>Intrinsic carrier density nᵢ at 300 K, in cm⁻³ (1.0e10; the older 1.45e10 must not be mixed in).</summary>
    public const double IntrinsicDensityPerCm3 = 1.0e10;

    /// <summary>Longitudinal Δ-valley mass m_l, in units of m₀ (0.916; Stern &amp; Howard 1967 [M]).</summary>
    public const double LongitudinalMassRatio = 0.916;

    /// <summary>Transverse Δ-valley mass m_t, in units of m₀ (0.190; Stern &amp; Howard 1967 [M]).</summary>
    public const double TransverseMassRatio = 0.190;

    /// <summary>Centimetres per nanometre (1e-7).</summary>
    public const double CmPerNm = 1e-7;
}
