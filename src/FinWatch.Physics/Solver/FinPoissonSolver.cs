namespace FinWatch.Physics.Solver;

/// <summary>
/// 2-D nonlinear Poisson–Boltzmann solver of the fin cross-section (docs/model.md §F) and the
/// scale-length eigenmode on the same mesh (B.4, F.8).
/// </summary>
/// <remarks>
/// <para>
/// Equations (F.1): −∇·(ε_r∇ψ) = (q/ε₀)(p − n − N_A) in silicon, 0 in the dielectrics; n = nᵢe^{ψ/v_t},
/// p = nᵢe^{−ψ/v_t}; ψ = V_G − Δφ on the gate metal; zero flux on the outer box. Units: nm, V, densities in nm⁻³
/// internally (q/ε₀ = 18.0951 V·nm), cm⁻³ at the interface.
/// </para>
/// <para>
/// Discretisation (F.3): finite volumes, uniform square grid, node-centred 5-point stencil, silicon fractions from
/// 4 × 4 sub-samples, series–parallel edge permittivities, metal sampled as ε = 1e4. Newton (F.4): J = L_ff +
/// diag(h² f_si (q/ε₀) nᵢ(e^{ψ/v_t} + e^{−ψ/v_t})/v_t), step limited to 0.25 V, converged at max|δ| &lt; 1e-8 V,
/// at most 80 iterations (else <see cref="PoissonConvergenceException"/>). Linear algebra (F.5): banded Cholesky,
/// the half-bandwidth is the grid row length NodesX (x is the short dimension).
/// </para>
/// <para>
/// Every method checks its <see cref="CancellationToken"/> for every grid row while meshing, in each Newton /
/// inverse-iteration step and every 512 rows of each factorisation, and throws <see cref="OperationCanceledException"/> when it is cancelled.
/// Methods are thread-safe (no shared state); one call uses one core.
/// </para>
/// <para>Limitations: see <see cref="SolverLimitations"/> (F.10).</para>
/// </remarks>
public static class FinPoissonSolver
{
    /// <summary>Newton iteration cap (F.4).</summary>
    public const int MaxNewtonIterations = 80;

    /// <summary>Newton convergence threshold on max|δψ|, in V (F.4).</summary>
    public const double NewtonToleranceV = 1e-8;

    /// <summary>Newton step limit on max|δψ|, in V (F.4).</summary>
    public const double MaxStepV = 0.25;

    /// <summary>Inverse-iteration cap of the eigenmode (B.4).</summary>
    public const int MaxEigenIterations = 1000;

    /// <summary>Relative change of μ at which the inverse iteration stops.</summary>
    public const double EigenTolerance = 1e-12;

    private static readonly double[] CornerDepthsNm = [0.5, 1.0];

    /// <summary>
    /// Runs <see cref="Solve"/> on the thread pool: a background-friendly full what-if run.
    /// </summary>
    /// <param name="request">The cross-section, stack, doping, grid and sweep.</param>
    /// <param name="progress">Receives a report after every Newton iteration; may be <see langword="null"/>.</param>
    /// <param name="cancellationToken">Stops the run promptly with <see cref="OperationCanceledException"/>.</param>
    /// <returns>The result.</returns>
    public static Task<FinSolverResult> SolveAsync(
        FinSolverRequest request,
        IProgress<SolverProgress>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        return Task.Run(() => Solve(request, progress, cancellationToken), cancellationToken);
    }

