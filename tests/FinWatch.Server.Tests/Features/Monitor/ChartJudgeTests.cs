using FinWatch.Data.Entities;
using FinWatch.Server.Features.Monitor;
using FinWatch.Server.Features.Spc;
using FinWatch.Statistics.Rules;
using FsCheck.Xunit;

namespace FinWatch.Server.Tests.Features.Monitor;

/// <summary>
/// One chart arithmetic: the live monitor's judge (through the statistics library's incremental monitor, resuming from
/// the last judged points as each batch does) flags exactly the points the batch analysis flags on the same points.
/// </summary>
public class ChartJudgeTests
{
    private static readonly string[] AllRules = [.. RunRules.WesternElectric.Concat(RunRules.Nelson).Select(RunRules.Id)];

    // Consistency property: random subgroups (1 to 8 sites, a slow drift and occasional jumps so that every rule gets
    // chances), judged live in batches of random size with the rule state rebuilt from the last 20 judged points at each
    // batch, against the batch analysis with the same known limits over the whole series.
    [Property(MaxTest = 30)]
    public bool LiveJudge_InBatches_FlagsWhatTheBatchAnalysisFlags(int seed, bool xbar)
    {
        var random = new Random(seed);
        var groups = Enumerable.Range(0, 160).Select(i =>
        {
            var n = random.Next(1, 9);
            var shift = (i * 0.003) + (random.NextDouble() < 0.04 ? 0.5 : 0);
            return Enumerable.Range(0, n).Select(_ => 6 + shift + (0.2 * (random.NextDouble() - 0.5))).ToArray();
        }).ToList();
        var context = new ChartContext
        {
            Id = 1, Code = "C", Title = "C", Step = "S", Parameter = "top_width_nm", ChartType = xbar ? "xbar" : "individuals",
            Subgroup = "wafer", Rules = string.Join(',', AllRules),
        };
        var limit = new LimitVersion { Id = 7, ContextId = 1, Version = 1, Status = "approved", Centre = 6.1, Sigma = xbar ? 0.06 : 0.04, ComputedBy = "x", EffectiveFromMs = 0 };

        // Live: batches of 1 to 30 points; each batch is judged by a fresh judge that replays the last 20 judged points.
        var judged = new List<ChartPoint>();
        var seq = 0;
        while (seq < groups.Count)
        {
            var judge = new ChartJudge(context, [limit], ContextRules.Parse(context.Rules));
            foreach (var p in judged.TakeLast(20))
            {
                judge.Replay(p);
            }

            foreach (var g in groups.Skip(seq).Take(random.Next(1, 31)))
            {
                var mean = g.Average();
                var point = new ChartPoint
                {
                    ContextId = 1, Seq = ++seq, LotId = "L", MeasuredAtMs = seq * 1000L, Value = mean, N = g.Length,
                    Sd = g.Length > 1 ? Math.Sqrt(g.Sum(v => (v - mean) * (v - mean)) / (g.Length - 1)) : null,
                };
                judge.Judge(point);
                judged.Add(point);
            }
        }

        // Batch: the SPC analysis of the same points under the same known limits.
        var batch = RunAnalysis.Run(xbar
            ? new AnalysisRequest
            {
                Subgroups = [.. groups.Select(g => g.Select(v => (double?)v).ToArray())], Chart = "Xbar-S",
                Limits = new LimitsRequest { Source = "known", Mean = limit.Centre, Sigma = limit.Sigma }, Rules = AllRules,
            }
            : new AnalysisRequest
            {
                Values = [.. groups.Select(g => (double?)g.Average())], Chart = "I-MR",
                Limits = new LimitsRequest { Source = "known", Mean = limit.Centre, Sigma = limit.Sigma }, Rules = AllRules,
            });
        var expected = batch.Rules!.Signals.GroupBy(s => s.Index)
            .ToDictionary(g => g.Key, g => string.Join(',', g.Select(s => s.Rule).Distinct().Order(StringComparer.Ordinal)));
        for (var i = 0; i < judged.Count; i++)
        {
            var live = string.Join(',', judged[i].Signals.Split(',', StringSplitOptions.RemoveEmptyEntries).Order(StringComparer.Ordinal));
            if (live != expected.GetValueOrDefault(i, ""))
            {
                return false;
            }
        }

        return judged.Any(p => p.Signals.Length > 0); // the property is not met vacuously
    }
}
