using System.Numerics;
using System.Runtime.CompilerServices;
using System.Runtime.InteropServices;

namespace FinWatch.Physics.Solver;

/// <summary>
/// A symmetric positive definite band matrix and its in-place Cholesky factorisation A = L·Lᵀ (
/// docs/model.md §F.5 option 1). Only the lower band is stored: row i holds columns i − b … i, where b is the
/// half-bandwidth. The cost of <see cref="Factorize"/> is at most n·b²/2 multiply–adds; a solve costs 2·n·b.
/// </summary>
/// <remarks>
/// Algorithm: row-oriented band Cholesky (Golub &amp; Van Loan, Matrix Computations, §4.3) restricted to the row
/// envelope: L has the same first non-zero column per row as A (the envelope/skyline property, George &amp; Liu,
/// Computer Solution of Large Sparse Positive Definite Systems, ch. 4), so rows that start late — for example the
/// identity rows of eliminated Dirichlet nodes — cost nothing. Dot products are vectorised with <see cref="Vector{T}"/>.
/// An instance is not thread-safe.
/// </remarks>
public sealed class BandedCholesky
{
    private readonly double[] _band;
    private readonly int[] _first;
    private readonly int _width;

    /// <summary>Creates an n × n zero band matrix with half-bandwidth <paramref name="bandwidth"/>.</summary>
    /// <param name="order">n, the number of rows; &gt; 0.</param>
    /// <param name="bandwidth">b, the half-bandwidth (A[i, j] = 0 for |i − j| &gt; b); ≥ 0.</param>
    /// <exception cref="ArgumentOutOfRangeException">n ≤ 0, b &lt; 0, or n·(b + 1) does not fit in an array.</exception>
    public BandedCholesky(int order, int bandwidth)
    {
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(order);
        ArgumentOutOfRangeException.ThrowIfNegative(bandwidth);
        long size = (long)order * ((long)bandwidth + 1);
        ArgumentOutOfRangeException.ThrowIfGreaterThan(size, (long)Array.MaxLength, nameof(order));
        Order = order;
        Bandwidth = bandwidth;
        _width = checked(bandwidth + 1);
        _band = new double[size];
        _first = new int[order];
    }

    /// <summary>n, the number of rows and columns.</summary>
    public int Order { get; }

    /// <summary>b, the half-bandwidth.</summary>
    public int Bandwidth { get; }

    /// <summary>Whether the storage holds the factor L (after <see cref="Factorize"/>) rather than A.</summary>
    public bool IsFactorized { get; private set; }

    /// <summary>
    /// Gets or sets A[row, col] (symmetric: either triangle may be addressed). Entries outside the band read as 0.
    /// </summary>
    /// <param name="row">Row index, 0 ≤ row &lt; n.</param>
    /// <param name="col">Column index, 0 ≤ col &lt; n.</param>
    /// <exception cref="ArgumentOutOfRangeException">An index is out of range, or a set is outside the band.</exception>
    public double this[int row, int col]
    {
        get
        {
            (int r, int c) = Lower(row, col);
            return r - c > Bandwidth ? 0 : _band[Offset(r, c)];
        }

        set
        {
            (int r, int c) = Lower(row, col);
            ArgumentOutOfRangeException.ThrowIfGreaterThan(r - c, Bandwidth, nameof(col));
            _band[Offset(r, c)] = value;
            IsFactorized = false;
        }
    }

    /// <summary>Sets every entry to 0.</summary>
    public void Clear()
    {
        Array.Clear(_band);
        IsFactorized = false;
    }

    /// <summary>Copies the stored entries (matrix or factor) of another instance of the same shape.</summary>
    /// <param name="source">The matrix to copy; same order and bandwidth.</param>
    /// <exception cref="ArgumentException">The shapes differ.</exception>
    public void CopyFrom(BandedCholesky source)
    {
        if (source.Order != Order || source.Bandwidth != Bandwidth)
        {
            throw new ArgumentException("The band matrices differ in shape.", nameof(source));
        }

        source._band.AsSpan().CopyTo(_band);
        source._first.AsSpan().CopyTo(_first);
        IsFactorized = source.IsFactorized;
    }