    /// <summary>
    /// Full what-if run (F.4, F.6): sweeps V_G from <see cref="FinSolverRequest.GateStartV"/> in steps of
    /// <see cref="FinSolverRequest.GateStepV"/> by continuation (the first bias starts from ψ = ψ_gate everywhere),
    /// stops <see cref="FinSolverRequest.OverdriveAfterThresholdV"/> above the first threshold crossing or at
    /// <see cref="FinSolverRequest.GateStopV"/>, extracts V_T by linear interpolation of ln N′, the swing, the C–V
    /// curve and the second-derivative threshold, and re-solves at V_T for the maps and the corner population.
    /// </summary>
    /// <param name="request">The cross-section, stack, doping, grid and sweep.</param>
    /// <param name="progress">Receives a report after every Newton iteration; may be <see langword="null"/>.</param>
    /// <param name="cancellationToken">Stops the run promptly with <see cref="OperationCanceledException"/>.</param>
    /// <returns>The result; data conditions (no crossing, unbracketed swing) are NaN as documented on <see cref="FinSolverResult"/>.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The request is invalid (<see cref="FinSolverRequest.Validate"/>).</exception>
    /// <exception cref="PoissonConvergenceException">A bias did not converge in 80 Newton iterations.</exception>
    /// <exception cref="OperationCanceledException">Cancelled.</exception>
    public static FinSolverResult Solve(
        FinSolverRequest request,
        IProgress<SolverProgress>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        progress?.Report(new SolverProgress(SolverStage.Meshing, -1, 0, request.GateStartV, 0, 0));
        var mesh = new FinMesh(request, request.BoxThicknessNm, cancellationToken);
        cancellationToken.ThrowIfCancellationRequested();
        var newton = new PoissonNewton(mesh, request.AcceptorDensityCm3, request.WorkFunctionOffsetV);

        double step = request.GateStepV;
        int count = checked((int)Math.Floor(((request.GateStopV - request.GateStartV) / step) + 1e-9) + 1);
        double critical = SolverConstants.CriticalSheetDensityPerNm2 * request.EffectiveReferencePerimeterNm;

        var psi = new double[mesh.Grid.NodeCount];
        Array.Fill(psi, request.GateStartV - request.WorkFunctionOffsetV);
        double[]? belowThreshold = null;
        var sweep = new List<SweepPoint>();
        int total = 0;
        int crossing = -1;
        for (int b = 0; b < count; b++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            double vg = request.GateStartV + (b * step);
            (int iterations, double last) = newton.Solve(psi, vg, SolverStage.GateSweep, b, count, progress, cancellationToken);
            total += iterations;
            BiasSolution s = newton.Snapshot(psi, vg, iterations, last);
            sweep.Add(new SweepPoint(vg, s.ElectronsPerNm, s.SiliconChargeElementaryPerNm, iterations));
            if (s.ElectronsPerNm < critical)
            {
                belowThreshold = (double[])psi.Clone();
            }
            else if (crossing < 0)
            {
                crossing = b;
            }

            if (crossing >= 0 && b >= crossing + 2 && vg >= sweep[crossing].GateVoltageV + request.OverdriveAfterThresholdV - 1e-9)
            {
                break;
            }
        }

        double vT = CrossingVoltage(sweep, critical);
        double swing = (CrossingVoltage(sweep, critical / 100) - CrossingVoltage(sweep, critical / 1000)) * 1000;
        double swingNear = (vT - CrossingVoltage(sweep, critical / 10)) * 1000;
        double[] capacitance = Capacitance(sweep, step);
        double secondDerivative = SecondDerivativePeak(sweep, step);

        double topArea = TopShare(mesh, request.Profile.HeightNm, null);
        BiasSolution? atThreshold = null;
        var corner = new List<CornerSample>();
        double topElectrons = double.NaN;
        if (!double.IsNaN(vT) && belowThreshold is not null)
        {
            (int iterations, double last) = newton.Solve(
                belowThreshold, vT, SolverStage.ThresholdResolve, -1, count, progress, cancellationToken);
            total += iterations;
            atThreshold = newton.Snapshot(belowThreshold, vT, iterations, last);
            foreach (double d in CornerDepthsNm)
            {
                corner.Add(SampleCorner(atThreshold, mesh, request.Profile, d));
            }

            topElectrons = TopShare(mesh, request.Profile.HeightNm, atThreshold.ElectronDensityCm3);
        }

        return new FinSolverResult(
            request.ShapeKey,
            mesh.Grid,
            sweep,
            capacitance,
            critical,
            vT,
            swing,
            swingNear,
            secondDerivative,
            atThreshold,
            corner,
            topElectrons,
            topArea,
            total);
    }

    /// <summary>
    /// Solves the given gate voltages in order by continuation (the first from ψ = ψ_gate everywhere) and returns
    /// every converged solution with its maps. The sweep settings of the request are not used.
    /// </summary>
    /// <param name="request">The cross-section, stack, doping and grid.</param>
    /// <param name="gateVoltagesV">Gate voltages in V, solved in the given order; at least one, all finite.</param>
    /// <param name="progress">Receives a report after every Newton iteration; may be <see langword="null"/>.</param>
    /// <param name="cancellationToken">Stops the run promptly with <see cref="OperationCanceledException"/>.</param>
    /// <returns>One solution per gate voltage.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The request is invalid or a voltage is non-finite.</exception>
    /// <exception cref="ArgumentException">No voltages.</exception>
    /// <exception cref="PoissonConvergenceException">A bias did not converge.</exception>
    /// <exception cref="OperationCanceledException">Cancelled.</exception>
    public static IReadOnlyList<BiasSolution> SolveAtGateVoltages(
        FinSolverRequest request,
        IReadOnlyList<double> gateVoltagesV,
        IProgress<SolverProgress>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        if (gateVoltagesV.Count == 0)
        {
            throw new ArgumentException("At least one gate voltage is required.", nameof(gateVoltagesV));
        }

        foreach (double v in gateVoltagesV)
        {
            if (!double.IsFinite(v))
            {
                throw new ArgumentOutOfRangeException(nameof(gateVoltagesV), v, "Gate voltages must be finite.");
            }
        }

        var mesh = new FinMesh(request, request.BoxThicknessNm, cancellationToken);
        var newton = new PoissonNewton(mesh, request.AcceptorDensityCm3, request.WorkFunctionOffsetV);
        var psi = new double[mesh.Grid.NodeCount];
        Array.Fill(psi, gateVoltagesV[0] - request.WorkFunctionOffsetV);
        var results = new List<BiasSolution>(gateVoltagesV.Count);
        for (int b = 0; b < gateVoltagesV.Count; b++)
        {
            (int iterations, double last) = newton.Solve(
                psi, gateVoltagesV[b], SolverStage.GateSweep, b, gateVoltagesV.Count, progress, cancellationToken);
            results.Add(newton.Snapshot(psi, gateVoltagesV[b], iterations, last));
        }

        return results;
    }

