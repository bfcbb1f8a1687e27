namespace FinWatch.Server.Features.Demo;

/// <summary>Demo settings (section "FinWatch:Demo"); the command-line switch <c>--demo</c> sets <see cref="Enabled"/>.</summary>
public sealed class DemoOptions
{
    public const string Section = "FinWatch:Demo";

    /// <summary>Load the invented demo fab (seed-demo/) into the database when it holds no products.</summary>
    public bool Enabled { get; set; }

    /// <summary>Seed of the deterministic generator.</summary>
    public int Seed { get; set; } = SeedDemo.DemoFab.DefaultSeed;
}
