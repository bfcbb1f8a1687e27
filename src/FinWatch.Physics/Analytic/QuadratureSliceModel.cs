namespace FinWatch.Physics.Analytic;

/// <summary>
/// The slice model of E.1–E.4 (<see cref="SliceModel.Evaluate(SliceModelInput)"/>) with the slice sum
/// (1/N_s)·Σ_i exp((V − V_T,i)/(n_i v_t)) replaced by Gauss–Legendre quadrature of the same integrand over the height,
/// (1/H)∫₀^H exp((V − V_T(z))/(n(z) v_t)) dz. For straight sidewalls V_T(z) and n(z) are smooth in z, and the 200–400
/// midpoint slices of E.1 are a midpoint rule for this integral; the quantities that E.1–E.4 take from individual
/// slices (the widest slice's L/λ, the top slice's V_T and n for the corner device) are evaluated at those slices.
/// </summary>
/// <remarks>
/// Same physics per node as per slice: exact λ roots (B.2–B.3; safeguarded Newton instead of Brent, same root), V_T,long
/// with W_eff (E.1; exact power series of the Dawson integral instead of panel quadrature), κ_QC·ΔV_T,QC (C.3 DOS form),
/// ΔV_T,SCE and n from B.5 in closed form (<see cref="ShortChannel.ThresholdClosedForm(double, double, double, double)"/>), and E.2's root by safeguarded
/// Newton. Agrees with the 200-slice sum within 1e-5 V over the H.1 ranges (tests). No allocation beyond the input record.
/// </remarks>
public static class QuadratureSliceModel
{
    /// <summary>Gauss–Legendre nodes per panel (8 × 1 panel: within 1e-3 mV of 16 or 32 nodes over H.1).</summary>
    public const int NodesPerPanel = 8;

    /// <summary>Equal panels over the height.</summary>
    public const int Panels = 1;

    private const int NodeCount = NodesPerPanel * Panels;

    private static readonly double[] UnitNodes = new double[NodesPerPanel];
    private static readonly double[] UnitWeights = new double[NodesPerPanel];

    static QuadratureSliceModel()
    {
        // Nodes and weights of the n-point rule on [−1, 1]: Newton on the Legendre polynomial P_n (Numerical Recipes gauleg).
        int n = NodesPerPanel;
        for (int i = 0; i < (n + 1) / 2; i++)
        {
            double x = Math.Cos(Math.PI * (i + 0.75) / (n + 0.5)), dp = 0;
            for (int iteration = 0; iteration < 100; iteration++)
            {
                double p0 = 1, p1 = 0;
                for (int j = 0; j < n; j++)
                {
                    double p2 = p1;
                    p1 = p0;
                    p0 = (((2 * j) + 1) * x * p1 - (j * p2)) / (j + 1);
                }

                dp = n * ((x * p0) - p1) / ((x * x) - 1);
                double step = p0 / dp;
                x -= step;
                if (Math.Abs(step) < 1e-16)
                {
                    break;
                }
            }

            UnitNodes[i] = -x;
            UnitNodes[n - 1 - i] = x;
            UnitWeights[i] = UnitWeights[n - 1 - i] = 2 / ((1 - (x * x)) * dp * dp);
        }
    }

    /// <summary>
    /// Evaluates the fin as <see cref="SliceModel.Evaluate(SliceModelInput)"/> does (same inputs, validation, exceptions
    /// and result fields), with the slice sum as Gauss–Legendre quadrature over the height (see the type remarks).
    /// </summary>
    /// <param name="input">The fin and calibration inputs; <see cref="SliceModelInput.SliceCount"/> fixes the end slices.</param>
    /// <returns>Absolute thresholds, swings and DIBL; NaN values with <see cref="SliceModelResult.PunchThrough"/> when the barrier is gone.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An input is out of its stated range.</exception>
    public static SliceModelResult Evaluate(SliceModelInput input) => Evaluate(input, null);

