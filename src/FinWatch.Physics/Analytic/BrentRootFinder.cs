namespace FinWatch.Physics.Analytic;

/// <summary>
/// Bracketed scalar root finding by Brent's method (R. P. Brent, <i>Algorithms for Minimization without
/// Derivatives</i>, 1973, ch. 4): inverse quadratic interpolation and secant steps, safeguarded by bisection, so
/// the bracket always shrinks and convergence is guaranteed for a continuous function with a sign change.
/// </summary>
/// <remarks>Deterministic; no allocation beyond the caller's delegate. Safe to call concurrently.</remarks>
public static class BrentRootFinder
{
    /// <summary>Default iteration cap; Brent's method needs far fewer for any double-precision bracket.</summary>
    public const int DefaultMaxIterations = 200;

    /// <summary>
    /// Finds x in [<paramref name="lower"/>, <paramref name="upper"/>] with f(x) = 0, to an absolute tolerance in x.
    /// </summary>
    /// <param name="f">The function; must be continuous on the bracket.</param>
    /// <param name="lower">One end of the bracket (either order is accepted); finite.</param>
    /// <param name="upper">The other end of the bracket; finite.</param>
    /// <param name="absoluteTolerance">Absolute tolerance on x, in the units of x; finite and &gt; 0.</param>
    /// <param name="root">The root, or NaN when the ends do not bracket a sign change or f returns NaN.</param>
    /// <param name="maxIterations">Iteration cap (&gt; 0).</param>
    /// <returns><see langword="true"/> when a root was found within the tolerance.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A bracket end or the tolerance is not finite, or the tolerance or iteration cap is ≤ 0.</exception>
    public static bool TrySolve(
        Func<double, double> f, double lower, double upper, double absoluteTolerance, out double root,
        int maxIterations = DefaultMaxIterations)
    {
        ArgumentNullException.ThrowIfNull(f);
        if (!double.IsFinite(lower) || !double.IsFinite(upper) || !double.IsFinite(absoluteTolerance))
        {
            throw new ArgumentOutOfRangeException(nameof(absoluteTolerance), "Bracket and tolerance must be finite.");
        }

        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(absoluteTolerance);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(maxIterations);

        double a = lower, b = upper;
        double fa = f(a), fb = f(b);
        root = double.NaN;
        if (double.IsNaN(fa) || double.IsNaN(fb) || (fa > 0 && fb > 0) || (fa < 0 && fb < 0))
        {
            return false;
        }

        if (fa == 0)
        {
            root = a;
            return true;
        }

        double c = b, fc = fb, d = b - a, e = d;
        for (int iter = 0; iter < maxIterations; iter++)
        {
            if ((fb > 0 && fc > 0) || (fb < 0 && fc < 0))
            {
                c = a;
                fc = fa;
                d = b - a;
                e = d;
            }

            if (Math.Abs(fc) < Math.Abs(fb))
            {
                a = b;
                b = c;
                c = a;
                fa = fb;
                fb = fc;
                fc = fa;
            }

            double tol1 = (2 * double.Epsilon) + (4e-16 * Math.Abs(b)) + (0.5 * absoluteTolerance);
            double xm = 0.5 * (c - b);
            if (Math.Abs(xm) <= tol1 || fb == 0)
            {
                root = b;
                return true;
            }

            if (Math.Abs(e) >= tol1 && Math.Abs(fa) > Math.Abs(fb))
            {
                double s = fb / fa, p, q;
                if (a == c)
                {
                    p = 2 * xm * s;
                    q = 1 - s;
                }
                else
                {
                    double qq = fa / fc, r = fb / fc;
                    p = s * ((2 * xm * qq * (qq - r)) - ((b - a) * (r - 1)));
                    q = (qq - 1) * (r - 1) * (s - 1);
                }

                if (p > 0)
                {
                    q = -q;
                }

                p = Math.Abs(p);
                double min1 = (3 * xm * q) - Math.Abs(tol1 * q);
                double min2 = Math.Abs(e * q);
                if (2 * p < Math.Min(min1, min2))
                {
                    e = d;
                    d = p / q;
                }
                else
                {
                    d = xm;
                    e = d;
                }
            }
            else
            {
                d = xm;
                e = d;
            }

            a = b;
            fa = fb;
            b += Math.Abs(d) > tol1 ? d : Math.CopySign(tol1, xm);
            fb = f(b);
            if (double.IsNaN(fb))
            {
                return false;
            }
        }

        return false;
    }
}
