using FinWatch.Physics;

namespace FinWatch.SeedDemo;

/// <summary>
/// One planted event of the invented demo fab: the history that the control charts are expected to find.
/// The events are the same for every seed and scale; the generator derives its behaviour from them.
/// </summary>
/// <param name="AtUtc">When it happened (UTC). A maintenance starts here and takes the chamber down for <see cref="DemoFab.MaintenanceDowntime"/>.</param>
/// <param name="Tool">Tool id, for example <c>FX07</c>.</param>
/// <param name="Chamber">Chamber id (fab-unique, includes the tool), for example <c>FX07-R</c>.</param>
/// <param name="Kind">What it is.</param>
/// <param name="Description">What a reader of the charts should see.</param>
public sealed record DemoEvent(DateTime AtUtc, string Tool, string Chamber, DemoEventKind Kind, string Description)
{
    /// <summary>True when the event is a maintenance (every kind except <see cref="DemoEventKind.LinerThinningStart"/>).</summary>
    public bool IsMaintenance => Kind != DemoEventKind.LinerThinningStart;

    /// <summary>
    /// What the invented maintenance crew would write in the chamber log: a wet clean for the taper-creep resets, a
    /// part replacement (the new edge ring) for the corner-radius step, preventive maintenance for the routine ones;
    /// null for a drift start, which nobody logs.
    /// </summary>
    public MaintenanceKind? LoggedAs => Kind switch
    {
        DemoEventKind.TaperCreepReset => MaintenanceKind.WetClean,
        DemoEventKind.CornerRadiusStep => MaintenanceKind.PartReplacement,
        DemoEventKind.RoutineMaintenance => MaintenanceKind.PreventiveMaintenance,
        _ => null,
    };

    /// <summary>When the chamber went back to production: the end of the maintenance's downtime (a maintenance only).</summary>
    public DateTime BackInProductionUtc => AtUtc + FabLayout.MaintenanceDowntime;

    /// <summary>The invented crew that did a maintenance: the etch crew for fin-etch chambers, the thin-film crew for liner chambers.</summary>
    public string Crew => Tool.StartsWith("LD", StringComparison.Ordinal) ? "thin-film maintenance crew (invented)" : "etch maintenance crew (invented)";
}
