using System.Globalization;

namespace FinWatch.SeedDemo;

/// <summary>
/// Formats rows into a reused character buffer (invariant culture, LF) so that streaming the full data set
/// allocates almost nothing per row.
/// </summary>
internal sealed class CsvLineWriter(TextWriter writer)
{
    private readonly char[] _buffer = new char[512];
    private int _length;

    public void WriteHeader()
    {
        writer.Write(DemoFab.CsvHeader);
        writer.Write('\n');
    }

    public void Write(in DemoSiteRow row)
    {
        _length = 0;
        Text(row.LotId);
        Comma();
        Number(row.WaferSlot, default);
        Comma();
        Text(row.SiteId);
        Comma();
        Fixed(row.SiteXMm, 1);
        Comma();
        Fixed(row.SiteYMm, 1);
        Comma();
        Text(row.Product);
        Comma();
        Text(row.Step);
        Comma();
        Text(row.EtchTool);
        Comma();
        Text(row.EtchChamber);
        Comma();
        Text(row.LinerTool);
        Comma();
        Text(row.LinerChamber);
        Comma();
        Text(row.MetrologyTool);
        Comma();
        // "s" is yyyy-MM-ddTHH:mm:ss on a fast path; the times are UTC, so 'Z' is appended.
        Number(row.MeasuredAtUtc, "s");
        _buffer[_length++] = 'Z';
        Comma();
        Text(row.Operator);
        Comma();
        Nm(row.TopWidthNm);
        Comma();
        Nm(row.BottomWidthNm);
        Comma();
        Nm(row.FinHeightNm);
        Comma();
        Nm(row.CornerRadiusNm);
        Comma();
        Nm(row.LinerThicknessNm);
        _buffer[_length++] = '\n';
        writer.Write(_buffer, 0, _length);
    }

    // Every text field is an invented id without commas, quotes or line breaks, so no quoting is needed.
    private void Text(string? value)
    {
        if (value is null)
        {
            return;
        }

        value.CopyTo(_buffer.AsSpan(_length));
        _length += value.Length;
    }

    private void Comma() => _buffer[_length++] = ',';

    private void Nm(double? value)
    {
        if (value is { } v)
        {
            Fixed(v, 3);
        }
    }

    /// <summary>
    /// Writes a value already rounded to <paramref name="decimals"/> places exactly as "F1"/"F3" would, through
    /// integer formatting (several times faster than formatting a double, which dominated the run time).
    /// </summary>
    private void Fixed(double value, int decimals)
    {
        (long scale, string fraction) = decimals switch
        {
            1 => (10L, "0"),
            3 => (1000L, "000"),
            _ => throw new ArgumentOutOfRangeException(nameof(decimals), decimals, "Only 1 or 3 decimals are written."),
        };
        long scaled = (long)Math.Round(value * scale);
        if (scaled < 0)
        {
            _buffer[_length++] = '-';
            scaled = -scaled;
        }

        Number(scaled / scale, default);
        _buffer[_length++] = '.';
        Number(scaled % scale, fraction);
    }

    private void Number<T>(T value, ReadOnlySpan<char> format)
        where T : ISpanFormattable
    {
        if (!value.TryFormat(_buffer.AsSpan(_length), out int written, format, CultureInfo.InvariantCulture))
        {
            throw new InvalidOperationException("A CSV line outgrew its buffer.");
        }

        _length += written;
    }
}
