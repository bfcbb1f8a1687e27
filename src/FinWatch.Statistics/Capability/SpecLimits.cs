namespace FinWatch.Statistics.Capability;

/// <summary>
/// Specification limits of a characteristic, in the data's own units (for fin metrology typically nm).
/// Either limit may be absent for a one-sided specification; at least one is needed for any index.
/// </summary>
/// <param name="Lower">Lower specification limit LSL, or null.</param>
/// <param name="Upper">Upper specification limit USL, or null.</param>
/// <param name="Target">Target value T for Cpm; when null and both limits are given, the midpoint
/// (LSL + USL)/2 is used (docs/statistics.md §5.1).</param>
/// <remarks>Limits and target must be finite and LSL &lt; USL; the capability functions throw
/// <see cref="ArgumentOutOfRangeException"/> otherwise.</remarks>
public readonly record struct SpecLimits(double? Lower, double? Upper, double? Target = null)
{
    /// <summary>True when both limits are given.</summary>
    public bool IsTwoSided => Lower.HasValue && Upper.HasValue;

    /// <summary>True when neither limit is given.</summary>
    public bool IsEmpty => !Lower.HasValue && !Upper.HasValue;

    /// <summary>The target for Cpm: <see cref="Target"/> if given, else the midpoint of a two-sided
    /// specification, else null.</summary>
    public double? EffectiveTarget => Target ?? (IsTwoSided ? 0.5 * (Lower!.Value + Upper!.Value) : null);

    /// <summary>Throws for non-finite limits or target, or for LSL ≥ USL.</summary>
    internal void Validate(string paramName)
    {
        if ((Lower is { } l && !double.IsFinite(l)) || (Upper is { } u && !double.IsFinite(u))
            || (Target is { } t && !double.IsFinite(t)))
        {
            throw new ArgumentOutOfRangeException(paramName, this, "Specification limits and target must be finite.");
        }

        if (IsTwoSided && Lower!.Value >= Upper!.Value)
        {
            throw new ArgumentOutOfRangeException(paramName, this, "The lower specification limit must be below the upper one.");
        }
    }
}
