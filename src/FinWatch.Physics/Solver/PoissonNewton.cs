namespace FinWatch.Physics.Solver;

/// <summary>
/// Damped Newton iteration for the discrete Poisson–Boltzmann equation on a <see cref="FinMesh"/> (
/// docs/model.md §F.3–F.5). Gate nodes are eliminated by identity rows, so the Jacobian is SPD with half-bandwidth
/// NodesX and is factorised by <see cref="BandedCholesky"/>.
/// </summary>
internal sealed class PoissonNewton
{
    private readonly FinMesh _mesh;
    private readonly BandedCholesky _laplacian;
    private readonly BandedCholesky _jacobian;
    private readonly double[] _charge;
    private readonly double[] _step;
    private readonly double _acceptorPerNm3;
    private readonly double _workFunctionV;

    public PoissonNewton(FinMesh mesh, double acceptorDensityCm3, double workFunctionOffsetV)
    {
        _mesh = mesh;
        _acceptorPerNm3 = acceptorDensityCm3 * SolverConstants.PerCm3ToPerNm3;
        _workFunctionV = workFunctionOffsetV;
        int n = mesh.Grid.NodeCount;
        _laplacian = AssembleLaplacian(mesh);
        _jacobian = new BandedCholesky(n, mesh.Grid.NodesX);
        _step = new double[n];
        _charge = new double[n];
        double h2 = mesh.Grid.SpacingNm * mesh.Grid.SpacingNm;
        for (int k = 0; k < n; k++)
        {
            _charge[k] = h2 * mesh.SiliconFraction[k] * SolverConstants.ChargeOverVacuumPermittivityVNm;
        }
    }

    public FinMesh Mesh => _mesh;

    /// <summary>L_ff with identity rows at the gate nodes (the operator of F.8 as well).</summary>
    public static BandedCholesky AssembleLaplacian(FinMesh mesh)
    {
        SolverGrid g = mesh.Grid;
        int nx = g.NodesX;
        var a = new BandedCholesky(g.NodeCount, nx);
        for (int j = 0; j < g.NodesY; j++)
        {
            for (int i = 0; i < nx; i++)
            {
                int k = g.Index(i, j);
                if (mesh.IsGate[k])
                {
                    a[k, k] = 1;
                    continue;
                }

                double diag = 0;
                if (i > 0)
                {
                    diag += Couple(a, mesh, k, k - 1, mesh.EdgeRight[k - 1]);
                }

                if (i < nx - 1)
                {
                    diag += Couple(a, mesh, k, k + 1, mesh.EdgeRight[k]);
                }

                if (j > 0)
                {
                    diag += Couple(a, mesh, k, k - nx, mesh.EdgeUp[k - nx]);
                }

                if (j < g.NodesY - 1)
                {
                    diag += Couple(a, mesh, k, k + nx, mesh.EdgeUp[k]);
                }

                a[k, k] = diag;
            }
        }

        return a;
    }

    private static double Couple(BandedCholesky a, FinMesh mesh, int k, int nb, double e)
    {
        if (!mesh.IsGate[nb] && nb < k)
        {
            a[k, nb] = -e;
        }

        return e;
    }

    /// <summary>Sets ψ on every gate node to V_G − Δφ.</summary>
    public void ApplyGate(double[] psi, double gateVoltageV)
    {
        double psiGate = gateVoltageV - _workFunctionV;
        for (int k = 0; k < psi.Length; k++)
        {
            if (_mesh.IsGate[k])
            {
                psi[k] = psiGate;
            }
        }
    }

