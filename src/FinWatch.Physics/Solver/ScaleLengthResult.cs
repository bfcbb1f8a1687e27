namespace FinWatch.Physics.Solver;

/// <summary>
/// The electrostatic scale length of the meshed cross-section (docs/model.md §B.4, F.8): the smallest μ of
/// L_ff·u = μ·M·u with M = diag(h²·ε̄), Neumann at the fin foot, and λ = 1/√μ.
/// </summary>
/// <param name="ScaleLengthNm">Natural length λ = 1/k in nm (the exp(−y/λ) convention of B.1; λ_FTW = π·λ).</param>
/// <param name="EigenvaluePerNm2">μ = k² in nm⁻².</param>
/// <param name="Iterations">Inverse-iteration steps used.</param>
/// <param name="RelativeChange">Relative change of μ in the last step.</param>
/// <param name="Grid">The grid (t_box = 0).</param>
public readonly record struct ScaleLengthResult(
    double ScaleLengthNm,
    double EigenvaluePerNm2,
    int Iterations,
    double RelativeChange,
    SolverGrid Grid);
