namespace FinWatch.Physics.Analytic;

/// <summary>
/// One slice of the fin (docs/model.md §E.1) at the linear-regime drain voltage: its height of centre and local width
/// (nm), its threshold (V, relative to the gate's Δφ) and its share of the subthreshold current at the fin's effective
/// threshold (E.2; the shares of all slices and the corner device sum to 1). The corner device of E.4 is reported as a
/// last entry with <see cref="IsCorner"/> set.
/// </summary>
public readonly record struct SliceDetail(double HeightNm, double WidthNm, double ThresholdLinV, double CurrentShareLin, bool IsCorner);
