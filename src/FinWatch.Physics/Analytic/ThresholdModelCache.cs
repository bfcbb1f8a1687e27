using System.Collections.Concurrent;

namespace FinWatch.Physics.Analytic;

/// <summary>
/// Thread-safe cache of <see cref="ThresholdModel"/> instances, one per distinct parameter set (compared by value,
/// so a new version string is a new entry). Each model caches its nominal evaluation and sensitivity table (G.2 step 6).
/// </summary>
/// <remarks>Unbounded: meant for the handful of live per-product parameter sets; call <see cref="Clear"/> on recalibration.</remarks>
public sealed class ThresholdModelCache
{
    private readonly ConcurrentDictionary<CalibrationParameters, Lazy<ThresholdModel>> _models = new();

    /// <summary>Number of cached parameter sets.</summary>
    public int Count => _models.Count;

    /// <summary>The model for a parameter set, built once on first use (≈ 15 slice-model evaluations).</summary>
    /// <param name="parameters">The parameter set.</param>
    /// <returns>The cached model.</returns>
    /// <exception cref="ArgumentException">The nominal is invalid or punches through (the failure is not cached).</exception>
    public ThresholdModel GetOrCreate(CalibrationParameters parameters)
    {
        ArgumentNullException.ThrowIfNull(parameters);
        Lazy<ThresholdModel> lazy = _models.GetOrAdd(parameters, p => new Lazy<ThresholdModel>(() => new ThresholdModel(p)));
        try
        {
            return lazy.Value;
        }
        catch (ArgumentException)
        {
            _models.TryRemove(parameters, out _);
            throw;
        }
    }

    /// <summary>Removes every cached model.</summary>
    public void Clear() => _models.Clear();
}
