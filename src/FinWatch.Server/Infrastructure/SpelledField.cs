using FinWatch.Physics;

namespace FinWatch.Server.Infrastructure;

/// <summary>
/// A request field that takes one of an enum's spellings (<see cref="TextSpelling{T}"/>): <c>gate_faces</c> and
/// <c>sidewall_orientation</c> wherever they appear, checked with one message that names the allowed values.
/// </summary>
public static class SpelledField
{
    /// <summary>
    /// Adds a problem under <paramref name="field"/> (a JSON path) when <paramref name="value"/> is not one of the
    /// spellings; an absent value is a problem only when <paramref name="required"/>.
    /// </summary>
    public static void Check<T>(ValidationErrors errors, string field, string? value, TextSpelling<T> spelling, bool required)
        where T : struct, Enum
    {
        if ((value is null && !required) || spelling.TryParse(value, out _))
        {
            return;
        }

        var name = field[(field.LastIndexOf('.') + 1)..];
        errors[field] = value is null
            ? $"{name} is required: {spelling.Described}"
            : $"'{value}' is not allowed: {name} is {spelling.Described}";
    }

    /// <summary>The checked value as the enum, <paramref name="absent"/> when the request leaves it out.</summary>
    public static T ParseOr<T>(string? value, TextSpelling<T> spelling, T absent)
        where T : struct, Enum => value is null ? absent : spelling.Parse(value);
}
