namespace FinWatch.Physics.Solver;

/// <summary>
/// The meshed cross-section (docs/model.md §F.2, F.3): material classification, silicon fraction of
/// every control volume from 4 × 4 sub-samples, series–parallel edge coefficients (arithmetic mean over 4 lines
/// across the dual face of the harmonic mean of 6 samples along the edge), gate (Dirichlet) nodes and the
/// eigenmode mass h²·ε̄. Control volumes and dual faces are clipped to the domain, which gives the Neumann outer
/// boundary.
/// </summary>
internal sealed class FinMesh
{
    private const int CvSamples = 4;
    private const int FaceLines = 4;
    private const int EdgeSamples = 6;

    private readonly FinProfile _profile;
    private readonly bool _hardMask;
    private readonly double _capTop;
    private readonly double _capEps;
    private readonly double[] _layerOuter;
    private readonly double[] _layerEps;
    private readonly double _tPhys;
    private readonly double _halfBottom;
    private readonly double _halfTopFlat;
    private readonly double _sideTopX;
    private readonly double _sideTopY;
    private readonly double _arcX;
    private readonly double _arcY;
    private readonly double _radius;
    private readonly double _sin;
    private readonly double _cos;
    private readonly double _xMax;
    private readonly double _yMin;
    private readonly double _yMax;

    public FinMesh(FinSolverRequest request, double boxThicknessNm, CancellationToken cancellationToken)
    {
        _profile = request.Profile;
        _hardMask = request.Faces == GateFaces.DoubleGate;
        _capTop = _profile.HeightNm + request.HardMaskThicknessNm;
        _capEps = request.HardMaskRelativePermittivity;
        int layers = request.DielectricLayers.Count;
        _layerOuter = new double[layers];
        _layerEps = new double[layers];
        double acc = 0;
        for (int l = 0; l < layers; l++)
        {
            acc += request.DielectricLayers[l].ThicknessNm;
            _layerOuter[l] = acc;
            _layerEps[l] = request.DielectricLayers[l].RelativePermittivity;
        }

        _tPhys = acc;

        FinGeometry g = FinCrossSection.Derive(_profile, request.Faces);
        double theta = FinCrossSection.TaperAngleRad(_profile.TopWidthNm, _profile.BottomWidthNm, _profile.HeightNm);
        (_sin, _cos) = Math.SinCos(theta);
        _radius = g.CornerRadiusUsedNm;
        double halfTop = 0.5 * _profile.TopWidthNm;
        double tangent = Math.Min(FinCrossSection.CornerTangentLengthNm(_radius, theta), halfTop);
        _halfBottom = 0.5 * _profile.BottomWidthNm;
        _halfTopFlat = halfTop - tangent;
        _arcX = _halfTopFlat;
        _arcY = _profile.HeightNm - _radius;
        _sideTopX = _radius > 0 ? _arcX + (_radius * _cos) : halfTop;
        _sideTopY = _radius > 0 ? _arcY + (_radius * _sin) : _profile.HeightNm;
        CornerTangentNm = tangent;
        TaperRad = theta;
        CornerRadiusNm = _radius;

        double h = request.GridSpacingNm;
        double halfDomain = (0.5 * Math.Max(_profile.TopWidthNm, _profile.BottomWidthNm)) + _tPhys + 1;
        int halfNodes = checked((int)Math.Ceiling((halfDomain / h) - 1e-9));
        int nx = checked((2 * halfNodes) + 1);
        double top = _profile.HeightNm + _tPhys + 1 + (_hardMask ? request.HardMaskThicknessNm : 0);
        int ny = checked((int)Math.Ceiling(((top + boxThicknessNm) / h) - 1e-9) + 1);
        Grid = new SolverGrid(nx, ny, -halfNodes * h, -boxThicknessNm, h);
        _xMax = halfNodes * h;
        _yMin = -boxThicknessNm;
        _yMax = Grid.YNm(ny - 1);

        int n = Grid.NodeCount;
        SiliconFraction = new double[n];
        IsGate = new bool[n];
        Mass = new double[n];
        EdgeRight = new double[n];
        EdgeUp = new double[n];
        Build(h, cancellationToken);
    }

    public SolverGrid Grid { get; }

    /// <summary>f_si of each control volume, as a fraction of h².</summary>
    public double[] SiliconFraction { get; }

    /// <summary>Whether the node lies in gate metal (Dirichlet).</summary>
    public bool[] IsGate { get; }

    /// <summary>Eigenmode mass h²·(domain fraction)·ε̄ of the non-metal part (B.4, F.8), in nm².</summary>
    public double[] Mass { get; }

    /// <summary>Edge coefficient ε_ij between node k and k + 1 (0 in the last column).</summary>
    public double[] EdgeRight { get; }

    /// <summary>Edge coefficient between node k and k + NodesX (0 in the last row).</summary>
    public double[] EdgeUp { get; }

    public double CornerTangentNm { get; }

    public double TaperRad { get; }

    public double CornerRadiusNm { get; }

