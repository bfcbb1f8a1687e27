using FinWatch.Statistics.Capability;

namespace FinWatch.Server.Features.Spc;

/// <summary>Capability, normality and percentile capability in the analysis contract's shapes.</summary>
public static class SpcCapability
{
    public static CapabilityResponse? Capability(CapabilityRequest? q, double[] individuals, double? sigmaWithin)
    {
        if (q is null)
        {
            return null;
        }

        var r = ProcessCapability.Compute(individuals, sigmaWithin ?? double.NaN, new SpecLimits(q.Lsl, q.Usl, q.Target), q.Confidence ?? 0.95);
        var ci = new Dictionary<string, double[]?>();
        foreach (var name in new[] { CapabilityIndexNames.Cp, CapabilityIndexNames.Cpk, CapabilityIndexNames.Pp, CapabilityIndexNames.Ppk })
        {
            ci[name] = r.Intervals.TryGetValue(name, out var i) ? [i.Low, i.High] : null;
        }

        var notes = r.Reasons.Select(p => $"{p.Key}: {p.Value}").Append(r.IntervalNote).Where(n => n.Length > 0).ToList();
        return new CapabilityResponse(r.Cp, r.Cpk, r.Cpu, r.Cpl, r.Pp, r.Ppk, r.Cpm, r.SigmaWithin, r.SigmaOverall, r.Mean, r.N, ci,
            r.ConfidenceLevel, notes);
    }

    public static NormalityResponse Normality(double[] individuals)
    {
        var r = AndersonDarling.Test(individuals);
        var notes = new[] { r.Note, r.Reason }.OfType<string>().ToList();
        return new NormalityResponse(r.ASquared, r.AStar, r.PValue, r.N, notes);
    }

    public static PercentileCapabilityResponse? Percentile(PercentileCapabilityRequest? q, double[] individuals)
    {
        if (q is null)
        {
            return null;
        }

        var r = PercentileCapability.Lognormal(individuals, new SpecLimits(q.Lsl, q.Usl));
        return new PercentileCapabilityResponse(r.CpPercentile, r.CpkPercentile, r.Method,
            r.Reasons.Select(p => $"{p.Key}: {p.Value}").ToList());
    }
}
