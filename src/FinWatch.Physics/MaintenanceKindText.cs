namespace FinWatch.Physics;

/// <summary>
/// The one text spelling of <see cref="MaintenanceKind"/>, used by the API (<c>kind</c>), the maintenance import file,
/// the database column and the demo data: <c>wet_clean</c>, <c>part_replacement</c>, <c>seasoning</c>,
/// <c>preventive_maintenance</c>, <c>repair</c>, <c>other</c>.
/// </summary>
public static class MaintenanceKindText
{
    /// <summary>The spelling itself, with the allowed names and their meaning for messages.</summary>
    public static TextSpelling<MaintenanceKind> Spelling { get; } = new(
        "wet_clean (chamber opened and cleaned), part_replacement (a part replaced), seasoning (conditioning wafers run), "
        + "preventive_maintenance (scheduled maintenance), repair (after a fault) or other (say what in the note)",
        (MaintenanceKind.WetClean, "wet_clean"),
        (MaintenanceKind.PartReplacement, "part_replacement"),
        (MaintenanceKind.Seasoning, "seasoning"),
        (MaintenanceKind.PreventiveMaintenance, "preventive_maintenance"),
        (MaintenanceKind.Repair, "repair"),
        (MaintenanceKind.Other, "other"));

    /// <summary>The text of <paramref name="kind"/>.</summary>
    public static string ToText(MaintenanceKind kind) => Spelling.ToText(kind);
}
