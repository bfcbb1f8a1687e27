namespace FinWatch.Physics.Analytic;

/// <summary>
/// The one text spelling of <see cref="ConfinementSurface"/> as the sidewall orientation of a fin: <c>"110"</c> and
/// <c>"100"</c>, used by the API (<c>sidewall_orientation</c>) and the database column.
/// </summary>
public static class ConfinementSurfaceText
{
    /// <summary>(110) sidewalls: the usual ⟨110⟩ fin on a (100) wafer (<see cref="ConfinementSurface.Si110"/>).</summary>
    public const string Si110 = "110";

    /// <summary>(100) sidewalls: a fin rotated 45° on a (100) wafer (<see cref="ConfinementSurface.Si100"/>).</summary>
    public const string Si100 = "100";

    /// <summary>The spelling itself, with the allowed names and their meaning for messages.</summary>
    public static TextSpelling<ConfinementSurface> Spelling { get; } = new(
        Si110 + " (sidewalls of the usual ⟨110⟩ fin on a (100) wafer) or " + Si100 + " (sidewalls of a fin rotated 45°)",
        (ConfinementSurface.Si110, Si110), (ConfinementSurface.Si100, Si100));
}
