namespace FinWatch.Physics.Solver;

/// <summary>
/// One layer of the gate dielectric stack, meshed with its physical thickness (docs/model.md §A.6, F.2).
/// Layers are listed from the silicon outwards: the interfacial SiO₂ first, then the high-k.
/// </summary>
/// <param name="ThicknessNm">Physical thickness in nm; finite and &gt; 0.</param>
/// <param name="RelativePermittivity">Relative permittivity k (dimensionless, ε/ε₀); finite and &gt; 0. SiO₂ is 3.9, HfO₂ about 20.</param>
public readonly record struct DielectricLayer(double ThicknessNm, double RelativePermittivity);
