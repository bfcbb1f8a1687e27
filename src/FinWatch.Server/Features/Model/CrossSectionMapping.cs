using FinWatch.Server.Infrastructure;
using FinWatch.Physics;
using FinWatch.Physics.Solver;

namespace FinWatch.Server.Features.Model;

/// <summary>Request checks and the mapping between the API's shapes and the solver's.</summary>
public static class CrossSectionMapping
{
    public static void Check(CrossSectionRequest r, ValidationErrors e)
    {
        void Positive(string name, double? v, double max)
        {
            if (v is not { } x || !(x > 0 && x <= max))
            {
                e[name] = $"{name} is required, 0 < value ≤ {max} nm";
            }
        }

        Positive("top_width_nm", r.TopWidthNm, 100);
        Positive("bottom_width_nm", r.BottomWidthNm, 100);
        Positive("height_nm", r.HeightNm, 100);
        if (r.CornerRadiusNm is { } radius && !(radius >= 0 && radius <= 50))
        {
            e["corner_radius_nm"] = "corner_radius_nm is 0 to 50 nm";
        }

        if (r.Layers is { Length: > 0 } layers)
        {
            for (var i = 0; i < layers.Length; i++)
            {
                if (layers[i].ThicknessNm is not { } t || !(t > 0 && t <= 10) || layers[i].K is not { } k || !(k >= 1 && k <= 100))
                {
                    e[$"layers[{i}]"] = "each layer needs thickness_nm (0 to 10 nm) and k (1 to 100)";
                }
            }
        }
        else
        {
            Positive("eot_nm", r.EotNm, 10);
        }

        if (r.DopingCm3 is { } n && !(n >= 0 && n <= 1e20))
        {
            e["doping_cm3"] = "doping_cm3 is 0 to 1e20 cm⁻³ (acceptors)";
        }

        SpelledField.Check(e, "gate_faces", r.GateFaces, GateFacesText.Spelling, required: false);

        if (r.GridNm is { } h && !(h >= 0.1 && h <= 1))
        {
            e["grid_nm"] = "grid_nm is 0.1 to 1 nm";
        }

    }

    public static FinSolverRequest ToSolver(CrossSectionRequest r) => new()
    {
        Profile = new FinProfile(r.TopWidthNm!.Value, r.BottomWidthNm!.Value, r.HeightNm!.Value, r.CornerRadiusNm ?? 0),
        Faces = SpelledField.ParseOr(r.GateFaces, GateFacesText.Spelling, GateFaces.TriGate),
        DielectricLayers = r.Layers is { Length: > 0 } layers
            ? layers.Select(l => new DielectricLayer(l.ThicknessNm!.Value, l.K!.Value)).ToList()
            : [new DielectricLayer(r.EotNm!.Value, SolverConstants.OxideRelativePermittivity)],
        AcceptorDensityCm3 = r.DopingCm3 ?? 0,
        GridSpacingNm = r.GridNm ?? 0.2,
    };

    public static CrossSectionResult ToResult(FinSolverResult r)
    {
        SolverMaps? maps = null;
        if (r.AtThreshold is { } at)
        {
            var g = at.Grid;
            var x = Enumerable.Range(0, g.NodesX).Select(g.XNm).ToArray();
            var y = Enumerable.Range(0, g.NodesY).Select(g.YNm).ToArray();
            double[][] Rows(double[] field) => Enumerable.Range(0, g.NodesY)
                .Select(j => Enumerable.Range(0, g.NodesX).Select(i => Finite(field[g.Index(i, j)])).ToArray()).ToArray();
            maps = new SolverMaps(x, y, Rows(at.PotentialV), Rows(at.ElectronDensityCm3));
        }

        // Electrons per nm of channel length → per cm (× 1e7).
        var sweep = new GateSweep(r.Sweep.Select(p => p.GateVoltageV).ToArray(), r.Sweep.Select(p => p.ElectronsPerNm * 1e7).ToArray());
        return new CrossSectionResult(
            double.IsFinite(r.ThresholdVoltageV) ? r.ThresholdVoltageV : null,
            double.IsFinite(r.SwingMvPerDecade) ? r.SwingMvPerDecade : null,
            sweep, maps, r.TotalNewtonIterations, SolverLimitations.Items);
    }

    // Metal nodes carry no density; a map must stay valid JSON.
    private static double Finite(double v) => double.IsFinite(v) ? v : 0;
}
