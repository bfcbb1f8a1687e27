using System.Collections.ObjectModel;
using System.Numerics;
using System.Runtime.CompilerServices;

namespace FinWatch.Statistics.Rules;

/// <summary>
/// Incremental run-rule evaluator (docs/statistics.md §3): append the points of a chart one at a time and receive the signals each
/// point completes. O(1) work per appended point for all rules together (shift registers, capped run counters and two
/// 16-slot index rings); no allocation per point except the pattern array of a raised signal.
/// </summary>
/// <remarks>
/// <para>Conventions (docs/statistics.md §3.3): beyond k sigma is |z| &gt; k strictly and a point on a zone line is in the inner zone
/// (item 1); z == 0 is on neither side and ends WE4/N2 runs (item 2); WE2/N5 and WE3/N6 are one-sided with the odd point
/// anywhere (item 3); the flagged point completes the pattern, and for 2-of-3 / 4-of-5 it must itself be beyond on that
/// side, while run rules flag every point that ends a run of at least the required length (item 4); windows are
/// truncated at the start (item 5); ties end N3 trends and N4 alternations (item 6); N8 does not need both sides
/// (item 7); missing rows are never appended, so "consecutive" means consecutive appended points and the reported
/// indices are the caller's (item 8).</para>
/// <para><b>Points whose z is NaN</b> (zone rules not evaluable for that point, sigma_point = 0, item 9): the zone rules
/// (every rule but N3 and N4) skip the point as if it were missing — it neither enters a 3- or 5-point window nor
/// extends or ends a run. N3 and N4 still use its value. <see cref="ZoneCount"/> counts the points with a non-NaN z;
/// while it is 0 the zone rules have not been evaluable at all (the batch API reports their flags as null).</para>
/// <para>Not thread-safe: one evaluator per chart, appended to by one writer at a time.</para>
/// </remarks>
public sealed class RunRuleEvaluator
{
    private const int RingMask = 15;

    // Required lengths (docs/statistics.md §3.1, §3.2; §3.3 items 4 and 6). Counters are capped at these, so they never overflow.
    private const int We4Run = 8;
    private const int N2Run = 9;
    private const int N3Steps = 5;
    private const int N4Steps = 13;
    private const int N7Run = 15;
    private const int N8Run = 8;

    private const uint Bit1 = (1u << (int)RunRule.WE1) | (1u << (int)RunRule.N1);
    private const uint Bit2Of3 = (1u << (int)RunRule.WE2) | (1u << (int)RunRule.N5);
    private const uint Bit4Of5 = (1u << (int)RunRule.WE3) | (1u << (int)RunRule.N6);

    private readonly uint enabled;
    private State state;

    /// <summary>Creates an evaluator for the given rules (duplicates are ignored).</summary>
    /// <exception cref="ArgumentOutOfRangeException">A rule is not a defined <see cref="RunRule"/> value.</exception>
    public RunRuleEvaluator(IEnumerable<RunRule> rules)
    {
        ArgumentNullException.ThrowIfNull(rules);
        var set = new HashSet<RunRule>();
        foreach (var rule in rules)
        {
            enabled |= 1u << RunRules.Checked(rule);
            set.Add(rule);
        }

        Rules = new ReadOnlySet<RunRule>(set);
        state.LastIndex = -1;
    }

    /// <summary>The rules evaluated.</summary>
    public IReadOnlySet<RunRule> Rules { get; }

    /// <summary>Number of points appended.</summary>
    public long Count => state.Count;

    /// <summary>Number of appended points whose z was not NaN, i.e. for which the zone rules were evaluable.</summary>
    public long ZoneCount => state.ZoneCount;

