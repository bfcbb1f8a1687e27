using FinWatch.Physics.Solver;

namespace FinWatch.Physics.Tests.Solver;

/// <summary>An <see cref="IProgress{T}"/> that records reports on the calling thread (Progress&lt;T&gt; posts asynchronously).</summary>
internal sealed class SynchronousProgress(Action<SolverProgress>? onReport = null) : IProgress<SolverProgress>
{
    public List<SolverProgress> Reports { get; } = [];

    public void Report(SolverProgress value)
    {
        Reports.Add(value);
        onReport?.Invoke(value);
    }
}