    /// <summary>
    /// As <see cref="Evaluate(SliceModelInput)"/>, taking λ_W(w) and the long-channel threshold at width w from
    /// <paramref name="table"/> when it was built for the input's EOT, doping, n_s,crit, κ_QC and surface and w lies in
    /// its range (within 1e-7 V of the direct values over H.1, tests); otherwise each node is computed directly.
    /// </summary>
    /// <param name="input">The fin and calibration inputs.</param>
    /// <param name="table">A table from <see cref="BuildWidthTable"/>, or null.</param>
    /// <returns>Absolute thresholds, swings and DIBL; NaN values with <see cref="SliceModelResult.PunchThrough"/> when the barrier is gone.</returns>
    /// <exception cref="ArgumentOutOfRangeException">An input is out of its stated range.</exception>
    public static SliceModelResult Evaluate(SliceModelInput input, WidthTable? table)
    {
        ArgumentNullException.ThrowIfNull(input);
        SliceModel.ValidateInput(input);
        FinProfile p = input.Profile;
        int ns = input.SliceCount;
        FinGeometry geometry = FinCrossSection.Derive(p, input.Faces);
        double fc = input.Faces == GateFaces.TriGate
            ? Corner.CurrentFraction(input.CornerCoefficients.CornerWidthNm, geometry.GatedPerimeterNm, input.Faces)
            : 0;

        double h = p.HeightNm, dz = h / ns;
        double wBottom = FinCrossSection.LocalWidthNm(p, 0.5 * dz), wTop = FinCrossSection.LocalWidthNm(p, h - (0.5 * dz));
        if (!(wBottom > 0) || !(wTop > 0))
        {
            throw new ArgumentOutOfRangeException(nameof(input), "The straight-sidewall width must stay positive.");
        }

        var ctx = new Context(input, table is not null && table.Matches(input) ? table : null);
        var guess = new Guess(double.NaN, double.NaN, double.NaN, double.NaN);

        // The end slices of E.1: the widest one gives min L/λ (λ grows with w, w is linear in z); the top one feeds E.4.
        Node top = ctx.At(wTop, ref guess);
        Node bottom = ctx.At(wBottom, ref guess);
        double minRatio = Math.Min(bottom.Ratio, top.Ratio);
        bool punch = bottom.Punch || top.Punch;

        Span<double> vLo = stackalloc double[NodeCount + 1], vHi = stackalloc double[NodeCount + 1];
        Span<double> nLo = stackalloc double[NodeCount + 1], nHi = stackalloc double[NodeCount + 1], g = stackalloc double[NodeCount + 1];
        double panel = h / Panels;
        for (int k = 0; k < NodeCount && !punch; k++)
        {
            int pi = k / NodesPerPanel, j = k % NodesPerPanel;
            double z = (pi + 0.5 + (0.5 * UnitNodes[j])) * panel;
            double w = p.BottomWidthNm + ((p.TopWidthNm - p.BottomWidthNm) * (z / h));
            Node node = ctx.At(w, ref guess);
            punch |= node.Punch;
            minRatio = Math.Min(minRatio, node.Ratio);
            vLo[k] = node.VtLo;
            vHi[k] = node.VtHi;
            nLo[k] = node.NLo;
            nHi[k] = node.NHi;
            g[k] = (1 - fc) * 0.5 * UnitWeights[j] / Panels;
        }

        if (punch)
        {
            return new SliceModelResult(double.NaN, double.NaN, double.NaN, double.NaN, double.NaN, minRatio, fc, true);
        }

        int count = NodeCount;
        if (fc > 0)
        {
            double dvc = Corner.LocalLoweringV(
                geometry.CornerRadiusUsedNm, p.TopWidthNm, input.EotNm, input.DopingPerCm3, input.CornerCoefficients);
            vLo[count] = top.VtLo - dvc;
            vHi[count] = top.VtHi - dvc;
            nLo[count] = top.NLo;
            nHi[count] = top.NHi;
            g[count] = fc;
            count++;
        }

        (double vEffLo, double sLo) = Solve(vLo[..count], nLo[..count], g[..count]);
        (double vEffHi, double sHi) = Solve(vHi[..count], nHi[..count], g[..count]);
        double dibl = -(vEffHi - vEffLo) / (input.DrainVoltageHighV - input.DrainVoltageLowV);
        return new SliceModelResult(vEffLo, vEffHi, sLo, sHi, dibl, minRatio, fc, false);
    }

