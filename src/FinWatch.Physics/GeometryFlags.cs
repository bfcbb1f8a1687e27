namespace FinWatch.Physics;

/// <summary>
/// Conditions found while deriving the cross-section of a measured fin profile
/// (<see cref="FinCrossSection.Derive(in FinProfile, GateFaces)"/>). The values combine bitwise.
/// </summary>
[Flags]
public enum GeometryFlags
{
    /// <summary>No condition: a normal, foot-wide (or vertical) fin with a consistent corner radius.</summary>
    None = 0,

    /// <summary>
    /// The fin is wider at its top than at its foot (W_t &gt; W_b, negative taper angle). The geometry is still
    /// computed; the flag marks a profile that is unusual for an etched fin and worth a look.
    /// </summary>
    ReEntrant = 1,

    /// <summary>
    /// The measured corner radius exceeds the largest radius the profile can hold (A.4: the top tangent point
    /// would pass the top centre, or the sidewall tangent point would fall below the foot). The fit is then
    /// inconsistent; area, perimeter and the inside test use the radius clipped to that limit.
    /// </summary>
    RadiusExceedsMax = 2,
}
