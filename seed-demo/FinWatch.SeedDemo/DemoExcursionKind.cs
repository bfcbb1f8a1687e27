namespace FinWatch.SeedDemo;

/// <summary>Kind of a planted bad wafer.</summary>
public enum DemoExcursionKind
{
    /// <summary>Under-etched: fins wider and shorter than the rest of the lot.</summary>
    UnderEtch,

    /// <summary>Over-etched: fins narrower and taller than the rest of the lot.</summary>
    OverEtch,
}