    /// <summary>
    /// W_eff of E.1 by the exact series ∫_{−h}^{h} e^{−a(h² − x²)} dx = 2h·Σ_{k≥0} (−2ah²)^k/(2k + 1)!! (the Dawson
    /// integral, 2F(√a h)/√a), in nm; equals <see cref="SliceModel.EffectiveWidthNm"/> to quadrature rounding.
    /// </summary>
    /// <param name="widthNm">w in nm; finite and &gt; 0.</param>
    /// <param name="aPerNm2">a = q N_A/(2 ε_Si v_t) in nm⁻²; finite and ≥ 0 (≤ ≈ 0.03 for N_A ≤ 1e18).</param>
    /// <returns>W_eff in nm.</returns>
    public static double EffectiveWidthSeriesNm(double widthNm, double aPerNm2)
    {
        double half = 0.5 * widthNm, y = 2 * aPerNm2 * half * half;
        if (y == 0)
        {
            return widthNm;
        }

        if (y > 20)
        {
            // Alternating series loses digits for large arguments; those are far outside H.1, so use the reference quadrature.
            return 2 * Quadrature.GaussLegendre(x => Math.Exp(-aPerNm2 * ((half * half) - (x * x))), 0, half, 4);
        }

        double term = 1, sum = 1;
        for (int k = 1; k < 200; k++)
        {
            term *= -y / ((2 * k) + 1);
            sum += term;
            if (Math.Abs(term) < 1e-17 * sum)
            {
                break;
            }
        }

        return widthNm * sum;
    }

    /// <summary>Σ g_k exp((V − V_k)/(n_k v_t)) = 1 (E.2) by safeguarded Newton on its log, and S_eff there (E.3).</summary>
    private static (double Threshold, double Swing) Solve(ReadOnlySpan<double> vt, ReadOnlySpan<double> n, ReadOnlySpan<double> g)
    {
        double t = PhysicalConstants.ThermalVoltageV;
        double lo = double.PositiveInfinity, hi = double.NegativeInfinity;
        for (int k = 0; k < vt.Length; k++)
        {
            lo = Math.Min(lo, vt[k]);
            hi = Math.Max(hi, vt[k]);
        }

        lo -= 1e-9;
        hi += 1e-9;

        // F(V) = ln Σ g e^{(V − V_k)/(n_k v_t)} is convex and increasing; start from the right end and step with Newton.
        double v = hi, total = 0, inverse = 0;
        for (int iteration = 0; iteration < 100; iteration++)
        {
            double max = double.NegativeInfinity;
            for (int k = 0; k < vt.Length; k++)
            {
                max = Math.Max(max, (v - vt[k]) / (n[k] * t));
            }

            total = 0;
            inverse = 0;
            for (int k = 0; k < vt.Length; k++)
            {
                double current = g[k] * Math.Exp(((v - vt[k]) / (n[k] * t)) - max);
                total += current;
                inverse += current / (n[k] * t);
            }

            double f = max + Math.Log(total);
            double step = f * total / inverse;
            if (f > 0)
            {
                hi = v;
            }
            else
            {
                lo = v;
            }

            if (Math.Abs(step) < 1e-13)
            {
                v -= step;
                break;
            }

            double next = v - step;
            v = next > lo && next < hi ? next : 0.5 * (lo + hi);
        }

        // Shares at the root for S_eff = ln 10·Σ I/Σ I/(n v_t).
        total = 0;
        inverse = 0;
        for (int k = 0; k < vt.Length; k++)
        {
            double current = g[k] * Math.Exp((v - vt[k]) / (n[k] * t));
            total += current;
            inverse += current / (n[k] * t);
        }

        return (v, Math.Log(10) * total / inverse);
    }

