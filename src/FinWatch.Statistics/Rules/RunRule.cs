namespace FinWatch.Statistics.Rules;

/// <summary>
/// The run rules of docs/statistics.md §3: the Western Electric (1956) zone rules as restated by Montgomery &amp; Runger
/// (§3.1) and Nelson's (1984) tests for special causes (§3.2), read with the edge conventions of §3.3.
/// </summary>
/// <remarks>
/// z is the standardised plotted value (x − CL)/sigma_point. "Beyond k sigma" is |z| &gt; k strictly; a point on a zone
/// line belongs to the zone nearer the centre line (§3.3 item 1).
/// </remarks>
public enum RunRule
{
    /// <summary>One point beyond a 3-sigma limit: |z| &gt; 3.</summary>
    WE1,

    /// <summary>Two of three consecutive points beyond 2 sigma on the same side (z &gt; 2, or z &lt; −2).</summary>
    WE2,

    /// <summary>Four of five consecutive points beyond 1 sigma on the same side (z &gt; 1, or z &lt; −1).</summary>
    WE3,

    /// <summary>Eight consecutive points on one side of the centre line (z &gt; 0, or z &lt; 0).</summary>
    WE4,

    /// <summary>Nelson test 1, one point beyond zone A: |z| &gt; 3 (flags equal <see cref="WE1"/>).</summary>
    N1,

    /// <summary>Nelson test 2, nine points in a row on one side of the centre line.</summary>
    N2,

    /// <summary>Nelson test 3, six points in a row steadily increasing or decreasing: five successive strict increases (or decreases) of the plotted value.</summary>
    N3,

    /// <summary>Nelson test 4, fourteen points in a row alternating up and down: thirteen successive non-zero differences of the plotted value alternating in sign.</summary>
    N4,

    /// <summary>Nelson test 5, two of three points in a row in zone A or beyond, one side (flags equal <see cref="WE2"/>).</summary>
    N5,

    /// <summary>Nelson test 6, four of five points in a row in zone B or beyond, one side (flags equal <see cref="WE3"/>).</summary>
    N6,

    /// <summary>Nelson test 7, fifteen points in a row in zone C: |z| ≤ 1 for 15 in a row.</summary>
    N7,

    /// <summary>Nelson test 8, eight points in a row with none in zone C: |z| &gt; 1 for 8 in a row (both sides need not be present).</summary>
    N8,
}
