namespace FinWatch.SeedDemo;

/// <summary>
/// The invented "true" electrical behaviour of a demo product, from which its electrical-test results are made: the
/// three calibration parameters of docs/model.md §G.3, set away from the physics defaults so that a calibration has
/// something to find. Invented values, not measured on any real device.
/// </summary>
/// <param name="Product">Product code.</param>
/// <param name="GateLengthNm">True effective gate length L_eff, nm (the physics default is 20 nm).</param>
/// <param name="BarrierShiftV">True V_bi − φ_th minus the physics default, V.</param>
/// <param name="ThresholdOffsetV">True constant threshold offset (gate work function), V.</param>
/// <param name="WaferNoiseMv">Standard deviation of one wafer's mean test threshold about the model, mV.</param>
public sealed record DemoElectricalTruth(string Product, double GateLengthNm, double BarrierShiftV, double ThresholdOffsetV, double WaferNoiseMv);
