namespace FinWatch.Physics.Analytic;

/// <summary>One electrical-test result of a device whose fin was measured: thresholds in V at the parameter set's drain voltages.</summary>
public readonly record struct ElectricalObservation(FinMeasurement Fin, double VtLinV, double VtSatV);