    /// <summary>
    /// Runs <see cref="ComputeScaleLength"/> on the thread pool.
    /// </summary>
    /// <param name="request">The cross-section, stack and grid; doping, BOX and sweep settings are not used.</param>
    /// <param name="progress">Receives a report after every inverse-iteration step; may be <see langword="null"/>.</param>
    /// <param name="cancellationToken">Stops the run promptly with <see cref="OperationCanceledException"/>.</param>
    /// <returns>The scale length.</returns>
    public static Task<ScaleLengthResult> ComputeScaleLengthAsync(
        FinSolverRequest request,
        IProgress<SolverProgress>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        return Task.Run(() => ComputeScaleLength(request, progress, cancellationToken), cancellationToken);
    }

    /// <summary>
    /// Scale length λ of the meshed cross-section (B.4, F.8): the smallest μ of L_ff·u = μ·M·u on the same mesh
    /// with t_box = 0 (Neumann at the fin foot), M = diag(h²·ε̄) with ε̄ the mean permittivity of the non-metal part
    /// of each control volume, u = 0 on the gate; λ = 1/√μ. Inverse iteration with the banded Cholesky factor of
    /// L_ff and the Rayleigh quotient, until μ changes by less than 1e-12 relative.
    /// </summary>
    /// <param name="request">The cross-section, stack and grid; doping, BOX and sweep settings are not used.</param>
    /// <param name="progress">Receives a report after every step; may be <see langword="null"/>.</param>
    /// <param name="cancellationToken">Stops the run promptly with <see cref="OperationCanceledException"/>.</param>
    /// <returns>λ in nm with μ and the iteration record.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The request is invalid.</exception>
    /// <exception cref="PoissonConvergenceException">No convergence in <see cref="MaxEigenIterations"/> steps.</exception>
    /// <exception cref="OperationCanceledException">Cancelled.</exception>
    public static ScaleLengthResult ComputeScaleLength(
        FinSolverRequest request,
        IProgress<SolverProgress>? progress,
        CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        request.Validate();
        var mesh = new FinMesh(request, boxThicknessNm: 0, cancellationToken);
        cancellationToken.ThrowIfCancellationRequested();
        BandedCholesky a = PoissonNewton.AssembleLaplacian(mesh);
        a.Factorize(cancellationToken);

        int n = mesh.Grid.NodeCount;
        var u = new double[n];
        var w = new double[n];
        for (int k = 0; k < n; k++)
        {
            u[k] = mesh.IsGate[k] ? 0 : 1;
        }

        double mu = double.NaN;
        for (int it = 1; it <= MaxEigenIterations; it++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            for (int k = 0; k < n; k++)
            {
                w[k] = mesh.IsGate[k] ? 0 : mesh.Mass[k] * u[k];
            }

            a.SolveInPlace(w);

            // With A·w = M·u: wᵀAw = wᵀMu, so the Rayleigh quotient needs no extra product with A.
            double wAw = 0;
            double wMw = 0;
            for (int k = 0; k < n; k++)
            {
                if (!mesh.IsGate[k])
                {
                    wAw += w[k] * mesh.Mass[k] * u[k];
                    wMw += w[k] * mesh.Mass[k] * w[k];
                }
            }

            double next = wAw / wMw;
            double norm = 1 / Math.Sqrt(wMw);
            for (int k = 0; k < n; k++)
            {
                u[k] = mesh.IsGate[k] ? 0 : w[k] * norm;
            }

            double change = Math.Abs(next - mu) / next;
            mu = next;
            progress?.Report(new SolverProgress(SolverStage.Eigenmode, -1, 0, double.NaN, it, change));
            if (change < EigenTolerance)
            {
                return new ScaleLengthResult(1 / Math.Sqrt(mu), mu, it, change, mesh.Grid);
            }
        }

        throw new PoissonConvergenceException(
            $"Inverse iteration did not converge in {MaxEigenIterations} steps (μ = {mu:G6} nm⁻²).");
    }

