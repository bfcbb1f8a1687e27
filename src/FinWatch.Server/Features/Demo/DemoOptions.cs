namespace FinWatch.Server.Features.Demo;

/// <summary>Demo settings (section "FinWatch:Demo"); the command-line switch <c>--demo</c> sets <see cref="Enabled"/>.</summary>
public sealed class DemoOptions
{
    public const string Section = "FinWatch:Demo";

    /// <summary>Load the invented demo fab (seed-demo/) into the database when it holds no products.</summary>
    public bool Enabled { get; set; }

    /// <summary>Seed of the deterministic generator.</summary>
    public int Seed { get; set; } = SeedDemo.DemoFab.DefaultSeed;

    /// <summary>Days of history to generate (1 to 90, the planted events lie in the full 90); tests load fewer.</summary>
    public int Days { get; set; } = 90;

    /// <summary>Lots started per day.</summary>
    public double LotsPerDay { get; set; } = 24;

    /// <summary>
    /// Seconds between the lots of the simulated profile tool that keeps measuring after the history (0: no live tool).
    /// </summary>
    public int LiveLotSeconds { get; set; } = 60;
}
