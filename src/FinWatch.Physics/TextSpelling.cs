using System.Diagnostics.CodeAnalysis;

namespace FinWatch.Physics;

/// <summary>
/// The one text spelling of each value of an enum (for example <see cref="GateFacesText"/>): exact, case-sensitive,
/// the same in the API, the database and the demo data.
/// </summary>
/// <typeparam name="T">The enum.</typeparam>
public sealed class TextSpelling<T>
    where T : struct, Enum
{
    private readonly (T Value, string Text)[] spellings;

    /// <param name="described">Every spelling with what it means, for messages to the people who send them.</param>
    /// <param name="spellings">One text per enum value.</param>
    /// <exception cref="ArgumentException">An enum value is missing or spelt twice, or a text is used twice.</exception>
    public TextSpelling(string described, params (T Value, string Text)[] spellings)
    {
        if (spellings.Select(s => s.Value).Distinct().Count() != Enum.GetValues<T>().Length
            || spellings.Select(s => s.Text).Distinct(StringComparer.Ordinal).Count() != spellings.Length)
        {
            throw new ArgumentException($"give each {typeof(T).Name} value exactly one text of its own", nameof(spellings));
        }

        this.spellings = spellings;
        Described = described;
        Names = [.. spellings.Select(s => s.Text)];
    }

    /// <summary>Every allowed text, in the order given.</summary>
    public IReadOnlyList<string> Names { get; }

    /// <summary>Every allowed text with what it means, for messages.</summary>
    public string Described { get; }

    /// <summary>The text of <paramref name="value"/>.</summary>
    /// <exception cref="ArgumentOutOfRangeException">The value is not a defined member of the enum.</exception>
    public string ToText(T value)
    {
        foreach (var (v, text) in spellings)
        {
            if (EqualityComparer<T>.Default.Equals(v, value))
            {
                return text;
            }
        }

        throw new ArgumentOutOfRangeException(nameof(value), value, $"not a defined {typeof(T).Name}");
    }

    /// <summary>Reads an exact text; false for anything else, null included.</summary>
    public bool TryParse([NotNullWhen(true)] string? text, out T value)
    {
        foreach (var (v, t) in spellings)
        {
            if (string.Equals(t, text, StringComparison.Ordinal))
            {
                value = v;
                return true;
            }
        }

        value = default;
        return false;
    }

    /// <summary>Reads an exact text, as <see cref="TryParse"/>.</summary>
    /// <exception cref="FormatException">The text is not one of <see cref="Names"/>.</exception>
    public T Parse(string text) =>
        TryParse(text, out var value) ? value : throw new FormatException($"'{text}' is not one of: {Described}");
}