    /// <summary>Exact lowest double-gate mode (B.2) by Newton on ε_Si tan x tan(rx) = ε_ox, x = k t_si/2, kept in its bracket.</summary>
    private static double DoubleGateNm(double tsi, double tox, double guessNm)
    {
        const double EpsSi = PhysicalConstants.SiliconRelativePermittivity, EpsOx = PhysicalConstants.OxideRelativePermittivity;
        double xMax = Math.Min(Math.PI / 2, Math.PI * tsi / (4 * tox));
        double ratio = 2 * tox / tsi, upper = xMax * (1 - 1e-12);
        double lo = 0, hi = upper;
        double x = double.IsFinite(guessNm) && guessNm > 0
            ? tsi / (2 * guessNm)
            : tsi / (2 * ScaleLength.DoubleGateSuzukiNm(tsi, tox));
        if (!(x > lo && x < hi))
        {
            x = 0.5 * hi;
        }

        for (int iteration = 0; iteration < 200; iteration++)
        {
            double t1 = Math.Tan(x), t2 = Math.Tan(x * ratio);
            double f = (EpsSi * t1 * t2) - EpsOx;
            if (f > 0)
            {
                hi = x;
            }
            else
            {
                lo = x;
            }

            double df = EpsSi * (((1 + (t1 * t1)) * t2) + (ratio * t1 * (1 + (t2 * t2))));
            double step = f / df;
            if (Math.Abs(step) <= 1e-14 * xMax)
            {
                x -= step;
                break;
            }

            double next = x - step;
            x = next > lo && next < hi ? next : 0.5 * (lo + hi);
        }

        return tsi / (2 * x);
    }

    /// <summary>
    /// Σ_{j≥1} exp(−j² x) (the C.3 subband sum) to double precision: directly for x &gt; 1, and for x ≤ 1 by the exact
    /// Jacobi theta identity Σ_{j≥1} e^{−j²x} = ½[√(π/x)(1 + 2Σ_{k≥1} e^{−π²k²/x}) − 1], whose terms beyond k = 2 are below 1e-17.
    /// </summary>
    /// <param name="x">E₁/kT; finite and &gt; 0.</param>
    /// <returns>The sum.</returns>
    public static double SubbandSum(double x)
    {
        if (x <= 1)
        {
            double q = Math.Exp(-Math.PI * Math.PI / x);
            return 0.5 * ((Math.Sqrt(Math.PI / x) * (1 + (2 * q) + (2 * q * q * q * q))) - 1);
        }

        double sum = 0;
        for (int j = 1; j < 64; j++)
        {
            double term = Math.Exp(-(double)j * j * x);
            sum += term;
            if (term < 1e-17 * sum)
            {
                break;
            }
        }

        return sum;
    }

