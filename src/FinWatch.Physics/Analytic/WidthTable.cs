namespace FinWatch.Physics.Analytic;

/// <summary>
/// λ_W(w) and the long-channel threshold V_T,long(w) + κ_QC·ΔV_T,QC(w) of E.1 on a uniform width grid, interpolated by
/// four-point (cubic) Lagrange interpolation. Both are smooth in w, so on a 0.01 nm grid the interpolation error is
/// about 1e-9 V, far below the quadrature's own 1e-5 V agreement with the slice sum. Made by
/// <see cref="QuadratureSliceModel.BuildWidthTable"/>; immutable and safe to share between threads.
/// </summary>
public sealed class WidthTable
{
    private readonly double _eot, _doping, _sheet, _qc, _min, _step;
    private readonly ConfinementSurface _surface;
    private readonly double[] _lambda, _baseVt, _film;
    private readonly double _filmMin, _filmStep;

    internal WidthTable(SliceModelInput input, double minWidthNm, double stepNm, double[] lambdaW, double[] baseVt,
        double filmMinNm, double filmStepNm, double[] lambdaFilm)
    {
        _filmMin = filmMinNm;
        _filmStep = filmStepNm;
        _film = lambdaFilm;
        _eot = input.EotNm;
        _doping = input.DopingPerCm3;
        _sheet = input.CriticalSheetDensityPerCm2;
        _qc = input.QcMultiplier;
        _surface = input.Surface;
        _min = minWidthNm;
        _step = stepNm;
        _lambda = lambdaW;
        _baseVt = baseVt;
    }

    /// <summary>Tabulated widths, nm.</summary>
    public double MinWidthNm => _min;

    /// <summary>Largest tabulated width, nm.</summary>
    public double MaxWidthNm => _min + ((_lambda.Length - 1) * _step);

    /// <summary>True when the table was built for the input's EOT, doping, n_s,crit, κ_QC and surface.</summary>
    public bool Matches(SliceModelInput input)
    {
        ArgumentNullException.ThrowIfNull(input);
        return input.EotNm == _eot && input.DopingPerCm3 == _doping && input.CriticalSheetDensityPerCm2 == _sheet
            && input.QcMultiplier == _qc && input.Surface == _surface;
    }

    /// <summary>Interpolated λ_W (nm) and long-channel threshold (V) at <paramref name="widthNm"/>; false outside the inner grid.</summary>
    public bool TryInterpolate(double widthNm, out double lambdaWNm, out double baseVtV)
    {
        if (!Weights((widthNm - _min) / _step, _lambda.Length, out int i, out double wm, out double w0, out double w1, out double w2))
        {
            lambdaWNm = baseVtV = double.NaN;
            return false;
        }

        lambdaWNm = (wm * _lambda[i - 1]) + (w0 * _lambda[i]) + (w1 * _lambda[i + 1]) + (w2 * _lambda[i + 2]);
        baseVtV = (wm * _baseVt[i - 1]) + (w0 * _baseVt[i]) + (w1 * _baseVt[i + 1]) + (w2 * _baseVt[i + 2]);
        return true;
    }

    /// <summary>Interpolated double-gate λ (nm) of a film <paramref name="filmNm"/> thick (the top gate's 2H, B.3); false outside 30–600 nm.</summary>
    public bool TryInterpolateFilm(double filmNm, out double lambdaNm)
    {
        if (!Weights((filmNm - _filmMin) / _filmStep, _film.Length, out int i, out double wm, out double w0, out double w1, out double w2))
        {
            lambdaNm = double.NaN;
            return false;
        }

        lambdaNm = (wm * _film[i - 1]) + (w0 * _film[i]) + (w1 * _film[i + 1]) + (w2 * _film[i + 2]);
        return true;
    }

    // Four-point Lagrange weights on nodes i−1, i, i+1, i+2 at t = x − i ∈ [0, 1); false unless all four exist.
    private static bool Weights(double x, int length, out int i, out double wm, out double w0, out double w1, out double w2)
    {
        i = (int)Math.Floor(x);
        if (!(x >= 1) || i + 2 >= length)
        {
            wm = w0 = w1 = w2 = 0;
            return false;
        }

        double t = x - i;
        wm = -t * (t - 1) * (t - 2) / 6;
        w0 = (t + 1) * (t - 1) * (t - 2) / 2;
        w1 = -(t + 1) * t * (t - 2) / 2;
        w2 = (t + 1) * t * (t - 1) / 6;
        return true;
    }
}