    /// <summary>
    /// Appends the next non-missing point and adds the signals it completes to <paramref name="signals"/>, in
    /// <see cref="RunRule"/> order.
    /// </summary>
    /// <param name="index">The caller's input index of the point; non-negative and greater than that of the previous point.</param>
    /// <param name="value">The plotted value (used by N3 and N4); finite.</param>
    /// <param name="z">(value − CL)/sigma_point; NaN when the zone rules are not evaluable for this point (see remarks); not infinite.</param>
    /// <param name="signals">Receives the signals; <see langword="null"/> to update the state only (nothing is allocated then).</param>
    /// <exception cref="ArgumentOutOfRangeException">The index does not increase, the value is not finite, or z is infinite.</exception>
    public void Append(int index, double value, double z, ICollection<RuleSignal>? signals)
    {
        ref var s = ref state;
        if (index <= s.LastIndex)
        {
            throw new ArgumentOutOfRangeException(nameof(index), index, "Indices must be non-negative and strictly increasing.");
        }

        if (!double.IsFinite(value))
        {
            throw new ArgumentOutOfRangeException(nameof(value), value, "The plotted value must be finite; missing points are not appended.");
        }

        if (double.IsInfinity(z))
        {
            throw new ArgumentOutOfRangeException(nameof(z), z, "z must be finite, or NaN when the zone rules are not evaluable.");
        }

        // Trend and alternation over all appended points (N3, N4; docs/statistics.md §3.3 item 6: a zero difference ends both).
        var sign = 0;
        if (s.Count > 0)
        {
            var d = value - s.LastValue;
            sign = d > 0 ? 1 : d < 0 ? -1 : 0;
        }

        s.Count++;
        s.LastIndex = index;
        s.LastValue = value;
        s.AllHead = (s.AllHead + 1) & RingMask;
        s.AllRing[s.AllHead] = index;
        s.IncRun = sign > 0 ? Math.Min(s.IncRun + 1, N3Steps) : 0;
        s.DecRun = sign < 0 ? Math.Min(s.DecRun + 1, N3Steps) : 0;
        s.AltRun = sign == 0 ? 0 : sign == -s.LastSign ? Math.Min(s.AltRun + 1, N4Steps) : 1;
        s.LastSign = sign;

        uint hits = 0;
        if (s.IncRun >= N3Steps || s.DecRun >= N3Steps)
        {
            hits |= 1u << (int)RunRule.N3;
        }

        if (s.AltRun >= N4Steps)
        {
            hits |= 1u << (int)RunRule.N4;
        }

        if (!double.IsNaN(z))
        {
            hits |= AppendZone(ref s, index, z);
        }

        hits &= enabled;
        if (hits != 0 && signals is not null)
        {
            Raise(ref s, hits, index, z, signals);
        }
    }

    [MethodImpl(MethodImplOptions.AggressiveInlining)]
    private static uint AppendZone(ref State s, int index, double z)
    {
        s.ZoneCount++;
        s.ZoneHead = (s.ZoneHead + 1) & RingMask;
        s.ZoneRing[s.ZoneHead] = index;

        var a = Math.Abs(z);
        var up2 = z > 2;
        var down2 = z < -2;
        var up1 = z > 1;
        var down1 = z < -1;

        // Shift registers of the last 3 (beyond 2 sigma) and 5 (beyond 1 sigma) zone points, bit 0 = this point.
        // Bits of points before the start are 0, which truncates the windows there (docs/statistics.md §3.3 item 5).
        s.Up2 = ((s.Up2 << 1) | (up2 ? 1u : 0u)) & 0b111u;
        s.Down2 = ((s.Down2 << 1) | (down2 ? 1u : 0u)) & 0b111u;
        s.Up1 = ((s.Up1 << 1) | (up1 ? 1u : 0u)) & 0b11111u;
        s.Down1 = ((s.Down1 << 1) | (down1 ? 1u : 0u)) & 0b11111u;

        // z == 0 is on neither side and ends both runs (item 2).
        s.UpRun = z > 0 ? Math.Min(s.UpRun + 1, N2Run) : 0;
        s.DownRun = z < 0 ? Math.Min(s.DownRun + 1, N2Run) : 0;
        s.InCRun = a <= 1 ? Math.Min(s.InCRun + 1, N7Run) : 0;
        s.OutCRun = a > 1 ? Math.Min(s.OutCRun + 1, N8Run) : 0;

        uint hits = 0;
        if (a > 3)
        {
            hits |= Bit1;
        }

        // The flagged point must itself be beyond on that side (item 4).
        if ((up2 && BitOperations.PopCount(s.Up2) >= 2) || (down2 && BitOperations.PopCount(s.Down2) >= 2))
        {
            hits |= Bit2Of3;
        }

        if ((up1 && BitOperations.PopCount(s.Up1) >= 4) || (down1 && BitOperations.PopCount(s.Down1) >= 4))
        {
            hits |= Bit4Of5;
        }

        var side = Math.Max(s.UpRun, s.DownRun);
        if (side >= We4Run)
        {
            hits |= 1u << (int)RunRule.WE4;
        }

        if (side >= N2Run)
        {
            hits |= 1u << (int)RunRule.N2;
        }

        if (s.InCRun >= N7Run)
        {
            hits |= 1u << (int)RunRule.N7;
        }

        if (s.OutCRun >= N8Run)
        {
            hits |= 1u << (int)RunRule.N8;
        }

        return hits;
    }

