using System.Globalization;
using System.Security.Cryptography;
using System.Text;

namespace FinWatch.Physics.Solver;

/// <summary>
/// Input of the 2-D Poisson–Boltzmann solver of the fin cross-section (docs/model.md §F):
/// the shape, the dielectric stack, the doping, the grid and the gate sweep. Lengths in nm, densities in cm⁻³,
/// potentials in V.
/// </summary>
/// <remarks>
/// Record equality compares <see cref="DielectricLayers"/> by reference; use <see cref="ShapeKey"/> to cache.
/// <see cref="Validate"/> is called by every solver entry point.
/// </remarks>
public sealed record FinSolverRequest
{
    /// <summary>The fin shape W_t, W_b, H, r in nm (A.4); validated and the radius clipped by <see cref="FinCrossSection"/>.</summary>
    public required FinProfile Profile { get; init; }

    /// <summary>Gated faces: tri-gate, or double gate with a hard mask on the top (A.7).</summary>
    public GateFaces Faces { get; init; } = GateFaces.TriGate;

    /// <summary>The gate stack from the silicon outwards, physical thicknesses (A.6); at least one layer.</summary>
    public required IReadOnlyList<DielectricLayer> DielectricLayers { get; init; }

    /// <summary>Uniform acceptor density N_A in the fin, in cm⁻³; finite, ≥ 0 (0 = undoped).</summary>
    public double AcceptorDensityCm3 { get; init; }

    /// <summary>Grid spacing h in nm; 0.2 nm is the production grid, 0.1 nm the validation grid (F.7).</summary>
    public double GridSpacingNm { get; init; } = 0.2;

    /// <summary>Thickness of the BOX / isolation oxide meshed below the fin foot, in nm (F.2: 10 nm); ≥ 0.</summary>
    public double BoxThicknessNm { get; init; } = 10;

    /// <summary>Hard-mask (cap) thickness on the fin top for <see cref="GateFaces.DoubleGate"/>, in nm; &gt; 0. Ignored for tri-gate.</summary>
    public double HardMaskThicknessNm { get; init; } = 10;

    /// <summary>Relative permittivity of the hard mask (dimensionless); default 3.9 (SiO₂). Ignored for tri-gate.</summary>
    public double HardMaskRelativePermittivity { get; init; } = SolverConstants.OxideRelativePermittivity;

    /// <summary>Gate contact potential Δφ = φ_m − (χ + E_g/2q), in V; 0 for a mid-gap gate (section 0).</summary>
    public double WorkFunctionOffsetV { get; init; }

    /// <summary>First gate voltage of the sweep, in V.</summary>
    public double GateStartV { get; init; } = -0.2;

    /// <summary>Last gate voltage the sweep may reach, in V; &gt; <see cref="GateStartV"/>.</summary>
    public double GateStopV { get; init; } = 1.5;

    /// <summary>Gate step of the continuation sweep, in V; in (0, 0.1] (F.4 recommends 0.01–0.02 V).</summary>
    public double GateStepV { get; init; } = 0.02;

    /// <summary>
    /// The sweep stops this many volts above the first threshold crossing (or at <see cref="GateStopV"/>), in V; ≥ 2 steps
    /// are always solved above the crossing so that the second-derivative threshold can be located.
    /// </summary>
    public double OverdriveAfterThresholdV { get; init; } = 0.2;

    /// <summary>
    /// P_ref in nm, the gated perimeter 2H + W_t of the <b>nominal</b> fin, kept fixed when the shape varies (F.6).
    /// <see langword="null"/> uses 2H + W_t of this fin.
    /// </summary>
    public double? ReferencePerimeterNm { get; init; }

    /// <summary>
    /// Deterministic cache key of the request: a SHA-256 hex string of all inputs rounded to 1e-4 nm (lengths),
    /// 1e-5 V (potentials), 1e-4 (permittivities) and 6 significant digits (doping), in invariant culture.
    /// Equal for requests that differ only below that rounding.
    /// </summary>
    public string ShapeKey
    {
        get
        {
            var sb = new StringBuilder(256);
            Append(sb, Profile.TopWidthNm, "F4");
            Append(sb, Profile.BottomWidthNm, "F4");
            Append(sb, Profile.HeightNm, "F4");
            Append(sb, Profile.CornerRadiusNm, "F4");
            sb.Append(Faces == GateFaces.TriGate ? "TG|" : "DG|");
            foreach (DielectricLayer layer in DielectricLayers)
            {
                Append(sb, layer.ThicknessNm, "F4");
                Append(sb, layer.RelativePermittivity, "F4");
            }

            sb.Append('#');
            Append(sb, AcceptorDensityCm3, "E5");
            Append(sb, GridSpacingNm, "F5");
            Append(sb, BoxThicknessNm, "F4");
            if (Faces == GateFaces.DoubleGate)
            {
                Append(sb, HardMaskThicknessNm, "F4");
                Append(sb, HardMaskRelativePermittivity, "F4");
            }

            Append(sb, WorkFunctionOffsetV, "F5");
            Append(sb, GateStartV, "F5");
            Append(sb, GateStopV, "F5");
            Append(sb, GateStepV, "F5");
            Append(sb, OverdriveAfterThresholdV, "F5");
            Append(sb, EffectiveReferencePerimeterNm, "F4");
            byte[] hash = SHA256.HashData(Encoding.UTF8.GetBytes(sb.ToString()));
            return Convert.ToHexString(hash);
        }
    }

