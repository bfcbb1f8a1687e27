namespace FinWatch.Physics.Tests.Solver;

/// <summary>
/// Independent closed-form references for the 2-D solver tests, written from the equations in docs/model.md
/// (docs/model.md) and the textbook derivations cited beside each method. Units: nm, V, densities in nm⁻³,
/// q/ε₀ = 18.0951 V·nm (section 0).
/// </summary>
internal static class AnalyticReferences
{
    public const double ChargeOverEps0 = 18.0951;
    public const double Vt = 0.0258520;
    public const double Ni = 1e-11;
    public const double EpsSi = 11.7;
    public const double EpsOx = 3.9;

    /// <summary>
    /// Lowest wave number k of the symmetric double gate (B.2, exact lowest mode, [D]): the root of
    /// ε_Si·tan(k t_si/2)·tan(k t_ox) = ε_ox in 0 &lt; k &lt; min(π/t_si, π/(2 t_ox)), by bisection.
    /// </summary>
    public static double DoubleGateWaveNumber(double siliconNm, double oxideNm)
    {
        double lo = 0;
        double hi = Math.Min(Math.PI / siliconNm, Math.PI / (2 * oxideNm));
        for (int i = 0; i < 200; i++)
        {
            double k = 0.5 * (lo + hi);
            double f = (EpsSi * Math.Tan(k * siliconNm / 2) * Math.Tan(k * oxideNm)) - EpsOx;
            if (f > 0)
            {
                hi = k;
            }
            else
            {
                lo = k;
            }
        }

        return 0.5 * (lo + hi);
    }

    /// <summary>
    /// Separable tri-gate scale length (B.3, [D]): 1/λ² = 1/λ_W² + 1/λ_H², λ_W from t_si = W, λ_H from t_si = 2H
    /// (Neumann foot), both exact roots.
    /// </summary>
    public static double TriGateScaleLengthNm(double widthNm, double heightNm, double oxideNm)
    {
        double kw = DoubleGateWaveNumber(widthNm, oxideNm);
        double kh = DoubleGateWaveNumber(2 * heightNm, oxideNm);
        return 1 / Math.Sqrt((kw * kw) + (kh * kh));
    }

    /// <summary>
    /// Taur's undoped symmetric double-gate solution (Y. Taur, IEEE EDL 21(5) 245 (2000); equations from memory,
    /// re-derived here): ψ(x) = ψ₀ − 2v_t·ln cos(a x), a² = (q/ε₀) nᵢ e^{ψ₀/v_t}/(2 ε_Si v_t), with the gate
    /// condition V_G = ψ_s + (ε_Si t_ox/ε_ox)·2 v_t a·tan(a t_si/2). Mid-gap gate, holes neglected. Solved for
    /// β = a t_si/2 by bisection. Returns the centre potential ψ₀ in V and ∫n dx across the film in nm⁻².
    /// </summary>
    public static (double CentrePotentialV, double ElectronsPerNm2) TaurDoubleGate(double gateV, double siliconNm, double oxideNm)
    {
        double lo = 1e-14;
        double hi = (Math.PI / 2) - 1e-14;
        double psi0 = 0;
        double electrons = 0;
        for (int i = 0; i < 200; i++)
        {
            double beta = 0.5 * (lo + hi);
            double a = 2 * beta / siliconNm;
            psi0 = Vt * Math.Log(2 * EpsSi * Vt * a * a / (ChargeOverEps0 * Ni));
            double surface = psi0 - (2 * Vt * Math.Log(Math.Cos(beta)));
            double field = 2 * Vt * a * Math.Tan(beta);
            double v = surface + (EpsSi / EpsOx * oxideNm * field);
            electrons = 2 * EpsSi / ChargeOverEps0 * field;
            if (v > gateV)
            {
                hi = beta;
            }
            else
            {
                lo = beta;
            }
        }

        return (psi0, electrons);
    }

    /// <summary>
    /// Bulk potential of a neutral p-type region: nᵢe^{ψ/v_t} − nᵢe^{−ψ/v_t} + N_A = 0, solved in closed form.
    /// </summary>
    public static double BulkPotentialV(double acceptorPerNm3) =>
        -Vt * Math.Asinh(acceptorPerNm3 / (2 * Ni));

    /// <summary>
    /// Exact 1-D planar MOS surface potential for a mid-gap gate (Sze &amp; Ng, MIS chapter: first integral of the
    /// Poisson–Boltzmann equation, from memory): ½ψ′² = (q/ε_Si)[nᵢv_t(e^{ψ/v_t} − e^{ψ_b/v_t}) +
    /// nᵢv_t(e^{−ψ/v_t} − e^{−ψ_b/v_t}) + N_A(ψ − ψ_b)] and V_G = ψ_s + sgn(ψ_s − ψ_b)(ε_Si t_ox/ε_ox)|ψ′_s|.
    /// Solved for ψ_s by bisection.
    /// </summary>
    public static double PlanarSurfacePotentialV(double gateV, double acceptorPerNm3, double oxideNm)
    {
        double psiB = BulkPotentialV(acceptorPerNm3);
        double lo = psiB - 2;
        double hi = psiB + 2;
        for (int i = 0; i < 200; i++)
        {
            double s = 0.5 * (lo + hi);
            double g = (Ni * Vt * (Math.Exp(s / Vt) - Math.Exp(psiB / Vt)))
                + (Ni * Vt * (Math.Exp(-s / Vt) - Math.Exp(-psiB / Vt)))
                + (acceptorPerNm3 * (s - psiB));
            double field = Math.Sqrt(2 * ChargeOverEps0 / EpsSi * Math.Max(g, 0));
            double v = s + (Math.Sign(s - psiB) * EpsSi * oxideNm / EpsOx * field);
            if (v > gateV)
            {
                hi = s;
            }
            else
            {
                lo = s;
            }
        }

        return 0.5 * (lo + hi);
    }
}
