using FinWatch.Data.Entities;
using FinWatch.Physics;
using FinWatch.Server.Features.Parameters;

namespace FinWatch.Server.Features.Products;

/// <summary>The cross-field rules of a product request that annotations cannot state.</summary>
public static class ProductRules
{
    public static GateFaces? ParseFaces(string? text) => text switch
    {
        "tri-gate" => GateFaces.TriGate,
        "double-gate" => GateFaces.DoubleGate,
        _ => null,
    };

    public static string FacesName(GateFaces faces) => faces == GateFaces.DoubleGate ? "double-gate" : "tri-gate";

    /// <summary>Returns the problems keyed by JSON field path; empty when the request is consistent.</summary>
    public static Dictionary<string, string[]> Check(ProductRequest request)
    {
        var errors = new Dictionary<string, string[]>();
        if (ParseFaces(request.GateFaces) is null)
        {
            errors["gate_faces"] = [$"'{request.GateFaces}' is not one of: tri-gate, double-gate"];
        }

        var n = request.Nominal;
        if (n is not null && n.TopWidthNm > 0 && n.BottomWidthNm > 0 && n.FinHeightNm > 0)
        {
            var theta = FinCrossSection.TaperAngleRad(n.TopWidthNm, n.BottomWidthNm, n.FinHeightNm);
            var rMax = FinCrossSection.MaxCornerRadiusNm(n.TopWidthNm, theta);
            if (n.CornerRadiusNm > rMax)
            {
                errors["nominal.corner_radius_nm"] = [$"{n.CornerRadiusNm} nm is larger than the {rMax:0.###} nm the nominal top width allows (fin-model.md A.4)"];
            }
        }

        if (request.Model is { SidewallOrientation: not ("110" or "100") } m)
        {
            errors["model.sidewall_orientation"] = [$"'{m.SidewallOrientation}' is not '110' or '100'"];
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        var specs = request.Specs ?? [];
        for (var i = 0; i < specs.Count; i++)
        {
            var s = specs[i];
            var key = $"specs[{i}]";
            if (!FinParameters.TryGet(s.Parameter ?? "", out _))
            {
                errors[key + ".parameter"] = [$"'{s.Parameter}' is not a parameter; expected one of {FinParameters.NameList}"];
                continue;
            }

            if (!seen.Add(s.Parameter!))
            {
                errors[key + ".parameter"] = [$"'{s.Parameter}' has limits twice"];
            }

            if (new[] { s.Lower, s.Target, s.Upper }.Any(v => v is { } x && !double.IsFinite(x)))
            {
                errors[key] = ["limits must be finite numbers"];
            }
            else if (s.Lower is null && s.Target is null && s.Upper is null)
            {
                errors[key] = ["give at least one of lower, target, upper"];
            }
            else if ((s.Lower > s.Upper) || (s.Lower > s.Target) || (s.Target > s.Upper))
            {
                errors[key] = [$"limits must satisfy lower ≤ target ≤ upper (got {s.Lower}, {s.Target}, {s.Upper})"];
            }
        }

        return errors;
    }
}
