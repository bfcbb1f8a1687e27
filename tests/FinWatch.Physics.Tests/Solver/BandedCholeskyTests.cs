using FinWatch.Physics.Solver;

namespace FinWatch.Physics.Tests.Solver;

/// <summary>The banded Cholesky of F.5 (option 1) against a dense reference product.</summary>
public sealed class BandedCholeskyTests
{
    [Theory]
    [InlineData(1, 0)]
    [InlineData(7, 1)]
    [InlineData(40, 5)]
    [InlineData(61, 12)]
    public void SolveInPlace_RandomSpdBandMatrix_ReproducesRightHandSide(int n, int b)
    {
        // Source: definition of the solve; A is made SPD by diagonal dominance, x is random (seeded). Every third
        // row has no entries left of the diagonal, so the envelope (late-starting rows) is exercised too.
        var random = new Random(1234 + n);
        var a = new BandedCholesky(n, b);
        var dense = new double[n, n];
        for (int i = 0; i < n; i++)
        {
            double rowSum = 0;
            for (int j = i % 3 == 0 ? i : Math.Max(0, i - b); j < i; j++)
            {
                double v = random.NextDouble() - 0.5;
                a[i, j] = v;
                dense[i, j] = v;
                dense[j, i] = v;
            }

            for (int j = Math.Max(0, i - b); j <= Math.Min(n - 1, i + b); j++)
            {
                rowSum += j == i ? 0 : 0.5;
            }

            a[i, i] = rowSum + 1;
            dense[i, i] = rowSum + 1;
        }

        var x = new double[n];
        for (int i = 0; i < n; i++)
        {
            x[i] = random.NextDouble() - 0.5;
        }

        var rhs = new double[n];
        for (int i = 0; i < n; i++)
        {
            for (int j = 0; j < n; j++)
            {
                rhs[i] += dense[i, j] * x[j];
            }
        }

        a.Factorize();
        a.SolveInPlace(rhs);

        for (int i = 0; i < n; i++)
        {
            Assert.Equal(x[i], rhs[i], 1e-12);
        }
    }

    [Fact]
    public void Factorize_IndefiniteMatrix_Throws()
    {
        // Source: Cholesky exists only for positive definite matrices; [[1, 2], [2, 1]] has eigenvalues 3 and −1.
        var a = new BandedCholesky(2, 1);
        a[0, 0] = 1;
        a[1, 0] = 2;
        a[1, 1] = 1;
        Assert.Throws<InvalidOperationException>(() => a.Factorize());
    }

    [Fact]
    public void Indexer_OutsideBand_ThrowsOnSetAndReadsZero()
    {
        // Source: band storage contract (only |i − j| ≤ b is stored).
        var a = new BandedCholesky(5, 1);
        Assert.Equal(0, a[4, 0]);
        Assert.Throws<ArgumentOutOfRangeException>(() => a[4, 0] = 1);
    }

    [Fact]
    public void Factorize_Cancelled_ThrowsOperationCanceled()
    {
        // Source: F.5 / task brief — cancellation is checked inside the factorisation.
        var a = new BandedCholesky(1000, 2);
        for (int i = 0; i < 1000; i++)
        {
            a[i, i] = 4;
        }

        using var cts = new CancellationTokenSource();
        cts.Cancel();
        Assert.Throws<OperationCanceledException>(() => a.Factorize(cts.Token));
    }
}
