using System.Collections.Concurrent;

namespace FinWatch.Physics.Solver;

/// <summary>
/// In-memory cache of 2-D solver results keyed by <see cref="FinSolverRequest.ShapeKey"/>: concurrent callers with
/// the same shape share one computation. A failed or cancelled computation is removed so that it can be retried.
/// </summary>
/// <remarks>
/// Unbounded; intended for one process. Thread-safe. The computation runs with the token of the caller that started
/// it; if that caller cancels, every caller waiting on the same key sees the cancellation and the entry is removed.
/// </remarks>
public sealed class FinSolverCache
{
    private readonly ConcurrentDictionary<string, Lazy<Task<FinSolverResult>>> _entries = new(StringComparer.Ordinal);
    private readonly Func<FinSolverRequest, CancellationToken, Task<FinSolverResult>> _solve;

    /// <summary>Creates a cache that computes with <see cref="FinPoissonSolver.SolveAsync"/>.</summary>
    public FinSolverCache()
        : this((request, ct) => FinPoissonSolver.SolveAsync(request, null, ct))
    {
    }

    /// <summary>Creates a cache with a custom computation (for tests or instrumentation).</summary>
    /// <param name="solve">Computes a result for a request.</param>
    public FinSolverCache(Func<FinSolverRequest, CancellationToken, Task<FinSolverResult>> solve)
    {
        ArgumentNullException.ThrowIfNull(solve);
        _solve = solve;
    }

    /// <summary>Number of cached (or running) entries.</summary>
    public int Count => _entries.Count;

    /// <summary>Returns the cached result for the request's shape key, computing it once if absent.</summary>
    /// <param name="request">The request.</param>
    /// <param name="cancellationToken">Cancels the computation started by this call.</param>
    /// <returns>The result.</returns>
    public async Task<FinSolverResult> GetOrSolveAsync(FinSolverRequest request, CancellationToken cancellationToken)
    {
        ArgumentNullException.ThrowIfNull(request);
        string key = request.ShapeKey;
        Lazy<Task<FinSolverResult>> entry = _entries.GetOrAdd(
            key, _ => new Lazy<Task<FinSolverResult>>(() => _solve(request, cancellationToken)));
        try
        {
            return await entry.Value.ConfigureAwait(false);
        }
        catch
        {
            _entries.TryRemove(new KeyValuePair<string, Lazy<Task<FinSolverResult>>>(key, entry));
            throw;
        }
    }

    /// <summary>Whether a result (or running computation) is cached for the key.</summary>
    /// <param name="shapeKey">A <see cref="FinSolverRequest.ShapeKey"/>.</param>
    /// <returns><see langword="true"/> when present.</returns>
    public bool Contains(string shapeKey) => _entries.ContainsKey(shapeKey);
}
