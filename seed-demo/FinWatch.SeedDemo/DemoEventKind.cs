namespace FinWatch.SeedDemo;

/// <summary>What a planted <see cref="DemoEvent"/> is.</summary>
public enum DemoEventKind
{
    /// <summary>A chamber maintenance with no planted shift (a maintenance does not always move the process).</summary>
    RoutineMaintenance,

    /// <summary>A maintenance of the chamber whose taper creeps with RF hours; the taper drops back to nominal.</summary>
    TaperCreepReset,

    /// <summary>A maintenance after which the chamber's corner radius is lower by a fixed step and stays there.</summary>
    CornerRadiusStep,

    /// <summary>Start of a slow, linear liner thinning on a liner chamber (not a maintenance).</summary>
    LinerThinningStart,
}
