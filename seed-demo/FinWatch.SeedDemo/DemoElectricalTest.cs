namespace FinWatch.SeedDemo;

/// <summary>
/// One invented electrical-test result of the demo fab: the mean linear and saturation threshold of a wafer's test
/// structures, in V, as an electrical-test file gives it weeks after the fin was measured. One line of the
/// calibration CSV (<see cref="DemoFab.ElectricalTestCsvHeader"/>).
/// </summary>
/// <param name="LotId">Lot id.</param>
/// <param name="WaferSlot">Slot 1..25.</param>
/// <param name="Product">Product code.</param>
/// <param name="VtLinV">Linear threshold at V_DS = 0.05 V, V, rounded to 0.1 mV.</param>
/// <param name="VtSatV">Saturation threshold at V_DS = 0.75 V, V, rounded to 0.1 mV.</param>
/// <param name="TestedAtUtc">Test time, UTC, whole seconds; always before <see cref="DemoFab.EndUtc"/>.</param>
public readonly record struct DemoElectricalTest(string LotId, int WaferSlot, string Product, double VtLinV, double VtSatV, DateTime TestedAtUtc);
