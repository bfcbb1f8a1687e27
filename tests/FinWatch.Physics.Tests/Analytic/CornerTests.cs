using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Corner device (docs/model.md §D.2; coefficients are [T] trend values from the model's own 2-D computations, not published).</summary>
public sealed class CornerTests
{
    private const double Vt = PhysicalConstants.ThermalVoltageV;

    [Fact]
    public void CurrentFraction_TriGate_IsTwoCornerWidthsOverPerimeter()
    {
        // D.2: f_c = 2 w_c/P_gate.
        Assert.Equal(2 * 0.5 / 90.0, Corner.CurrentFraction(0.5, 90, GateFaces.TriGate), 1e-15);
    }

    [Fact]
    public void CurrentFraction_HardMask_IsZero()
    {
        // D.3 / A.7: a hard mask removes the top corners.
        Assert.Equal(0, Corner.CurrentFraction(0.5, 84, GateFaces.DoubleGate));
    }

    [Theory]
    [InlineData(0, 8, 0.55)]
    [InlineData(4, 8, 0.36)]
    [InlineData(2, 8, 0.455)]
    [InlineData(9, 8, 0.36)]
    public void Kappa_Radius_IsTrendLineClampedToRhoOne(double r, double wt, double expected)
    {
        // D.2 [T]: κ(ρ) ≈ 0.55 − 0.19ρ, ρ = r/(W_t/2) ∈ [0, 1].
        Assert.Equal(expected, Corner.Kappa(r, wt, CornerCoefficients.Default), 1e-12);
    }

    [Fact]
    public void LocalLowering_Undoped_IsResidualOnly()
    {
        // D.2: for N_A → 0 the effect vanishes apart from ΔV_c0 ≈ 2.5 mV.
        Assert.Equal(0.0025, Corner.LocalLoweringV(1, 8, 1, 0, CornerCoefficients.Default), 1e-15);
    }

    [Fact]
    public void LocalLowering_Doped_MatchesHandValue()
    {
        // D.2: ΔV_c = ΔV_c0 + κ q N_A W_t/(2 C_ox). Hand value: N_A = 1e18, W_t = 8 nm, EOT 1 nm, sharp corner:
        // q N_A W_t/2 = 6.408706536e-8 C/cm², C_ox = 3.9·8.8541878128e-14/1e-7 = 3.453133247e-6 F/cm² ⇒ 18.559 mV; ×0.55 + 2.5.
        double expected = 0.0025 + (0.55 * (1.602176634e-19 * 1e18 * 8e-7 / 2 / (3.9 * 8.8541878128e-14 / 1e-7)));
        Assert.Equal(expected, Corner.LocalLoweringV(0, 8, 1, 1e18, CornerCoefficients.Default), 1e-15);
        Assert.Equal(0.0127077, expected, 1e-6);
    }

    [Fact]
    public void LocalLowering_Rounding_ReducesLowering()
    {
        // D.3: the local lowering falls with the radius (≈ 25 % from r = 0 to 3 nm at 8 nm width with ΔV_c0 included).
        double sharp = Corner.LocalLoweringV(0, 8, 1, 5e18, CornerCoefficients.Default);
        double round = Corner.LocalLoweringV(3, 8, 1, 5e18, CornerCoefficients.Default);
        Assert.InRange(1 - (round / sharp), 0.20, 0.30);
    }

    [Fact]
    public void ThresholdShift_Limits_MatchParallelDeviceForm()
    {
        // D.2 [D]: ΔV_T = −n v_t ln[1 + f_c(e^{ΔV_c/(n v_t)} − 1)]: 0 for f_c = 0, −ΔV_c for f_c = 1,
        // and ≈ −f_c·ΔV_c for ΔV_c ≪ n v_t.
        Assert.Equal(0, Corner.ThresholdShiftV(0, 0.1, 1));
        Assert.Equal(-0.1, Corner.ThresholdShiftV(1, 0.1, 1), 1e-15);
        Assert.Equal(-0.01 * 1e-4, Corner.ThresholdShiftV(0.01, 1e-4, 1), 1e-8);
        Assert.Equal(-1.2 * Vt * Math.Log(1 + (0.02 * (Math.Exp(0.05 / (1.2 * Vt)) - 1))), Corner.ThresholdShiftV(0.02, 0.05, 1.2), 1e-15);
    }
}
