using FinWatch.Server.Infrastructure;
using FinWatch.Physics.Solver;

namespace FinWatch.Server.Features.Model;

/// <summary>
/// POST /api/model/cross-section: a measured or what-if fin cross-section for the 2-D Poisson–Boltzmann solver
/// (docs/model.md F). Lengths in nm. The dielectric is <c>layers</c> (innermost first) or, when absent, one SiO₂ layer of
/// <c>eot_nm</c>.
/// </summary>
public sealed record CrossSectionRequest : IValidatedRequest
{
    public void Validate(ValidationErrors errors) => CrossSectionMapping.Check(this, errors);

    public double? TopWidthNm { get; init; }
    public double? BottomWidthNm { get; init; }
    public double? HeightNm { get; init; }
    public double? CornerRadiusNm { get; init; }
    public double? EotNm { get; init; }
    public DielectricLayerRequest[]? Layers { get; init; }
    public double? DopingCm3 { get; init; }

    /// <summary>"tri-gate" (top and both sidewalls gated, the default) or "double-gate" (hard mask on top, sidewalls only).</summary>
    public string? GateFaces { get; init; }

    /// <summary>Mesh spacing, 0.1 to 1 nm (default 0.2 nm, docs/model.md §F.7).</summary>
    public double? GridNm { get; init; }
}

public sealed record DielectricLayerRequest
{
    public double? ThicknessNm { get; init; }
    public double? K { get; init; }
}

public sealed record CrossSectionProgress(
    SolverStage Stage,
    int BiasIndex,
    int BiasCount,
    double GateV,
    int NewtonIteration);

public sealed record GateSweep(
    double[] VgV,
    double[] ElectronsPerCm);

/// <summary>Maps at threshold on the solver grid: <c>x_nm</c> across, <c>y_nm</c> up; the 2-D arrays are [y][x].</summary>
public sealed record SolverMaps(
    double[] XNm,
    double[] YNm,
    double[][] PotentialV,
    double[][] ElectronDensityCm3);

public sealed record CrossSectionResult(
    double? VtV,
    double? SwingMvPerDec,
    GateSweep Sweep,
    SolverMaps? Maps,
    int NewtonIterations,
    IReadOnlyList<string> Limitations);

/// <summary>A cross-section solve job: queued, running, done, failed or cancelled.</summary>
public sealed record CrossSectionJobResponse(
    string Id,
    string Status,
    string ShapeKey,
    bool FromCache,
    CrossSectionProgress? Progress,
    CrossSectionResult? Result,
    string? Error,
    string Note);
