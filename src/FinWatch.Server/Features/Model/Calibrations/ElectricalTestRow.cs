namespace FinWatch.Server.Features.Model.Calibrations;

/// <summary>One validated row of an electrical-test file: a wafer's thresholds in V, and when it was tested.</summary>
public sealed record ElectricalTestRow(int Row, string LotId, int WaferSlot, string Product, double VtLinV, double VtSatV, DateTimeOffset TestedAt);
