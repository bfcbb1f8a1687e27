using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Shared parameter sets: the G.4 example nominal (W_t/W_b = 6/10 nm, H = 42, r = 2, EOT 0.9, L = 20, N_A = 1e17).</summary>
internal static class AnalyticFixtures
{
    public static readonly FinMeasurement G4Nominal = new(new FinProfile(6, 10, 42, 2), 0.9, 2.0, GateFaces.TriGate);

    public static readonly CalibrationParameters G4Parameters = new()
    {
        Name = "g4-example",
        Version = "2026.12-test",
        Nominal = G4Nominal,
    };

    private static readonly Lazy<ThresholdModel> LazyModel = new(() => new ThresholdModel(G4Parameters));

    public static ThresholdModel G4Model => LazyModel.Value;
}
