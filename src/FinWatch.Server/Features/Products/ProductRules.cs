using FinWatch.Physics;
using FinWatch.Physics.Analytic;
using System.Text.RegularExpressions;
using FinWatch.Server.Features.Parameters;
using FinWatch.Server.Infrastructure;

namespace FinWatch.Server.Features.Products;

/// <summary>The rules of a product request: each field's range and the cross-field rules.</summary>
public static partial class ProductRules
{
    /// <summary>Adds the request's problems, keyed by JSON field path; adds nothing when the request is consistent.</summary>
    public static void Check(ProductRequest request, ValidationErrors errors)
    {
        if (request.Code is null || !CodePattern().IsMatch(request.Code))
        {
            errors["code"] = "1 to 64 letters, digits, '.', '_' or '-', starting with a letter or digit";
        }

        if (string.IsNullOrWhiteSpace(request.Name) || request.Name.Length > 200)
        {
            errors["name"] = "name is required, at most 200 characters";
        }

        if (request.Description is { Length: > 2000 })
        {
            errors["description"] = "description is at most 2000 characters";
        }

        SpelledField.Check(errors, "gate_faces", request.GateFaces, GateFacesText.Spelling, required: true);

        if (request.Nominal is not { } nominal)
        {
            errors["nominal"] = "nominal is required: top_width_nm, bottom_width_nm, fin_height_nm, corner_radius_nm, liner_thickness_nm";
        }
        else
        {
            Within(errors, "nominal.top_width_nm", nominal.TopWidthNm, 0.001, 100, "nm");
            Within(errors, "nominal.bottom_width_nm", nominal.BottomWidthNm, 0.001, 100, "nm");
            Within(errors, "nominal.fin_height_nm", nominal.FinHeightNm, 0.001, 300, "nm");
            Within(errors, "nominal.corner_radius_nm", nominal.CornerRadiusNm, 0, 50, "nm");
            Within(errors, "nominal.liner_thickness_nm", nominal.LinerThicknessNm, 0, 20, "nm");
        }

        if (request.Model is { } model)
        {
            Within(errors, "model.eot_nm", model.EotNm, 0.3, 5, "nm");
            Within(errors, "model.gate_length_nm", model.GateLengthNm, 5, 200, "nm");
            Within(errors, "model.channel_doping_cm3", model.ChannelDopingCm3, 0, 1e20, "cm⁻³");
        }

        var n = request.Nominal;
        if (n is not null && n.TopWidthNm > 0 && n.BottomWidthNm > 0 && n.FinHeightNm > 0 && !errors.Has("nominal.corner_radius_nm"))
        {
            var theta = FinCrossSection.TaperAngleRad(n.TopWidthNm, n.BottomWidthNm, n.FinHeightNm);
            var rMax = FinCrossSection.MaxCornerRadiusNm(n.TopWidthNm, theta);
            if (n.CornerRadiusNm > rMax)
            {
                // r_max of docs/model.md §A.4: the rounding cannot reach below the top of the straight sidewall.
                errors["nominal.corner_radius_nm"] = $"{n.CornerRadiusNm} nm is larger than the {rMax:0.###} nm the nominal top width allows";
            }
        }

        if (request.Model is { } m)
        {
            SpelledField.Check(errors, "model.sidewall_orientation", m.SidewallOrientation, ConfinementSurfaceText.Spelling, required: true);
        }

        var seen = new HashSet<string>(StringComparer.Ordinal);
        var specs = request.Specs ?? [];
        for (var i = 0; i < specs.Count; i++)
        {
            var s = specs[i];
            var key = $"specs[{i}]";
            if (s is null)
            {
                errors[key] = "give the parameter and at least one of lower, target, upper";
                continue;
            }

            if (!FinParameters.TryGet(s.Parameter ?? "", out _))
            {
                errors[key + ".parameter"] = $"'{s.Parameter}' is not a parameter; expected one of {FinParameters.NameList}";
                continue;
            }

            if (!seen.Add(s.Parameter!))
            {
                errors[key + ".parameter"] = $"'{s.Parameter}' has limits twice";
            }

            if (new[] { s.Lower, s.Target, s.Upper }.Any(v => v is { } x && !double.IsFinite(x)))
            {
                errors[key] = "limits must be finite numbers";
            }
            else if (s.Lower is null && s.Target is null && s.Upper is null)
            {
                errors[key] = "give at least one of lower, target, upper";
            }
            else if ((s.Lower > s.Upper) || (s.Lower > s.Target) || (s.Target > s.Upper))
            {
                errors[key] = $"limits must satisfy lower ≤ target ≤ upper (got {s.Lower}, {s.Target}, {s.Upper})";
            }
        }
    }

    private static void Within(ValidationErrors errors, string field, double value, double low, double high, string unit)
    {
        if (!(value >= low && value <= high))
        {
            errors[field] = $"{field[(field.LastIndexOf('.') + 1)..]} is {low} to {high} {unit}";
        }
    }

    [GeneratedRegex("^[A-Za-z0-9][A-Za-z0-9._-]{0,63}$")]
    private static partial Regex CodePattern();
}
