using MathNet.Numerics.Integration;

namespace FinWatch.Statistics.Constants;

/// <summary>
/// d2(n) = E[R]/sigma and d3(n) = sd(R)/sigma for the range R of n standard normal values, computed by
/// composite Gauss–Legendre quadrature for every n in one pass (docs/statistics.md §1.2).
/// </summary>
/// <remarks>
/// <para>d2 (Tippett 1925): d2 = ∫ [1 − Φ(x)ⁿ − (1 − Φ(x))ⁿ] dx = 2∫₀^∞ [...] dx because the integrand is
/// even; 1 − Φⁿ is evaluated as −expm1(n·log Φ) with log Φ = log1p(−Q) to keep the tail precision.
/// The range [0, 10] is enough: the integrand is below 25·Q(10) ≈ 2e-22 beyond it.</para>
/// <para>d3 by the range-density route of docs/statistics.md §1.2: f_R(w) = n(n−1)∫φ(x)φ(x+w)[Φ(x+w) − Φ(x)]ⁿ⁻² dx and
/// d3² = ∫ (w − d2)² f_R(w) dw (centred about d2, so there is no E[R²] − d2² cancellation). With
/// x = v − w/2 the product φ(x)φ(x+w) is exp(−v² − w²/4)/(2π) and the bracket is even in v, so the inner
/// integral is 2∫₀^7 (exp(−49) ≈ 5e-22), and the outer one is cut at w = 16 (exp(−64) ≈ 2e-28).
/// The node values do not depend on n, so [·]ⁿ⁻² is built up by repeated multiplication across n.</para>
/// <para>Panels of 20-point rules; against a run with twice the panels and 30-point rules the results
/// agree to about 1e-14 (d2) and 2e-14 (d3); the closed forms for n = 2, 3 are met to 5e-16 (d2) and
/// 5e-15 (d3), and a second route for d3 (the E[R²] double integral, in the tests) to 1e-12.</para>
/// </remarks>
internal static class RangeMoments
{
    private const int Order = 20;

    /// <summary>Computes d2 and d3 for n = 2..<paramref name="maxN"/>; index the arrays by n.</summary>
    public static (double[] D2, double[] D3) Compute(int maxN)
    {
        var d2 = new double[maxN + 1];
        var d3 = new double[maxN + 1];

        // d2: 2 ∫₀^10 [1 − Φⁿ − Φ(−x)ⁿ] dx.
        var (xs, wxs) = CompositeRule(0.0, 10.0, panels: 10);
        for (var i = 0; i < xs.Length; i++)
        {
            var q = ElementaryFunctions.NormalUpperTail(xs[i]);
            var logP = ElementaryFunctions.Log1P(-q);
            var logQ = Math.Log(q);
            for (var n = 2; n <= maxN; n++)
            {
                var integrand = -ElementaryFunctions.ExpM1(n * logP) - Math.Exp(n * logQ);
                d2[n] += 2.0 * wxs[i] * integrand;
            }
        }

        // d3² = ∫₀^16 (w − d2)² f_R(w) dw, f_R(w) = n(n−1) · 2∫₀^7 exp(−v² − w²/4)/(2π) · Pⁿ⁻² dv.
        var (ws, wws) = CompositeRule(0.0, 16.0, panels: 8);
        var (vs, wvs) = CompositeRule(0.0, 7.0, panels: 4);
        for (var j = 0; j < ws.Length; j++)
        {
            var w = ws[j];
            var half = 0.5 * w;
            for (var k = 0; k < vs.Length; k++)
            {
                var v = vs[k];

                // P = Φ(v + w/2) − Φ(v − w/2), formed from upper tails so that it is accurate near 0 and 1.
                var p = v >= half
                    ? ElementaryFunctions.NormalUpperTail(v - half) - ElementaryFunctions.NormalUpperTail(v + half)
                    : 1.0 - ElementaryFunctions.NormalUpperTail(half - v) - ElementaryFunctions.NormalUpperTail(v + half);
                var weight = wws[j] * wvs[k] * 2.0 * Math.Exp(-(v * v) - (half * half)) / (2.0 * Math.PI);
                var power = 1.0;
                for (var n = 2; n <= maxN; n++)
                {
                    var dev = w - d2[n];
                    d3[n] += weight * n * (n - 1) * power * dev * dev;
                    power *= p;
                }
            }
        }

        for (var n = 2; n <= maxN; n++)
        {
            d3[n] = Math.Sqrt(d3[n]);
        }

        return (d2, d3);
    }

    private static (double[] Nodes, double[] Weights) CompositeRule(double a, double b, int panels)
    {
        var h = (b - a) / panels;
        var rule = new GaussLegendreRule(0.0, h, Order);
        var nodes = new double[panels * Order];
        var weights = new double[panels * Order];
        for (var p = 0; p < panels; p++)
        {
            for (var i = 0; i < Order; i++)
            {
                nodes[(p * Order) + i] = a + (p * h) + rule.Abscissas[i];
                weights[(p * Order) + i] = rule.Weights[i];
            }
        }

        return (nodes, weights);
    }
}
