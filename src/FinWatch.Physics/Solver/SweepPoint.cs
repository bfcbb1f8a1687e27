namespace FinWatch.Physics.Solver;

/// <summary>One bias of the gate sweep (docs/model.md §F.4, F.6).</summary>
/// <param name="GateVoltageV">V_G in V.</param>
/// <param name="ElectronsPerNm">Electron line density N′ in nm⁻¹ (per nm of channel length).</param>
/// <param name="SiliconChargeElementaryPerNm">Silicon space charge Σ h² f_si (p − n − N_A), in elementary charges per nm.</param>
/// <param name="NewtonIterations">Newton iterations used at this bias.</param>
public readonly record struct SweepPoint(
    double GateVoltageV,
    double ElectronsPerNm,
    double SiliconChargeElementaryPerNm,
    int NewtonIterations);