    /// <summary>
    /// Tabulates λ_W(w) and the long-channel threshold at width w (the parts of a node that depend on the width alone)
    /// for the input's EOT, doping, n_s,crit, κ_QC and surface, on a uniform grid of <paramref name="stepNm"/> over
    /// [<paramref name="minWidthNm"/>, <paramref name="maxWidthNm"/>]. Building takes about a millisecond.
    /// </summary>
    /// <param name="input">Any input with the constants the table is for (profile, length and drain voltages are not used).</param>
    /// <param name="minWidthNm">Smallest tabulated width, nm; &gt; 0.</param>
    /// <param name="maxWidthNm">Largest tabulated width, nm; &gt; <paramref name="minWidthNm"/>.</param>
    /// <param name="stepNm">Grid step, nm; default 0.01 (cubic interpolation error ≈ 1e-9 V).</param>
    /// <returns>The table.</returns>
    public static WidthTable BuildWidthTable(SliceModelInput input, double minWidthNm = 1, double maxWidthNm = 40, double stepNm = 0.01)
    {
        ArgumentNullException.ThrowIfNull(input);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(minWidthNm);
        ArgumentOutOfRangeException.ThrowIfLessThanOrEqual(maxWidthNm, minWidthNm);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(stepNm);
        var ctx = new Context(input);
        int n = (int)Math.Ceiling((maxWidthNm - minWidthNm) / stepNm) + 1;
        var lambdas = new double[n];
        var baseVts = new double[n];
        double guess = double.NaN;
        for (int i = 0; i < n; i++)
        {
            (lambdas[i], baseVts[i]) = ctx.Direct(minWidthNm + (i * stepNm), guess);
            guess = lambdas[i];
        }

        // λ of the top gate's film 2H (B.3) is the same root at film thicknesses 2·(15–300) nm: a coarser second grid.
        const double filmMin = 30, filmStep = 0.05;
        int m = (int)Math.Ceiling((600 - filmMin) / filmStep) + 1;
        var films = new double[m];
        guess = double.NaN;
        for (int i = 0; i < m; i++)
        {
            films[i] = ctx.Lambda(filmMin + (i * filmStep), guess);
            guess = films[i];
        }

        return new WidthTable(input, minWidthNm, stepNm, lambdas, baseVts, filmMin, filmStep, films);
    }

    private readonly record struct Guess(double W, double Lambda, double WPrev, double LambdaPrev);

    private readonly record struct Node(double VtLo, double VtHi, double NLo, double NHi, double Ratio, bool Punch);

