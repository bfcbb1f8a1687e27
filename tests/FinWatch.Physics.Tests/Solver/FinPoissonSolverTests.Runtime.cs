using System.Diagnostics;
using FinWatch.Physics.Solver;

namespace FinWatch.Physics.Tests.Solver;

/// <summary>Progress, cancellation and error behaviour of the solver (task brief; F.4 "raise an error, never return silently").</summary>
public sealed partial class FinPoissonSolverTests
{
    private static FinSolverRequest SmallSweep() => Request(new FinProfile(6, 6, 10, 1), 0.5) with
    {
        GateStartV = 0.1,
        GateStopV = 0.8,
    };

    [Fact]
    public async Task SolveAsync_CancelledDuringSweep_StopsPromptlyWithOperationCanceled()
    {
        // Source: task brief — cancellation must stop the run promptly. The token is cancelled inside the first
        // gate-sweep report; no further Newton iteration may run.
        using var cts = new CancellationTokenSource();
        int reportsAfterCancel = -1;
        var progress = new SynchronousProgress(p =>
        {
            if (cts.IsCancellationRequested)
            {
                reportsAfterCancel++;
            }
            else if (p.Stage == SolverStage.GateSweep)
            {
                cts.Cancel();
                reportsAfterCancel = 0;
            }
        });
        var clock = Stopwatch.StartNew();

        await Assert.ThrowsAnyAsync<OperationCanceledException>(
            () => FinPoissonSolver.SolveAsync(SmallSweep() with { GridSpacingNm = 0.1 }, progress, cts.Token));

        Assert.Equal(0, reportsAfterCancel);
        Assert.True(clock.Elapsed < TimeSpan.FromSeconds(5));
    }

    [Fact]
    public async Task SolveAsync_AlreadyCancelled_Throws()
    {
        // Source: task brief — a cancelled token is honoured before any work.
        using var cts = new CancellationTokenSource();
        await cts.CancelAsync();

        await Assert.ThrowsAnyAsync<OperationCanceledException>(
            () => FinPoissonSolver.SolveAsync(SmallSweep(), null, cts.Token));
    }

    [Fact]
    public void Solve_WithProgress_ReportsEveryNewtonIterationInOrder()
    {
        // Source: task brief — progress per Newton iteration; the report count equals the iterations of the result.
        var progress = new SynchronousProgress();

        FinSolverResult r = FinPoissonSolver.Solve(SmallSweep(), progress, CancellationToken.None);

        List<SolverProgress> newton = progress.Reports.Where(p => p.Stage != SolverStage.Meshing).ToList();
        Assert.Equal(r.TotalNewtonIterations, newton.Count);
        Assert.Equal(SolverStage.Meshing, progress.Reports[0].Stage);
        Assert.Equal(SolverStage.ThresholdResolve, progress.Reports[^1].Stage);
        List<int> biasIndices = newton.Where(p => p.Stage == SolverStage.GateSweep).Select(p => p.BiasIndex).ToList();
        Assert.Equal(biasIndices.Order(), biasIndices);
        Assert.Equal(r.Sweep.Count - 1, biasIndices[^1]);
    }

    [Fact]
    public void SolveAtGateVoltages_HugeNegativeGateOnDopedFin_ThrowsConvergenceException()
    {
        // Source: F.4 — the Newton iteration raises an error rather than returning an unconverged result. At
        // V_G = −25 V the hole density e^{−ψ/v_t} overflows, which must surface as an error.
        FinSolverRequest request = Request(new FinProfile(6, 6, 10, 0), 0.5) with { AcceptorDensityCm3 = 1e18 };

        Assert.Throws<PoissonConvergenceException>(
            () => FinPoissonSolver.SolveAtGateVoltages(request, [-25.0], null, CancellationToken.None));
    }

    [Fact]
    public void Solve_SweepStartsAboveThreshold_ReportsNaNThreshold()
    {
        // Source: F.6 / FinSolverResult contract — an unbracketed crossing is a data condition reported as NaN.
        FinSolverRequest request = SmallSweep() with { GateStartV = 0.9, GateStopV = 1.0 };

        FinSolverResult r = FinPoissonSolver.Solve(request, null, CancellationToken.None);

        Assert.True(double.IsNaN(r.ThresholdVoltageV));
        Assert.Null(r.AtThreshold);
        Assert.Empty(r.Corner);
    }
}