    /// <summary>P_ref actually used, in nm: <see cref="ReferencePerimeterNm"/> or 2H + W_t of this fin.</summary>
    public double EffectiveReferencePerimeterNm =>
        ReferencePerimeterNm ?? ((2 * Profile.HeightNm) + Profile.TopWidthNm);

    /// <summary>Total physical dielectric thickness t_phys = Σ tᵢ, in nm (A.6).</summary>
    public double PhysicalDielectricThicknessNm
    {
        get
        {
            double sum = 0;
            foreach (DielectricLayer layer in DielectricLayers)
            {
                sum += layer.ThicknessNm;
            }

            return sum;
        }
    }

    /// <summary>
    /// Checks every input; throws <see cref="ArgumentOutOfRangeException"/> (or <see cref="ArgumentException"/> for an
    /// empty stack) on a caller mistake: invalid profile, non-finite or non-positive thickness/permittivity/spacing,
    /// negative doping, an empty or reversed sweep, a gate step above 0.1 V, or a grid of more than 4 million nodes
    /// or more than 1e8 stored band entries.
    /// </summary>
    /// <exception cref="ArgumentOutOfRangeException">An input is out of range.</exception>
    /// <exception cref="ArgumentException">The dielectric stack is empty.</exception>
    public void Validate()
    {
        _ = FinCrossSection.Derive(Profile, Faces);
        if (DielectricLayers.Count == 0)
        {
            throw new ArgumentException("At least one dielectric layer is required.", nameof(DielectricLayers));
        }

        foreach (DielectricLayer layer in DielectricLayers)
        {
            RequirePositive(layer.ThicknessNm, nameof(DielectricLayer.ThicknessNm));
            RequirePositive(layer.RelativePermittivity, nameof(DielectricLayer.RelativePermittivity));
        }

        RequireNonNegative(AcceptorDensityCm3, nameof(AcceptorDensityCm3));
        RequirePositive(GridSpacingNm, nameof(GridSpacingNm));
        RequireNonNegative(BoxThicknessNm, nameof(BoxThicknessNm));
        RequirePositive(HardMaskThicknessNm, nameof(HardMaskThicknessNm));
        RequirePositive(HardMaskRelativePermittivity, nameof(HardMaskRelativePermittivity));
        RequireFinite(WorkFunctionOffsetV, nameof(WorkFunctionOffsetV));
        RequireFinite(GateStartV, nameof(GateStartV));
        RequireFinite(GateStopV, nameof(GateStopV));
        RequirePositive(GateStepV, nameof(GateStepV));
        ArgumentOutOfRangeException.ThrowIfGreaterThan(GateStepV, 0.1, nameof(GateStepV));
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(GateStopV, GateStartV, nameof(GateStopV));
        RequireNonNegative(OverdriveAfterThresholdV, nameof(OverdriveAfterThresholdV));
        RequirePositive(EffectiveReferencePerimeterNm, nameof(ReferencePerimeterNm));

        double halfWidth = (0.5 * Math.Max(Profile.TopWidthNm, Profile.BottomWidthNm)) + PhysicalDielectricThicknessNm + 1;
        double height = BoxThicknessNm + Profile.HeightNm + PhysicalDielectricThicknessNm + 1
            + (Faces == GateFaces.DoubleGate ? HardMaskThicknessNm : 0);
        double nodesX = (2 * Math.Ceiling(halfWidth / GridSpacingNm)) + 1;
        double nodes = nodesX * (Math.Ceiling(height / GridSpacingNm) + 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(nodes, 4.0e6, nameof(GridSpacingNm));

        // Band storage is nodes·(NodesX + 1) doubles per matrix; 1e8 (800 MB) is the cap.
        ArgumentOutOfRangeException.ThrowIfGreaterThan(nodes * (nodesX + 1), 1.0e8, nameof(GridSpacingNm));
    }

    private static void Append(StringBuilder sb, double value, string format)
    {
        sb.Append(value.ToString(format, CultureInfo.InvariantCulture));
        sb.Append('|');
    }

    private static void RequireFinite(double value, string name)
    {
        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(name, value, "The value must be finite.");
        }
    }

    private static void RequirePositive(double value, string name)
    {
        RequireFinite(value, name);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(value, name);
    }

    private static void RequireNonNegative(double value, string name)
    {
        RequireFinite(value, name);
        ArgumentOutOfRangeException.ThrowIfNegative(value, name);
    }
}