    /// <summary>Per-fin constants and the per-width slice physics of E.1 (one "slice" at a given width).</summary>
    private readonly struct Context
    {
        private readonly double _eot, _length, _doping, _barrier, _vdsLo, _vdsHi, _lambdaH, _a, _phiConst, _qcMult;
        private readonly double _x0, _x1, _c0, _c1, _nClPerNm;
        private readonly WidthTable? _table;

        public Context(SliceModelInput input, WidthTable? table = null)
        {
            _table = table;
            _eot = input.EotNm;
            _length = input.GateLengthNm;
            _doping = input.DopingPerCm3;
            _barrier = input.BarrierHeightV;
            _vdsLo = input.DrainVoltageLowV;
            _vdsHi = input.DrainVoltageHighV;
            ReadOnlySpan<ValleySet> sets = QuantumConfinement.ValleySets(input.Surface);
            double kT = PhysicalConstants.BoltzmannJPerK * PhysicalConstants.TemperatureK;
            double kTeV = kT / PhysicalConstants.ElementaryChargeC, hbar = PhysicalConstants.ReducedPlanckJs;
            _x0 = QuantumConfinement.GroundStateEnergyEv(1, sets[0].ConfinementMassRatio) / kTeV;
            _x1 = QuantumConfinement.GroundStateEnergyEv(1, sets[1].ConfinementMassRatio) / kTeV;
            _c0 = sets[0].Degeneracy * (sets[0].DensityOfStatesMassRatio * PhysicalConstants.ElectronMassKg * kT / (Math.PI * hbar * hbar));
            _c1 = sets[1].Degeneracy * (sets[1].DensityOfStatesMassRatio * PhysicalConstants.ElectronMassKg * kT / (Math.PI * hbar * hbar));
            _nClPerNm = 1e-9 * QuantumConfinement.BulkEffectiveDensityPerM3;
            _qcMult = input.QcMultiplier;
            _lambdaH = input.Faces != GateFaces.TriGate ? double.PositiveInfinity
                : table is not null && table.TryInterpolateFilm(2 * input.Profile.HeightNm, out double tabled) ? tabled
                : DoubleGateNm(2 * input.Profile.HeightNm, input.EotNm, double.NaN);
            _a = PhysicalConstants.ElementaryChargeC * input.DopingPerCm3
                / (2 * PhysicalConstants.SiliconPermittivityFPerCm * PhysicalConstants.ThermalVoltageV) * 1e-14;
            _phiConst = 2 * input.CriticalSheetDensityPerCm2 / PhysicalConstants.IntrinsicDensityPerCm3;
        }

        /// <summary>κ_QC·ΔV_T,QC (C.3 DOS form), as <see cref="QuantumConfinement.DensityOfStatesShiftV"/> with per-surface constants.</summary>
        private double QcShiftV(double w)
        {
            double inv = 1 / (w * w);
            double nQm = (_c0 * SubbandSum(_x0 * inv)) + (_c1 * SubbandSum(_x1 * inv));
            return _qcMult * PhysicalConstants.ThermalVoltageV * Math.Log(w * _nClPerNm / nQm);
        }

        /// <summary>λ_W(w) by its exact root, and the long-channel threshold φ + depletion + κ_QC·ΔV_T,QC at width w (E.1).</summary>
        public (double LambdaW, double BaseVt) Direct(double w, double guessLambda) => (Lambda(w, guessLambda), LongChannelV(w));

        /// <summary>The exact double-gate λ of a film <paramref name="t"/> nm thick with this EOT (B.2).</summary>
        public double Lambda(double t, double guessLambda) => DoubleGateNm(t, _eot, guessLambda);

        private double LongChannelV(double w)
        {
            double weffCm = EffectiveWidthSeriesNm(w, _a) * PhysicalConstants.CmPerNm;
            double phi = PhysicalConstants.ThermalVoltageV * Math.Log(_phiConst / weffCm);
            return phi + SliceModel.DepletionTermV(w, _eot, _doping) + QcShiftV(w);
        }

        public Node At(double w, ref Guess guess)
        {
            if (_table is not null && _table.TryInterpolate(w, out double tableLambdaW, out double tableBaseVt))
            {
                return Finish(tableLambdaW, tableBaseVt);
            }

            // Start Newton from the previous nodes' λ_W, extrapolated linearly in w when two are known.
            double start = double.IsFinite(guess.LambdaPrev) && guess.WPrev != guess.W
                ? guess.Lambda + ((w - guess.W) * (guess.Lambda - guess.LambdaPrev) / (guess.W - guess.WPrev))
                : guess.Lambda;
            double lambdaW = DoubleGateNm(w, _eot, start);
            guess = new Guess(w, lambdaW, guess.W, guess.Lambda);
            return Finish(lambdaW, LongChannelV(w));
        }

        // The height-dependent and drain-dependent rest of a node: λ with the top gate (B.3), L/λ and the B.5 roll-off.
        private Node Finish(double lambdaW, double baseVt)
        {
            double lambda = double.IsPositiveInfinity(_lambdaH) ? lambdaW : ScaleLength.CombineNm(lambdaW, _lambdaH);
            double ratio = _length / lambda;
            bool usable = ratio > 0.05 && ratio <= 700;
            double sh2 = usable ? Math.Sinh(0.5 * ratio) : double.NaN, ch2 = usable ? Math.Sqrt(1 + (sh2 * sh2)) : double.NaN;
            ShortChannelThreshold lo = ShortChannel.ThresholdClosedForm(_barrier, _vdsLo, ratio, 1, sh2, ch2);
            ShortChannelThreshold hi = ShortChannel.ThresholdClosedForm(_barrier, _vdsHi, ratio, 1, sh2, ch2);
            return new Node(baseVt + lo.ShiftV, baseVt + hi.ShiftV, 1 / lo.BarrierSlope, 1 / hi.BarrierSlope, ratio, lo.PunchThrough || hi.PunchThrough);
        }
    }
}
