using FinWatch.Physics.Solver;

namespace FinWatch.Physics.Tests.Solver;

/// <summary>The shape-key cache (task brief: results cached by a shape hash).</summary>
public sealed class FinSolverCacheTests
{
    private static FinSolverRequest Small() => new()
    {
        Profile = new FinProfile(6, 6, 10, 0),
        DielectricLayers = [new DielectricLayer(1, 3.9)],
        GridSpacingNm = 0.5,
        BoxThicknessNm = 2,
        GateStartV = 0.2,
        GateStopV = 0.7,
    };

    [Fact]
    public async Task GetOrSolveAsync_SameShapeTwice_SolvesOnceAndReturnsSameResult()
    {
        // Source: task brief — results cached by shape hash; failures must not be cached.
        int calls = 0;
        var cache = new FinSolverCache((request, ct) =>
        {
            Interlocked.Increment(ref calls);
            return FinPoissonSolver.SolveAsync(request, null, ct);
        });

        FinSolverResult first = await cache.GetOrSolveAsync(Small(), CancellationToken.None);
        FinSolverResult second = await cache.GetOrSolveAsync(Small(), CancellationToken.None);

        Assert.Same(first, second);
        Assert.Equal(1, calls);
        Assert.True(cache.Contains(Small().ShapeKey));
        Assert.Equal(Small().ShapeKey, first.ShapeKey);
    }

    [Fact]
    public async Task GetOrSolveAsync_FailedComputation_IsNotCached()
    {
        // Source: task brief — results cached by shape hash; failures must not be cached.
        int calls = 0;
        var cache = new FinSolverCache((_, _) =>
        {
            Interlocked.Increment(ref calls);
            return Task.FromException<FinSolverResult>(new PoissonConvergenceException("test failure"));
        });

        await Assert.ThrowsAsync<PoissonConvergenceException>(() => cache.GetOrSolveAsync(Small(), CancellationToken.None));
        await Assert.ThrowsAsync<PoissonConvergenceException>(() => cache.GetOrSolveAsync(Small(), CancellationToken.None));

        Assert.Equal(2, calls);
        Assert.Equal(0, cache.Count);
    }
}
