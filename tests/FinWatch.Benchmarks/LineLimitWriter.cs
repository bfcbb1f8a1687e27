using System.Text;

namespace FinWatch.Benchmarks;

/// <summary>Passes text through until a number of lines has been written, then drops the rest.</summary>
public sealed class LineLimitWriter(TextWriter inner, int maxLines) : TextWriter
{
    private int lines;

    public override Encoding Encoding => inner.Encoding;

    public override void Write(char value)
    {
        if (lines >= maxLines)
        {
            return;
        }

        inner.Write(value);
        if (value == '\n')
        {
            lines++;
        }
    }

    public override void Write(string? value)
    {
        if (value is null)
        {
            return;
        }

        foreach (var c in value)
        {
            Write(c);
        }
    }

    protected override void Dispose(bool disposing)
    {
        if (disposing)
        {
            inner.Flush();
        }

        base.Dispose(disposing);
    }
}
