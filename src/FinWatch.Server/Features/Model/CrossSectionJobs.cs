using System.Collections.Concurrent;
using FinWatch.Physics.Solver;

namespace FinWatch.Server.Features.Model;

/// <summary>
/// Runs 2-D cross-section solves in the background, one at a time (they take seconds and both cores), keeps their
/// progress for polling, lets them be cancelled, and caches finished results by the request's shape key.
/// </summary>
public sealed class CrossSectionJobs(ILogger<CrossSectionJobs> logger) : IDisposable
{
    public const string Caution =
        "Engineering estimate from a classical 2-D model relative to the product's own references (it leaves out quantum confinement, short-channel effects and interface charge; the limitations list says what else); it does not replace electrical test or the fab's own procedures.";

    private readonly ConcurrentDictionary<string, Job> jobs = new(StringComparer.Ordinal);
    private readonly ConcurrentDictionary<string, CrossSectionResult> cache = new(StringComparer.Ordinal);
    private readonly SemaphoreSlim oneAtATime = new(1, 1);

    public CrossSectionJobResponse Start(FinSolverRequest request)
    {
        var key = request.ShapeKey;
        var job = new Job(Guid.NewGuid().ToString("N"), key);
        jobs[job.Id] = job;
        if (cache.TryGetValue(key, out var cached))
        {
            job.Finish(cached, fromCache: true);
            return job.Response();
        }

        _ = Task.Run(() => RunAsync(job, request));
        return job.Response();
    }

    public CrossSectionJobResponse? Get(string id) => jobs.TryGetValue(id, out var job) ? job.Response() : null;

    public CrossSectionJobResponse? Cancel(string id)
    {
        if (!jobs.TryGetValue(id, out var job))
        {
            return null;
        }

        job.Cancellation.Cancel();
        return job.Response();
    }

    private async Task RunAsync(Job job, FinSolverRequest request)
    {
        try
        {
            await oneAtATime.WaitAsync(job.Cancellation.Token);
            try
            {
                job.Status = "running";
                var result = await Task.Run(() => FinPoissonSolver.Solve(request, new SyncProgress(job), job.Cancellation.Token));
                var mapped = CrossSectionMapping.ToResult(result);
                cache[job.ShapeKey] = mapped;
                job.Finish(mapped, fromCache: false);
            }
            finally
            {
                oneAtATime.Release();
            }
        }
        catch (OperationCanceledException)
        {
            job.Status = "cancelled";
        }
        catch (Exception e) when (e is PoissonConvergenceException or ArgumentException or InvalidOperationException)
        {
            job.Status = "failed";
            job.Error = e.Message;
            logger.LogWarning(e, "Cross-section solve {Id} failed", job.Id);
        }
    }

    public void Dispose()
    {
        foreach (var job in jobs.Values)
        {
            job.Cancellation.Cancel();
            job.Cancellation.Dispose();
        }

        oneAtATime.Dispose();
    }

    /// <summary>Records progress on the solver's thread (Progress&lt;T&gt; would post it later, out of order).</summary>
    private sealed class SyncProgress(Job job) : IProgress<SolverProgress>
    {
        public void Report(SolverProgress p) =>
            job.Progress = new CrossSectionProgress(p.Stage, p.BiasIndex, p.BiasCount, p.GateVoltageV, p.Iteration);
    }

    private sealed class Job(string id, string shapeKey)
    {
        public string Id { get; } = id;
        public string ShapeKey { get; } = shapeKey;
        public CancellationTokenSource Cancellation { get; } = new();
        public volatile string Status = "queued";
        public volatile CrossSectionProgress? Progress;
        public volatile CrossSectionResult? Result;
        public volatile string? Error;
        public bool FromCache { get; private set; }

        public void Finish(CrossSectionResult result, bool fromCache)
        {
            Result = result;
            FromCache = fromCache;
            Status = "done";
        }

        public CrossSectionJobResponse Response() => new(Id, Status, ShapeKey, FromCache, Progress, Result, Error, Caution);
    }
}