    /// <summary>Relative permittivity at a point; <paramref name="isSilicon"/>/<paramref name="isMetal"/> classify it.</summary>
    public double Permittivity(double x, double y, out bool isSilicon, out bool isMetal)
    {
        isSilicon = false;
        isMetal = false;
        if (FinCrossSection.IsInside(_profile, x, y))
        {
            isSilicon = true;
            return SolverConstants.SiliconRelativePermittivity;
        }

        double ax = Math.Abs(x);
        if (_hardMask && ax <= 0.5 * _profile.TopWidthNm && y >= _profile.HeightNm && y <= _capTop)
        {
            return _capEps;
        }

        if (y < 0)
        {
            return SolverConstants.OxideRelativePermittivity;
        }

        double d = DistanceToFin(ax, y);
        if (_hardMask)
        {
            double dx = Math.Max(ax - (0.5 * _profile.TopWidthNm), 0);
            double dy = Math.Max(Math.Max(_profile.HeightNm - y, y - _capTop), 0);
            d = Math.Min(d, Math.Sqrt((dx * dx) + (dy * dy)));
        }

        if (d <= _tPhys)
        {
            for (int l = 0; l < _layerOuter.Length; l++)
            {
                if (d <= _layerOuter[l])
                {
                    return _layerEps[l];
                }
            }
        }

        isMetal = true;
        return SolverConstants.MetalRelativePermittivity;
    }

    /// <summary>Distance from an outside point (|x|, y) to the rounded trapezoid (convex), in nm.</summary>
    private double DistanceToFin(double ax, double y)
    {
        double d = DistanceToSegment(ax, y, -_halfBottom, 0, _halfBottom, 0);
        d = Math.Min(d, DistanceToSegment(ax, y, _halfBottom, 0, _sideTopX, _sideTopY));
        d = Math.Min(d, DistanceToSegment(ax, y, -_halfTopFlat, _profile.HeightNm, _halfTopFlat, _profile.HeightNm));
        if (_radius > 0)
        {
            double dx = ax - _arcX;
            double dy = y - _arcY;
            if (dx > 0 && ((_cos * dy) - (_sin * dx)) > 0)
            {
                d = Math.Min(d, Math.Abs(Math.Sqrt((dx * dx) + (dy * dy)) - _radius));
            }
        }

        return d;
    }

    private static double DistanceToSegment(double px, double py, double ax, double ay, double bx, double by)
    {
        double ux = bx - ax;
        double uy = by - ay;
        double len2 = (ux * ux) + (uy * uy);
        double s = len2 > 0 ? Math.Clamp((((px - ax) * ux) + ((py - ay) * uy)) / len2, 0, 1) : 0;
        double dx = px - (ax + (s * ux));
        double dy = py - (ay + (s * uy));
        return Math.Sqrt((dx * dx) + (dy * dy));
    }

    private bool InDomainX(double x) => x >= -_xMax && x <= _xMax;

    private bool InDomainY(double y) => y >= _yMin && y <= _yMax;

    private void Build(double h, CancellationToken cancellationToken)
    {
        int nx = Grid.NodesX;
        int ny = Grid.NodesY;
        for (int j = 0; j < ny; j++)
        {
            cancellationToken.ThrowIfCancellationRequested();
            double y = Grid.YNm(j);
            for (int i = 0; i < nx; i++)
            {
                double x = Grid.XNm(i);
                int k = Grid.Index(i, j);
                _ = Permittivity(x, y, out _, out bool metal);
                IsGate[k] = metal;
                ControlVolume(k, x, y, h);
                if (i < nx - 1)
                {
                    EdgeRight[k] = Edge(x, y, h, horizontal: true);
                }

                if (j < ny - 1)
                {
                    EdgeUp[k] = Edge(x, y, h, horizontal: false);
                }
            }
        }
    }

    private void ControlVolume(int k, double x, double y, double h)
    {
        int si = 0;
        int inDomain = 0;
        int nonMetal = 0;
        double epsSum = 0;
        for (int a = 0; a < CvSamples; a++)
        {
            double sx = x + ((((a + 0.5) / CvSamples) - 0.5) * h);
            if (!InDomainX(sx))
            {
                continue;
            }

            for (int b = 0; b < CvSamples; b++)
            {
                double sy = y + ((((b + 0.5) / CvSamples) - 0.5) * h);
                if (!InDomainY(sy))
                {
                    continue;
                }

                inDomain++;
                double eps = Permittivity(sx, sy, out bool isSi, out bool isMetal);
                if (isSi)
                {
                    si++;
                }

                if (!isMetal)
                {
                    nonMetal++;
                    epsSum += eps;
                }
            }
        }

        const double total = CvSamples * CvSamples;
        SiliconFraction[k] = si / total;
        double meanEps = nonMetal > 0 ? epsSum / nonMetal : Permittivity(x, y, out _, out _);
        Mass[k] = h * h * (inDomain / total) * meanEps;
    }

    /// <summary>Series–parallel coefficient of the edge from (x, y) to its right or upper neighbour (F.3).</summary>
    private double Edge(double x, double y, double h, bool horizontal)
    {
        double sum = 0;
        for (int l = 0; l < FaceLines; l++)
        {
            double across = (((l + 0.5) / FaceLines) - 0.5) * h;
            if (horizontal ? !InDomainY(y + across) : !InDomainX(x + across))
            {
                continue;
            }

            double inverseSum = 0;
            for (int s = 0; s < EdgeSamples; s++)
            {
                double along = ((s + 0.5) / EdgeSamples) * h;
                double eps = horizontal
                    ? Permittivity(x + along, y + across, out _, out _)
                    : Permittivity(x + across, y + along, out _, out _);
                inverseSum += 1 / eps;
            }

            sum += EdgeSamples / inverseSum;
        }

        return sum / FaceLines;
    }
}
