using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Bracketed Brent root finder (G.5: all root finds bracketed, tolerances explicit).</summary>
public sealed class BrentRootFinderTests
{
    [Fact]
    public void TrySolve_Cubic_FindsRootToTolerance()
    {
        // x³ − 2x − 5 = 0 has the real root 2.0945514815423265 (Wallis's classic test equation; value from memory [M],
        // confirmed here by the residual).
        Assert.True(BrentRootFinder.TrySolve(x => (x * x * x) - (2 * x) - 5, 2, 3, 1e-14, out double root));
        Assert.Equal(2.0945514815423265, root, 1e-12);
        Assert.Equal(0, (root * root * root) - (2 * root) - 5, 1e-12);
    }

    [Fact]
    public void TrySolve_NoSignChange_ReturnsFalseAndNaN()
    {
        Assert.False(BrentRootFinder.TrySolve(x => (x * x) + 1, -1, 1, 1e-12, out double root));
        Assert.True(double.IsNaN(root));
    }

    [Fact]
    public void TrySolve_SteepFunction_ConvergesInsideBracket()
    {
        // tan near its pole: the shape of the B.2 mode equation.
        Assert.True(BrentRootFinder.TrySolve(x => Math.Tan(x) - 100, 0, (Math.PI / 2) * (1 - 1e-12), 1e-14, out double root));
        Assert.Equal(Math.Atan(100), root, 1e-12);
    }

    [Fact]
    public void TrySolve_InvalidTolerance_Throws()
    {
        Assert.Throws<ArgumentOutOfRangeException>(() => BrentRootFinder.TrySolve(x => x, -1, 1, 0, out _));
    }
}
