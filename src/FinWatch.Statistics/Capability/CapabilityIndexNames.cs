namespace FinWatch.Statistics.Capability;

/// <summary>Keys of <see cref="CapabilityResult.Intervals"/>, <see cref="CapabilityResult.LowerBounds"/>
/// and <see cref="CapabilityResult.Reasons"/> (which also uses the other member names).</summary>
public static class CapabilityIndexNames
{
    /// <summary>Potential capability from within sigma.</summary>
    public const string Cp = "Cp";

    /// <summary>Capability from within sigma, taking the mean into account.</summary>
    public const string Cpk = "Cpk";

    /// <summary>Potential performance from overall sigma.</summary>
    public const string Pp = "Pp";

    /// <summary>Performance from overall sigma, taking the mean into account.</summary>
    public const string Ppk = "Ppk";
}