    /// <summary>V_G where N′ first crosses <paramref name="level"/> from below; ln N′ interpolated linearly. NaN if not bracketed.</summary>
    private static double CrossingVoltage(List<SweepPoint> sweep, double level)
    {
        for (int b = 1; b < sweep.Count; b++)
        {
            double lo = sweep[b - 1].ElectronsPerNm;
            double hi = sweep[b].ElectronsPerNm;
            if (sweep[0].ElectronsPerNm >= level)
            {
                return double.NaN;
            }

            if (lo < level && hi >= level)
            {
                double f = (Math.Log(level) - Math.Log(lo)) / (Math.Log(hi) - Math.Log(lo));
                double v0 = sweep[b - 1].GateVoltageV;
                return v0 + (f * (sweep[b].GateVoltageV - v0));
            }
        }

        return double.NaN;
    }

    private static double[] Capacitance(List<SweepPoint> sweep, double step)
    {
        var c = new double[sweep.Count];
        const double toFaradPerCm = SolverConstants.ElementaryChargeC * SolverConstants.PerNmToPerCm;
        for (int b = 0; b < c.Length; b++)
        {
            c[b] = b == 0 || b == c.Length - 1
                ? double.NaN
                : -(sweep[b + 1].SiliconChargeElementaryPerNm - sweep[b - 1].SiliconChargeElementaryPerNm)
                  / (2 * step) * toFaradPerCm;
        }

        return c;
    }

    private static double SecondDerivativePeak(List<SweepPoint> sweep, double step)
    {
        int m = sweep.Count;
        if (m < 5)
        {
            return double.NaN;
        }

        var d2 = new double[m];
        int best = -1;
        for (int b = 1; b < m - 1; b++)
        {
            d2[b] = (sweep[b + 1].ElectronsPerNm - (2 * sweep[b].ElectronsPerNm) + sweep[b - 1].ElectronsPerNm) / (step * step);
            if (best < 0 || d2[b] > d2[best])
            {
                best = b;
            }
        }

        if (best <= 1 || best >= m - 2)
        {
            return double.NaN;
        }

        double denominator = d2[best - 1] - (2 * d2[best]) + d2[best + 1];
        double offset = denominator < 0 ? 0.5 * (d2[best - 1] - d2[best + 1]) / denominator : 0;
        return sweep[best].GateVoltageV + (offset * step);
    }

    private static double TopShare(FinMesh mesh, double heightNm, double[]? electronsCm3)
    {
        SolverGrid g = mesh.Grid;
        double all = 0;
        double top = 0;
        for (int j = 0; j < g.NodesY; j++)
        {
            bool isTop = g.YNm(j) >= 0.85 * heightNm;
            for (int i = 0; i < g.NodesX; i++)
            {
                int k = g.Index(i, j);
                double weight = mesh.SiliconFraction[k] * (electronsCm3 is null ? 1 : electronsCm3[k]);
                all += weight;
                if (isTop)
                {
                    top += weight;
                }
            }
        }

        return all > 0 ? top / all : double.NaN;
    }

    /// <summary>Corner and mid-sidewall points at depth d (F.6), right-hand side of the fin.</summary>
    private static CornerSample SampleCorner(BiasSolution s, FinMesh mesh, FinProfile p, double depthNm)
    {
        double theta = mesh.TaperRad;
        double r = mesh.CornerRadiusNm;
        (double sin, double cos) = Math.SinCos(theta);
        double halfAlphaSin = Math.Sin(0.5 * ((0.5 * Math.PI) + theta));
        double distance = depthNm <= r ? (r / halfAlphaSin) - r + depthNm : depthNm / halfAlphaSin;

        // Bisector of the top edge direction (−1, 0) and the sidewall direction (sin θ, −cos θ) from the vertex.
        double bx = sin - 1;
        double by = -cos;
        double bn = Math.Sqrt((bx * bx) + (by * by));
        double cx = (0.5 * p.TopWidthNm) + (distance * bx / bn);
        double cy = p.HeightNm + (distance * by / bn);

        double sideX = (0.25 * (p.TopWidthNm + p.BottomWidthNm)) - (depthNm * cos);
        double sideY = (0.5 * p.HeightNm) - (depthNm * sin);
        return new CornerSample(depthNm, Density(s.PotentialAtV(cx, cy)), Density(s.PotentialAtV(sideX, sideY)));
    }

    private static double Density(double psiV) =>
        SolverConstants.IntrinsicDensityPerNm3 / SolverConstants.PerCm3ToPerNm3 * Math.Exp(psiV / SolverConstants.ThermalVoltageV);
}
