using FinWatch.Physics.Solver;

namespace FinWatch.Physics.Tests.Solver;

/// <summary>The scale-length eigenmode of B.4/F.8 on the solver mesh.</summary>
public sealed partial class FinPoissonSolverTests
{
    [Theory]
    [InlineData(8, 40, 0.2, 0.001)]
    [InlineData(10, 10, 0.2, 0.003)]
    public void ComputeScaleLength_Rectangle_MatchesSeparableExactRoot(double w, double h, double grid, double tolerance)
    {
        // Source: B.3 numerical check [T/D] — the meshed λ agrees with the separable exact-root formula
        // 1/λ² = 1/λ_W² + 1/λ_H² (λ_H from t_si = 2H) within 0.1 % for 8 × 40 nm and 0.3 % for 10 × 10 nm at
        // t_ox = 1 nm. These are model values [T] (docs/model.md §F.8), not published results; the exact root is
        // computed independently in AnalyticReferences. Also F.9 case 5.
        FinSolverRequest request = Request(new FinProfile(w, w, h, 0), grid);

        ScaleLengthResult r = FinPoissonSolver.ComputeScaleLength(request, null, CancellationToken.None);

        double expected = AnalyticReferences.TriGateScaleLengthNm(w, h, 1);
        Assert.InRange(r.ScaleLengthNm / expected, 1 - tolerance, 1 + tolerance);
        Assert.Equal(1 / Math.Sqrt(r.EigenvaluePerNm2), r.ScaleLengthNm, 1e-12);
    }

    [Fact]
    public void ComputeScaleLength_HardMaskTallFin_LiesBetweenTriGateAndDoubleGateRoots()
    {
        // Source: A.7 / B.3 — with a hard mask the top is gated only weakly, through the cap and the metal above it,
        // so λ lies between the tri-gate value (separable exact root, top gated through 1 nm) and λ_W (exact root,
        // t_si = W, top not gated at all).
        FinSolverRequest request = Request(new FinProfile(8, 8, 40, 0), 0.25, GateFaces.DoubleGate);

        ScaleLengthResult r = FinPoissonSolver.ComputeScaleLength(request, null, CancellationToken.None);

        double lambdaW = 1 / AnalyticReferences.DoubleGateWaveNumber(8, 1);
        double lambdaTriGate = AnalyticReferences.TriGateScaleLengthNm(8, 40, 1);
        Assert.InRange(r.ScaleLengthNm, lambdaTriGate, lambdaW);
    }

    [Fact]
    public void ComputeScaleLength_GridRefinement_ConvergesAtSecondOrder()
    {
        // Source: F.3 — the node-centred 5-point finite-volume scheme with interfaces on grid lines is second order;
        // observed order p = log₂(|λ_h − λ_h/2| / |λ_h/2 − λ_h/4|) for h = 0.5, 0.25, 0.125 nm.
        double[] lambda = new double[3];
        double[] spacings = [0.5, 0.25, 0.125];
        for (int m = 0; m < 3; m++)
        {
            lambda[m] = FinPoissonSolver.ComputeScaleLength(
                Request(new FinProfile(8, 8, 20, 0), spacings[m]), null, CancellationToken.None).ScaleLengthNm;
        }

        double order = Math.Log2(Math.Abs(lambda[0] - lambda[1]) / Math.Abs(lambda[1] - lambda[2]));
        Assert.InRange(order, 1.6, 2.5);
    }

    [Fact]
    public void ComputeScaleLength_Cancelled_ThrowsOperationCanceled()
    {
        // Source: task brief — cancellation stops every solver loop promptly.
        using var cts = new CancellationTokenSource();
        var progress = new SynchronousProgress(_ => cts.Cancel());

        Assert.Throws<OperationCanceledException>(() => FinPoissonSolver.ComputeScaleLength(
            Request(new FinProfile(8, 8, 20, 0), 0.25), progress, cts.Token));
        Assert.Single(progress.Reports);
    }
}