    /// <summary>
    /// Newton iteration in place (F.4): J δ = −F, δ scaled to max|δ| ≤ 0.25 V, stop when max|δ| &lt; 1e-8 V, at most
    /// 80 iterations. Returns the iterations used and the last max|δ|.
    /// </summary>
    public (int Iterations, double LastUpdateV) Solve(
        double[] psi,
        double gateVoltageV,
        SolverStage stage,
        int biasIndex,
        int biasCount,
        IProgress<SolverProgress>? progress,
        CancellationToken cancellationToken)
    {
        ApplyGate(psi, gateVoltageV);
        SolverGrid g = _mesh.Grid;
        int nx = g.NodesX;
        int ny = g.NodesY;
        double vt = SolverConstants.ThermalVoltageV;
        double ni = SolverConstants.IntrinsicDensityPerNm3;
        double last = double.NaN;
        for (int it = 1; it <= FinPoissonSolver.MaxNewtonIterations; it++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            _jacobian.CopyFrom(_laplacian);
            for (int j = 0; j < ny; j++)
            {
                for (int i = 0; i < nx; i++)
                {
                    int k = (j * nx) + i;
                    if (_mesh.IsGate[k])
                    {
                        _step[k] = 0;
                        continue;
                    }

                    double pk = psi[k];
                    double flux = 0;
                    if (i > 0)
                    {
                        flux += _mesh.EdgeRight[k - 1] * (pk - psi[k - 1]);
                    }

                    if (i < nx - 1)
                    {
                        flux += _mesh.EdgeRight[k] * (pk - psi[k + 1]);
                    }

                    if (j > 0)
                    {
                        flux += _mesh.EdgeUp[k - nx] * (pk - psi[k - nx]);
                    }

                    if (j < ny - 1)
                    {
                        flux += _mesh.EdgeUp[k] * (pk - psi[k + nx]);
                    }

                    double residual = flux;
                    double c = _charge[k];
                    if (c > 0)
                    {
                        double en = Math.Exp(pk / vt);
                        double ep = 1 / en;
                        residual -= c * ((ni * (ep - en)) - _acceptorPerNm3);
                        _jacobian.AddToDiagonal(k, c * ni * (en + ep) / vt);
                    }

                    _step[k] = -residual;
                }
            }

            _jacobian.Factorize(cancellationToken);
            _jacobian.SolveInPlace(_step);
            double max = 0;
            for (int k = 0; k < _step.Length; k++)
            {
                max = Math.Max(max, Math.Abs(_step[k]));
            }

            if (!double.IsFinite(max))
            {
                throw new PoissonConvergenceException(
                    $"Newton step became non-finite at V_G = {gateVoltageV:F4} V, iteration {it}.");
            }

            last = max;
            double scale = max > FinPoissonSolver.MaxStepV ? FinPoissonSolver.MaxStepV / max : 1;
            for (int k = 0; k < psi.Length; k++)
            {
                psi[k] += scale * _step[k];
            }

            progress?.Report(new SolverProgress(stage, biasIndex, biasCount, gateVoltageV, it, max));
            if (max < FinPoissonSolver.NewtonToleranceV)
            {
                return (it, max);
            }
        }

        throw new PoissonConvergenceException(
            $"Newton did not converge in {FinPoissonSolver.MaxNewtonIterations} iterations at V_G = {gateVoltageV:F4} V (last max|δψ| = {last:G3} V).");
    }

    /// <summary>Builds the maps and charges of a converged ψ.</summary>
    public BiasSolution Snapshot(double[] psi, double gateVoltageV, int iterations, double lastUpdateV)
    {
        SolverGrid g = _mesh.Grid;
        int n = g.NodeCount;
        int nx = g.NodesX;
        double h2 = g.SpacingNm * g.SpacingNm;
        double vt = SolverConstants.ThermalVoltageV;
        double ni = SolverConstants.IntrinsicDensityPerNm3;
        var electrons = new double[n];
        double electronsPerNm = 0;
        double siliconCharge = 0;
        double gateFlux = 0;
        for (int k = 0; k < n; k++)
        {
            double f = _mesh.SiliconFraction[k];
            if (f > 0)
            {
                double en = ni * Math.Exp(psi[k] / vt);
                double ep = ni * Math.Exp(-psi[k] / vt);
                electrons[k] = en / SolverConstants.PerCm3ToPerNm3;
                electronsPerNm += h2 * f * en;
                siliconCharge += h2 * f * (ep - en - _acceptorPerNm3);
            }

            int i = k % nx;
            if (i < nx - 1 && _mesh.IsGate[k] != _mesh.IsGate[k + 1])
            {
                gateFlux += _mesh.EdgeRight[k] * (_mesh.IsGate[k] ? psi[k] - psi[k + 1] : psi[k + 1] - psi[k]);
            }

            if (k + nx < n && _mesh.IsGate[k] != _mesh.IsGate[k + nx])
            {
                gateFlux += _mesh.EdgeUp[k] * (_mesh.IsGate[k] ? psi[k] - psi[k + nx] : psi[k + nx] - psi[k]);
            }
        }

        return new BiasSolution(
            g,
            gateVoltageV,
            (double[])psi.Clone(),
            electrons,
            (double[])_mesh.SiliconFraction.Clone(),
            electronsPerNm,
            siliconCharge,
            gateFlux / SolverConstants.ChargeOverVacuumPermittivityVNm,
            iterations,
            lastUpdateV);
    }
}
