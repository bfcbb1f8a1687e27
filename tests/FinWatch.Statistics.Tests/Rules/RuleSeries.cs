using FinWatch.Statistics.Rules;

namespace FinWatch.Statistics.Tests.Rules;

/// <summary>A generated test series: plotted values (NaN = missing), z-scores (NaN = not evaluable) and a rule subset.</summary>
internal sealed record RuleSeries(double[] Values, double[] Z, RunRule[] Rules)
{
    public override string ToString() =>
        $"values [{string.Join(", ", Values)}]; z [{string.Join(", ", Z)}]; rules [{string.Join(", ", Rules)}]";
}
