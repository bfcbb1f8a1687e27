namespace FinWatch.Physics.Analytic;

/// <summary>Crystal surface normal to the confinement direction (docs/model.md §C.2).</summary>
public enum ConfinementSurface
{
    /// <summary>(110): sidewalls of a standard ⟨110⟩-oriented fin on a (100) wafer; ground state 4 valleys, m_z = 0.315 m₀.</summary>
    Si110,

    /// <summary>(100): fin top on a (100) wafer, or sidewalls of a 45°-rotated fin; ground state 2 valleys, m_z = m_l.</summary>
    Si100,
}
