namespace FinWatch.Physics.Analytic;

/// <summary>One set of equivalent Δ valleys for a confinement direction (C.2).</summary>
/// <param name="Degeneracy">g_v, number of valleys in the set.</param>
/// <param name="ConfinementMassRatio">m_z/m₀ = 1/(n̂·M⁻¹·n̂), dimensionless.</param>
/// <param name="DensityOfStatesMassRatio">2-D density-of-states mass m_d/m₀ = √(m_l m_t²/m_z), dimensionless.</param>
public readonly record struct ValleySet(int Degeneracy, double ConfinementMassRatio, double DensityOfStatesMassRatio);
