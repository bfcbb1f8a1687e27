using System.Diagnostics;
using FinWatch.Physics;
using FinWatch.Physics.Solver;

namespace FinWatch.Benchmarks;

/// <summary>
/// 2-D Poisson–Boltzmann threshold extraction (docs/model.md §F.7 case: 8 × 40 nm undoped fin, 1 nm SiO₂, 0.2 nm mesh),
/// and the banded Cholesky of the solver against a plain dense Cholesky of the same order and matrix structure
/// (a 5-point operator on the same grid), measured side by side on meshes where the dense solve still finishes, with
/// the O(n³) dense cost extrapolated to the 0.2 nm mesh.
/// </summary>
public static class SolverBenchmark
{
    public static int Run()
    {
        var request = new FinSolverRequest
        {
            Profile = new FinProfile(8, 8, 40, 0),
            DielectricLayers = [new DielectricLayer(1.0, SolverConstants.OxideRelativePermittivity)],
            GridSpacingNm = 0.2,
        };
        FinPoissonSolver.Solve(request with { GridSpacingNm = 0.5 }, null, CancellationToken.None); // warm-up
        var best = double.MaxValue;
        FinSolverResult? result = null;
        for (var i = 0; i < 3; i++)
        {
            var sw = Stopwatch.StartNew();
            result = FinPoissonSolver.Solve(request, null, CancellationToken.None);
            best = Math.Min(best, sw.Elapsed.TotalSeconds);
        }

        Console.WriteLine($"2-D solve, 8 × 40 nm fin, 0.2 nm mesh ({result!.Grid.NodeCount:N0} nodes, {result.Sweep.Count} gate biases, " +
            $"{result.TotalNewtonIterations} Newton iterations): best of 3 {best:F2} s (target ≤ 2 s); V_T = {result.ThresholdVoltageV:F4} V");

        // Banded against dense on grids of the same shape (columns × rows of the 0.2 nm mesh scaled down).
        var nx = result.Grid.NodesX;
        var ny = result.Grid.NodesY;
        foreach (var scale in new[] { 4, 3 })
        {
            var (bx, by) = (Math.Max(3, nx / scale), Math.Max(3, ny / scale));
            var banded = TimeBanded(bx, by);
            var dense = TimeDense(bx, by);
            Console.WriteLine($"    {bx} × {by} grid ({bx * by:N0} unknowns): banded Cholesky {banded * 1e3:F2} ms, dense Cholesky {dense * 1e3:F1} ms, speed-up {dense / banded:F0}×");
        }

        var bandedFull = TimeBanded(nx, ny);
        var (sx, sy) = (Math.Max(3, nx / 3), Math.Max(3, ny / 3));
        var denseFull = TimeDense(sx, sy) * Math.Pow((double)(nx * ny) / (sx * sy), 3);
        Console.WriteLine($"    {nx} × {ny} grid ({nx * ny:N0} unknowns): banded Cholesky {bandedFull * 1e3:F1} ms; dense extrapolated by n³ {denseFull:F0} s; speed-up ≈ {denseFull / bandedFull:N0}×");
        return 0;
    }

    // The 5-point operator with a positive shift: symmetric positive definite, bandwidth = row length.
    private static double TimeBanded(int nx, int ny)
    {
        var n = nx * ny;
        var best = double.MaxValue;
        for (var rep = 0; rep < 3; rep++)
        {
            var m = new BandedCholesky(n, nx);
            for (var k = 0; k < n; k++)
            {
                m.AddToDiagonal(k, 4.1);
                if (k % nx != nx - 1)
                {
                    m[k + 1, k] = -1;
                }

                if (k + nx < n)
                {
                    m[k + nx, k] = -1;
                }
            }

            var sw = Stopwatch.StartNew();
            m.Factorize();
            best = Math.Min(best, sw.Elapsed.TotalSeconds);
        }

        return best;
    }

    private static double TimeDense(int nx, int ny)
    {
        var n = nx * ny;
        var a = new double[n, n];
        for (var k = 0; k < n; k++)
        {
            a[k, k] = 4.1;
            if (k % nx != nx - 1)
            {
                a[k + 1, k] = a[k, k + 1] = -1;
            }

            if (k + nx < n)
            {
                a[k + nx, k] = a[k, k + nx] = -1;
            }
        }

        var sw = Stopwatch.StartNew();
        // Plain dense Cholesky (lower triangle, in place).
        for (var j = 0; j < n; j++)
        {
            var d = a[j, j];
            for (var k = 0; k < j; k++)
            {
                d -= a[j, k] * a[j, k];
            }

            a[j, j] = Math.Sqrt(d);
            for (var i = j + 1; i < n; i++)
            {
                var s = a[i, j];
                for (var k = 0; k < j; k++)
                {
                    s -= a[i, k] * a[j, k];
                }

                a[i, j] = s / a[j, j];
            }
        }

        return sw.Elapsed.TotalSeconds;
    }
}
