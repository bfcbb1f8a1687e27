using FinWatch.Physics;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// The <c>gate_faces</c> field of every request that says which faces of the fin the gate covers (products, the model's
/// evaluate and cross-section): the spellings of <see cref="GateFacesText"/> and one message when a value is not one of them.
/// </summary>
public static class GateFacesField
{
    public const string Name = "gate_faces";

    /// <summary>
    /// Adds a problem under <c>gate_faces</c> when <paramref name="value"/> is not "tri-gate" or "double-gate"; an absent
    /// value is a problem only when <paramref name="required"/> (otherwise it means tri-gate, <see cref="OrTriGate"/>).
    /// </summary>
    public static void Check(string? value, ValidationErrors errors, bool required)
    {
        if (value is null && !required)
        {
            return;
        }

        if (!GateFacesText.TryParse(value, out _))
        {
            errors[Name] = value is null
                ? $"gate_faces is required: {GateFacesText.Described}"
                : $"'{value}' is not a gate configuration; gate_faces is {GateFacesText.Described}";
        }
    }

    /// <summary>The checked value as the enum, tri-gate when absent.</summary>
    public static GateFaces OrTriGate(string? value) => value is null ? GateFaces.TriGate : GateFacesText.Parse(value);
}
