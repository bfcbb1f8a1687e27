using FinWatch.Statistics.Rules;

namespace FinWatch.Server.Features.Monitor;

/// <summary>
/// How much an alert matters, from its statistics and its predicted electrical impact: a point beyond the 3σ limit
/// (WE1, N1) is "medium", any other rule "low"; a mean predicted |ΔVT,sat| at or above the context's electrical concern
/// makes it "high", at or above twice the concern "critical". The larger of the two counts, so a statistically small
/// but electrically large change ranks above a large change that does not matter electrically.
/// </summary>
public static class Severity
{
    public static readonly string[] Names = ["none", "low", "medium", "high", "critical"];

    public static int Rank(RunRule rule, double? predictedDvtSatMv, double concernMv)
    {
        var statistical = rule is RunRule.WE1 or RunRule.N1 ? 2 : 1;
        var electrical = predictedDvtSatMv is { } d && concernMv > 0
            ? Math.Abs(d) >= 2 * concernMv ? 4 : Math.Abs(d) >= concernMv ? 3 : 0
            : 0;
        return Math.Max(statistical, electrical);
    }

    public static string Name(int rank) => Names[Math.Clamp(rank, 0, Names.Length - 1)];

    /// <summary>A rule in words, for alerts and charts.</summary>
    public static string Describe(RunRule rule) => rule switch
    {
        RunRule.WE1 or RunRule.N1 => "one point beyond a 3σ limit",
        RunRule.WE2 or RunRule.N5 => "two of three points beyond 2σ on one side",
        RunRule.WE3 or RunRule.N6 => "four of five points beyond 1σ on one side",
        RunRule.WE4 => "eight points in a row on one side of the centre line",
        RunRule.N2 => "nine points in a row on one side of the centre line",
        RunRule.N3 => "six points in a row steadily rising or falling",
        RunRule.N4 => "fourteen points in a row alternating up and down",
        RunRule.N7 => "fifteen points in a row within 1σ (hugging the centre line)",
        RunRule.N8 => "eight points in a row outside 1σ on both sides",
        _ => rule.ToString(),
    };
}