    [MethodImpl(MethodImplOptions.NoInlining)]
    private static void Raise(ref State s, uint hits, int index, double z, ICollection<RuleSignal> signals)
    {
        while (hits != 0)
        {
            var rule = (RunRule)BitOperations.TrailingZeroCount(hits);
            hits &= hits - 1;
            int[] pattern = rule switch
            {
                RunRule.WE1 or RunRule.N1 => [index],
                RunRule.WE2 or RunRule.N5 => FromMask(ref s, z > 0 ? s.Up2 : s.Down2, 3),
                RunRule.WE3 or RunRule.N6 => FromMask(ref s, z > 0 ? s.Up1 : s.Down1, 5),
                RunRule.WE4 => Last(ref s.ZoneRing, s.ZoneHead, We4Run),
                RunRule.N2 => Last(ref s.ZoneRing, s.ZoneHead, N2Run),
                RunRule.N3 => Last(ref s.AllRing, s.AllHead, N3Steps + 1),
                RunRule.N4 => Last(ref s.AllRing, s.AllHead, N4Steps + 1),
                RunRule.N7 => Last(ref s.ZoneRing, s.ZoneHead, N7Run),
                _ => Last(ref s.ZoneRing, s.ZoneHead, N8Run),
            };
            signals.Add(new RuleSignal(rule, index, pattern));
        }
    }

    private static int[] FromMask(ref State s, uint mask, int width)
    {
        var pattern = new int[BitOperations.PopCount(mask)];
        var n = 0;
        for (var k = width - 1; k >= 0; k--)
        {
            if ((mask & (1u << k)) != 0)
            {
                pattern[n++] = s.ZoneRing[(s.ZoneHead - k) & RingMask];
            }
        }

        return pattern;
    }

    private static int[] Last(ref IndexRing ring, int head, int length)
    {
        var pattern = new int[length];
        for (var k = 0; k < length; k++)
        {
            pattern[k] = ring[(head - length + 1 + k) & RingMask];
        }

        return pattern;
    }

    /// <summary>The last 16 indices appended to a sequence, as a ring.</summary>
    [InlineArray(16)]
    private struct IndexRing
    {
        private int element;
    }

    /// <summary>The whole evaluation state, flat: counters capped at the rule lengths, shift registers, two rings.</summary>
    private struct State
    {
        public long Count;
        public long ZoneCount;
        public int LastIndex;
        public double LastValue;
        public int LastSign;
        public int IncRun;
        public int DecRun;
        public int AltRun;
        public uint Up2;
        public uint Down2;
        public uint Up1;
        public uint Down1;
        public int UpRun;
        public int DownRun;
        public int InCRun;
        public int OutCRun;
        public int AllHead;
        public int ZoneHead;
        public IndexRing AllRing;
        public IndexRing ZoneRing;
    }
}
