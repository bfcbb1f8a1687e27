namespace FinWatch.Physics;

/// <summary>
/// What was done to a process chamber or tool in a maintenance event. Kept with the other domain enums that the API,
/// the database and the demo data share, so that each kind has one spelling everywhere; written as text only through
/// <see cref="MaintenanceKindText"/>.
/// </summary>
public enum MaintenanceKind
{
    /// <summary>The chamber was opened and its walls and parts were cleaned wet.</summary>
    WetClean,

    /// <summary>A consumable or worn part was replaced (edge ring, showerhead, liner, electrode).</summary>
    PartReplacement,

    /// <summary>Conditioning (seasoning) wafers were run to bring the chamber walls back to a steady state.</summary>
    Seasoning,

    /// <summary>Scheduled preventive maintenance of the chamber or the whole tool.</summary>
    PreventiveMaintenance,

    /// <summary>An unscheduled repair after a fault or an alarm.</summary>
    Repair,

    /// <summary>Anything else; the note says what.</summary>
    Other,
}