    /// <summary>Adds <paramref name="value"/> to A[i, i].</summary>
    /// <param name="i">Row index.</param>
    /// <param name="value">Value to add.</param>
    public void AddToDiagonal(int i, double value)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(i);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(i, Order);
        _band[Offset(i, i)] += value;
        IsFactorized = false;
    }

    /// <summary>
    /// Overwrites the stored matrix with its Cholesky factor L (A = L·Lᵀ). Checks
    /// <paramref name="cancellationToken"/> every 512 rows.
    /// </summary>
    /// <param name="cancellationToken">Cancels the factorisation.</param>
    /// <exception cref="InvalidOperationException">Already factorised, or a pivot is ≤ 0 (A is not positive definite).</exception>
    /// <exception cref="OperationCanceledException">Cancellation was requested.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void Factorize(CancellationToken cancellationToken = default)
    {
        if (IsFactorized)
        {
            throw new InvalidOperationException("The matrix is already factorised.");
        }

        Span<double> a = _band;
        int b = Bandwidth;
        for (int i = 0; i < Order; i++)
        {
            int rowI = i * _width;
            int first = i;
            for (int j = Math.Max(0, i - b); j < i; j++)
            {
                if (a[rowI + j - i + b] != 0)
                {
                    first = j;
                    break;
                }
            }

            _first[i] = first;
        }

        for (int i = 0; i < Order; i++)
        {
            if ((i & 511) == 0)
            {
                cancellationToken.ThrowIfCancellationRequested();
            }

            int rowI = i * _width;
            int firstI = _first[i];
            for (int j = firstI; j <= i; j++)
            {
                int rowJ = j * _width;
                int kMin = Math.Max(firstI, _first[j]);
                int len = j - kMin;
                double s = a[rowI + j - i + b];
                if (len > 0)
                {
                    s -= Dot(a.Slice(rowI + kMin - i + b, len), a.Slice(rowJ + kMin - j + b, len));
                }

                if (j < i)
                {
                    a[rowI + j - i + b] = s / a[rowJ + b];
                }
                else
                {
                    if (!(s > 0))
                    {
                        throw new InvalidOperationException(
                            $"The matrix is not positive definite (pivot {s:G6} at row {i}).");
                    }

                    a[rowI + b] = Math.Sqrt(s);
                }
            }
        }

        IsFactorized = true;
    }

    /// <summary>Solves A·x = rhs in place using the factor (forward then backward substitution).</summary>
    /// <param name="rhs">On entry the right-hand side, on exit the solution; length n.</param>
    /// <exception cref="InvalidOperationException">Not factorised.</exception>
    /// <exception cref="ArgumentException">Wrong length.</exception>
    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    public void SolveInPlace(Span<double> rhs)
    {
        if (!IsFactorized)
        {
            throw new InvalidOperationException("Factorize must be called before SolveInPlace.");
        }

        if (rhs.Length != Order)
        {
            throw new ArgumentException("The right-hand side has the wrong length.", nameof(rhs));
        }

        ReadOnlySpan<double> a = _band;
        int b = Bandwidth;

        // Forward: L·y = rhs.
        for (int i = 0; i < Order; i++)
        {
            int jMin = _first[i];
            int rowI = i * _width;
            int len = i - jMin;
            double s = rhs[i];
            if (len > 0)
            {
                s -= Dot(a.Slice(rowI + jMin - i + b, len), rhs.Slice(jMin, len));
            }

            rhs[i] = s / a[rowI + b];
        }

        // Backward: Lᵀ·x = y, column-oriented so that row i of L is read contiguously.
        for (int i = Order - 1; i >= 0; i--)
        {
            int rowI = i * _width;
            double xi = rhs[i] / a[rowI + b];
            rhs[i] = xi;
            int jMin = _first[i];
            for (int k = jMin; k < i; k++)
            {
                rhs[k] -= a[rowI + k - i + b] * xi;
            }
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveOptimization)]
    private static double Dot(ReadOnlySpan<double> x, ReadOnlySpan<double> y)
    {
        int n = x.Length;
        int i = 0;
        double sum = 0;
        if (Vector.IsHardwareAccelerated && n >= Vector<double>.Count * 2)
        {
            ReadOnlySpan<Vector<double>> vx = MemoryMarshal.Cast<double, Vector<double>>(x);
            ReadOnlySpan<Vector<double>> vy = MemoryMarshal.Cast<double, Vector<double>>(y);
            Vector<double> acc = Vector<double>.Zero;
            for (int v = 0; v < vx.Length; v++)
            {
                acc += vx[v] * vy[v];
            }

            sum = Vector.Sum(acc);
            i = vx.Length * Vector<double>.Count;
        }

        for (; i < n; i++)
        {
            sum += x[i] * y[i];
        }

        return sum;
    }

    private (int Row, int Col) Lower(int row, int col)
    {
        ArgumentOutOfRangeException.ThrowIfNegative(row);
        ArgumentOutOfRangeException.ThrowIfNegative(col);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(row, Order);
        ArgumentOutOfRangeException.ThrowIfGreaterThanOrEqual(col, Order);
        return row >= col ? (row, col) : (col, row);
    }

    private int Offset(int row, int col) => (row * _width) + col - row + Bandwidth;
}
