using System.Diagnostics.CodeAnalysis;
using System.Runtime.CompilerServices;

namespace FinWatch.Physics;

/// <summary>
/// Pure geometry of the fin cross-section (docs/model.md §A): taper angle, local and
/// mid-height width, the rounded-top trapezoid's area, gated perimeter and inside test.
/// </summary>
/// <remarks>
/// <para>
/// Coordinates: x is measured in nm from the fin centre line (the fin is mirror-symmetric in x), z in nm up from
/// the fin foot (z = 0, the isolation top) to the top (z = H). Angles are in radians unless the name says
/// degrees. The taper angle θ is the angle of each sidewall from vertical, positive when the fin is wider at its
/// foot.
/// </para>
/// <para>
/// Each top corner is rounded by an arc of radius r tangent to the top and to the sidewall (A.4). The tangent
/// length from the sharp vertex is t = r·tan(π/4 − θ/2). The radius is limited by t ≤ W_t/2 (the flat top
/// vanishes at r_max = (W_t/2)·tan(π/4 + θ/2)) and by t ≤ H/cos θ (the sidewall tangent point stays above the
/// foot; this only binds for fins wider than about twice their height). The profile-taking methods use the
/// radius clipped to that limit; <see cref="Derive(in FinProfile, GateFaces)"/> also reports whether it clipped.
/// </para>
/// <para>
/// Caller mistakes throw <see cref="ArgumentOutOfRangeException"/>: a non-finite or non-positive width or height,
/// a non-finite or negative radius, a NaN coordinate. There is no other range check, so physically odd but
/// finite input (a re-entrant fin, a taper close to ±90°) returns finite results; lengths up to about 1e150 nm
/// keep every result finite.
/// </para>
/// <para>
/// Every method is allocation-free, uses plain arithmetic and a few calls to <see cref="Math"/>, and is safe to call
/// concurrently.
/// </para>
/// </remarks>
public static class FinCrossSection
{
    private const double HalfPi = Math.PI / 2;

    /// <summary>
    /// Sidewall taper angle θ = atan((W_b − W_t)/(2H)) from vertical, per sidewall, in radians (A.1).
    /// </summary>
    /// <param name="topWidthNm">W_t in nm; finite and &gt; 0.</param>
    /// <param name="bottomWidthNm">W_b in nm; finite and &gt; 0.</param>
    /// <param name="heightNm">H in nm; finite and &gt; 0.</param>
    /// <returns>
    /// θ in radians, in [−π/2, π/2]: 0 for a vertical fin, positive when the fin is wider at its foot, negative
    /// for a re-entrant fin (W_t &gt; W_b).
    /// </returns>
    /// <exception cref="ArgumentOutOfRangeException">A width or the height is non-finite or ≤ 0.</exception>
    public static double TaperAngleRad(double topWidthNm, double bottomWidthNm, double heightNm)
    {
        RequirePositiveFinite(topWidthNm);
        RequirePositiveFinite(bottomWidthNm);
        RequirePositiveFinite(heightNm);
        return TaperCore(topWidthNm, bottomWidthNm, heightNm);
    }

    /// <summary>
    /// Sidewall taper angle θ = atan((W_b − W_t)/(2H)) from vertical, per sidewall, in degrees (A.1).
    /// </summary>
    /// <param name="topWidthNm">W_t in nm; finite and &gt; 0.</param>
    /// <param name="bottomWidthNm">W_b in nm; finite and &gt; 0.</param>
    /// <param name="heightNm">H in nm; finite and &gt; 0.</param>
    /// <returns>θ in degrees, in [−90°, 90°]; positive when the fin is wider at its foot.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A width or the height is non-finite or ≤ 0.</exception>
    public static double TaperAngleDeg(double topWidthNm, double bottomWidthNm, double heightNm) =>
        ToDegrees(TaperAngleRad(topWidthNm, bottomWidthNm, heightNm));

    /// <summary>
    /// Straight-sidewall width w(z) = W_b + (W_t − W_b)·z/H at height <paramref name="zNm"/> above the foot (A.2).
    /// </summary>
    /// <remarks>
    /// This is the width of the sharp trapezoid: the corner rounding is ignored, so near the top the material
    /// width is smaller than this. Heights outside [0, H] are not clamped: the straight sidewall line is
    /// extrapolated, and far enough beyond a narrowing end the result becomes ≤ 0.
    /// </remarks>
    /// <param name="p">The profile; validated as described on <see cref="FinCrossSection"/>.</param>
    /// <param name="zNm">Height above the fin foot in nm; finite. Normally in [0, H].</param>
    /// <returns>The width in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The profile is invalid or <paramref name="zNm"/> is non-finite.</exception>
    public static double LocalWidthNm(in FinProfile p, double zNm)
    {
        ValidateProfile(p);
        RequireFinite(zNm);
        return p.BottomWidthNm + ((p.TopWidthNm - p.BottomWidthNm) * (zNm / p.HeightNm));
    }

    /// <summary>
    /// Top and bottom widths of the straight-sidewall trapezoid from widths measured at two heights (A.2):
    /// the line w(z) = w₁ + (w₂ − w₁)(z − z₁)/(z₂ − z₁) is evaluated at z = H and z = 0.
    /// </summary>
    /// <remarks>
    /// The two points may be given in either order and may lie outside [0, H]. The results are returned as
    /// computed: if the measured line reaches zero width inside [0, H] a returned width is ≤ 0, which the
    /// profile-taking methods then reject, so check them before building a <see cref="FinProfile"/>.
    /// </remarks>
    /// <param name="w1Nm">w₁: width measured at <paramref name="z1Nm"/>, in nm; finite and &gt; 0.</param>
    /// <param name="z1Nm">z₁: height of the first measurement above the fin foot, in nm; finite.</param>
    /// <param name="w2Nm">w₂: width measured at <paramref name="z2Nm"/>, in nm; finite and &gt; 0.</param>
    /// <param name="z2Nm">z₂: height of the second measurement above the fin foot, in nm; finite and ≠ z₁.</param>
    /// <param name="heightNm">H: active fin height in nm; finite and &gt; 0.</param>
    /// <returns>(W_t, W_b) = (w(H), w(0)) in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">
    /// A width or the height is non-finite or ≤ 0, a height is non-finite, or z₂ = z₁.
    /// </exception>
    public static (double TopWidthNm, double BottomWidthNm) ExtrapolateWidths(
        double w1Nm, double z1Nm, double w2Nm, double z2Nm, double heightNm)
    {
        RequirePositiveFinite(w1Nm);
        RequireFinite(z1Nm);
        RequirePositiveFinite(w2Nm);
        RequireFinite(z2Nm);
        RequirePositiveFinite(heightNm);
        ArgumentOutOfRangeException.ThrowIfEqual(z2Nm, z1Nm);

        double slope = (w2Nm - w1Nm) / (z2Nm - z1Nm);
        return (w1Nm + (slope * (heightNm - z1Nm)), w1Nm - (slope * z1Nm));
    }

    /// <summary>
    /// Mid-height width w_mid = w(H/2) = (W_t + W_b)/2 of the straight-sidewall trapezoid, in nm (A.3).
    /// </summary>
    /// <param name="topWidthNm">W_t in nm; finite and &gt; 0.</param>
    /// <param name="bottomWidthNm">W_b in nm; finite and &gt; 0.</param>
    /// <returns>w_mid in nm.</returns>
    /// <exception cref="ArgumentOutOfRangeException">A width is non-finite or ≤ 0.</exception>
    public static double MidHeightWidthNm(double topWidthNm, double bottomWidthNm)
    {
        RequirePositiveFinite(topWidthNm);
        RequirePositiveFinite(bottomWidthNm);
        return (0.5 * topWidthNm) + (0.5 * bottomWidthNm);
    }

    /// <summary>
    /// Tangent length t = r·tan(π/4 − θ/2) from the sharp top vertex to either tangent point of the corner arc,
    /// in nm (A.4). The interior angle at the top corner is α = π/2 + θ, and t = r·cot(α/2).
    /// </summary>
    /// <remarks>
    /// The tangent is evaluated as cos θ/(1 + sin θ) for θ ≥ 0 and (1 − sin θ)/cos θ for θ &lt; 0, which are
    /// identities for tan(π/4 − θ/2) without cancellation, and give exactly t = r at θ = 0. The radius is not
    /// checked against r_max here.
    /// </remarks>
    /// <param name="radiusNm">r: corner radius in nm; finite and ≥ 0.</param>
    /// <param name="taperRad">θ: taper angle in radians, as from <see cref="TaperAngleRad"/>; finite and |θ| ≤ π/2.</param>
    /// <returns>t in nm; 0 when r = 0.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The radius is non-finite or negative, or θ is non-finite or |θ| &gt; π/2.</exception>
    public static double CornerTangentLengthNm(double radiusNm, double taperRad)
    {
        RequireNonNegativeFinite(radiusNm);
        RequireTaper(taperRad);
        (double sin, double cos) = Math.SinCos(taperRad);
        return radiusNm * TangentFactor(sin, cos);
    }

    /// <summary>
    /// Largest corner radius the top can hold, r_max = (W_t/2)·tan(π/4 + θ/2), in nm (A.4): at r_max the two
    /// tangent points meet at the top centre (t = W_t/2) and the flat top vanishes. r_max = W_t/2 for θ = 0.
    /// </summary>
    /// <remarks>
    /// This is the top-width limit only. <see cref="Derive(in FinProfile, GateFaces)"/> also applies the
    /// sidewall-length limit t ≤ H/cos θ, which binds only for fins wider than about twice their height.
    /// </remarks>
    /// <param name="topWidthNm">W_t in nm; finite and &gt; 0.</param>
    /// <param name="taperRad">θ: taper angle in radians, as from <see cref="TaperAngleRad"/>; finite and |θ| ≤ π/2.</param>
    /// <returns>r_max in nm (&gt; 0).</returns>
    /// <exception cref="ArgumentOutOfRangeException">The width is non-finite or ≤ 0, or θ is non-finite or |θ| &gt; π/2.</exception>
    public static double MaxCornerRadiusNm(double topWidthNm, double taperRad)
    {
        RequirePositiveFinite(topWidthNm);
        RequireTaper(taperRad);
        (double sin, double cos) = Math.SinCos(taperRad);
        return 0.5 * topWidthNm / TangentFactor(sin, cos);
    }

    /// <summary>
    /// Area of the rounded-top trapezoid, A = (W_t + W_b)H/2 − 2·A_cut with A_cut = r·t − (r²/2)(π/2 − θ)
    /// per corner, in nm² (A.4).
    /// </summary>
    /// <remarks>
    /// A radius above the limit (see <see cref="FinCrossSection"/>) is clipped to it, exactly as in
    /// <see cref="Derive(in FinProfile, GateFaces)"/>, which also reports the clipping.
    /// </remarks>
    /// <param name="p">The profile; validated as described on <see cref="FinCrossSection"/>.</param>
    /// <returns>The area in nm² (&gt; 0).</returns>
    /// <exception cref="ArgumentOutOfRangeException">The profile is invalid.</exception>
    public static double AreaNm2(in FinProfile p)
    {
        ValidateProfile(p);
        return Area(p, Resolve(p));
    }

    /// <summary>
    /// Gated perimeter of the rounded-top trapezoid, in nm (A.4, A.7).
    /// </summary>
    /// <remarks>
    /// <para>
    /// <see cref="GateFaces.TriGate"/>: P = (W_t − 2t) + 2(H/cos θ − t) + 2r(π/2 − θ), the flat top, the two
    /// straight sidewall segments and the two corner arcs (A.4; π/2 − θ = π − α is the arc angle).
    /// </para>
    /// <para>
    /// <see cref="GateFaces.DoubleGate"/>: P = 2(H/cos θ − t), the two straight sidewall segments only. A.7
    /// removes the top channel and the top corners, so the arcs are not counted as gated either, even though
    /// they lie partly on the sidewall side of the corner. With r = 0 this is the full sidewall length 2H/cos θ.
    /// </para>
    /// <para>A radius above the limit is clipped to it, as in <see cref="Derive(in FinProfile, GateFaces)"/>.</para>
    /// </remarks>
    /// <param name="p">The profile; validated as described on <see cref="FinCrossSection"/>.</param>
    /// <param name="faces">Which faces are gated.</param>
    /// <returns>The gated perimeter in nm (≥ 0).</returns>
    /// <exception cref="ArgumentOutOfRangeException">The profile is invalid or <paramref name="faces"/> is not a defined value.</exception>
    public static double GatedPerimeterNm(in FinProfile p, GateFaces faces)
    {
        ValidateProfile(p);
        RequireFaces(faces);
        return Perimeter(p, Resolve(p), faces);
    }

    /// <summary>
    /// Whether the point (x, z) lies in the rounded-top trapezoid (A.4): inside the sharp trapezoid and not in
    /// either corner cut. A point is in the right corner cut when its polar angle about the arc centre
    /// (W_t/2 − t, H − r) lies in (θ, π/2) and its distance from the centre exceeds r; the left corner is the
    /// mirror image, so the test uses |x|.
    /// </summary>
    /// <remarks>
    /// The region is closed: points on the sidewalls, the foot, the flat top and the arcs count as inside.
    /// A radius above the limit is clipped to it, as in <see cref="AreaNm2(in FinProfile)"/>, so the set of
    /// inside points has exactly that area.
    /// </remarks>
    /// <param name="p">The profile; validated as described on <see cref="FinCrossSection"/>.</param>
    /// <param name="xNm">Horizontal position from the fin centre line, in nm; not NaN (±∞ is outside).</param>
    /// <param name="zNm">Height above the fin foot, in nm; not NaN (±∞ is outside).</param>
    /// <returns><see langword="true"/> when the point is inside or on the boundary.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The profile is invalid or a coordinate is NaN.</exception>
    public static bool IsInside(in FinProfile p, double xNm, double zNm)
    {
        ValidateProfile(p);
        RequireNotNaN(xNm);
        RequireNotNaN(zNm);

        if (zNm < 0 || zNm > p.HeightNm)
        {
            return false;
        }

        double ax = Math.Abs(xNm);
        double halfWidth = 0.5 * (p.BottomWidthNm + ((p.TopWidthNm - p.BottomWidthNm) * (zNm / p.HeightNm)));
        if (ax > halfWidth)
        {
            return false;
        }

        Corner c = Resolve(p);
        if (c.Radius == 0)
        {
            return true;
        }

        // Offsets from the right arc centre (W_t/2 − t, H − r).
        double dx = ax - ((0.5 * p.TopWidthNm) - c.Tangent);
        double dz = zNm - (p.HeightNm - c.Radius);

        // The wedge of polar angles (θ, π/2) is convex (its opening π/2 − θ is below π), so it is the
        // intersection of two half-planes: right of the vertical ray (dx > 0) and left of the ray along the
        // sidewall normal (cos θ, sin θ), i.e. a positive cross product.
        bool inWedge = dx > 0 && ((c.Cos * dz) - (c.Sin * dx)) > 0;
        return !inWedge || ((dx * dx) + (dz * dz)) <= c.Radius * c.Radius;
    }

    /// <summary>
    /// All derived quantities of a profile at once: taper, mid-height width, area, gated perimeter, radius limit,
    /// radius used and flags (A.1–A.4, A.7).
    /// </summary>
    /// <remarks>
    /// <para>
    /// <see cref="GeometryFlags.ReEntrant"/> is set when W_t &gt; W_b (negative taper).
    /// <see cref="GeometryFlags.RadiusExceedsMax"/> is set when r exceeds the limit reported in
    /// <see cref="FinGeometry.MaxCornerRadiusNm"/>: the A.4 value r_max = (W_t/2)·tan(π/4 + θ/2) of
    /// <see cref="MaxCornerRadiusNm(double, double)"/>, or the sidewall-length limit (t ≤ H/cos θ) when that is
    /// smaller. The comparison is strict, and the limit is computed with the same arithmetic as the public
    /// method, so a radius set to <see cref="MaxCornerRadiusNm(double, double)"/> is not flagged.
    /// Area and perimeter then use r clipped to the limit (<see cref="FinGeometry.CornerRadiusUsedNm"/>).
    /// </para>
    /// <para>The results equal those of the individual methods for the same profile.</para>
    /// </remarks>
    /// <param name="p">The profile; validated as described on <see cref="FinCrossSection"/>.</param>
    /// <param name="faces">Which faces are gated; affects only <see cref="FinGeometry.GatedPerimeterNm"/>.</param>
    /// <returns>The derived geometry.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The profile is invalid or <paramref name="faces"/> is not a defined value.</exception>
    public static FinGeometry Derive(in FinProfile p, GateFaces faces)
    {
        ValidateProfile(p);
        RequireFaces(faces);
        Corner c = Resolve(p);

        GeometryFlags flags = GeometryFlags.None;
        if (p.TopWidthNm > p.BottomWidthNm)
        {
            flags |= GeometryFlags.ReEntrant;
        }

        if (p.CornerRadiusNm > c.RadiusLimit)
        {
            flags |= GeometryFlags.RadiusExceedsMax;
        }

        return new FinGeometry(
            TaperDeg: ToDegrees(c.Theta),
            MidWidthNm: (0.5 * p.TopWidthNm) + (0.5 * p.BottomWidthNm),
            AreaNm2: Area(p, c),
            GatedPerimeterNm: Perimeter(p, c, faces),
            MaxCornerRadiusNm: c.RadiusLimit,
            CornerRadiusUsedNm: c.Radius,
            Flags: flags);
    }

    /// <summary>Corner quantities of a validated profile, with the radius already clipped.</summary>
    private readonly record struct Corner(
        double Theta, double Sin, double Cos, double SideLength, double RadiusLimit, double Radius, double Tangent);

    private static Corner Resolve(in FinProfile p)
    {
        double theta = TaperCore(p.TopWidthNm, p.BottomWidthNm, p.HeightNm);
        (double sin, double cos) = Math.SinCos(theta);
        double k = TangentFactor(sin, cos);
        double halfTop = 0.5 * p.TopWidthNm;
        double side = p.HeightNm / cos;

        // Same expression as MaxCornerRadiusNm, so a radius taken from it round-trips without being flagged.
        double limit = Math.Min(halfTop / k, side / k);
        double r = Math.Min(p.CornerRadiusNm, limit);

        // At the limit r·k can exceed W_t/2 (or the sidewall length) by an ulp; clamp so the flat top and the
        // straight sidewall segment are never negative.
        double t = Math.Min(r * k, Math.Min(halfTop, side));
        return new Corner(theta, sin, cos, side, limit, r, t);
    }

    private static double Area(in FinProfile p, in Corner c)
    {
        double trapezoid = 0.5 * (p.TopWidthNm + p.BottomWidthNm) * p.HeightNm;
        double cut = (c.Radius * c.Tangent) - (0.5 * c.Radius * c.Radius * (HalfPi - c.Theta));
        return trapezoid - (2 * cut);
    }

    private static double Perimeter(in FinProfile p, in Corner c, GateFaces faces)
    {
        double sidewalls = 2 * (c.SideLength - c.Tangent);
        return faces == GateFaces.TriGate
            ? (p.TopWidthNm - (2 * c.Tangent)) + sidewalls + (2 * c.Radius * (HalfPi - c.Theta))
            : sidewalls;
    }

    private static double TaperCore(double topWidthNm, double bottomWidthNm, double heightNm) =>
        Math.Atan((bottomWidthNm - topWidthNm) / (2 * heightNm));

    /// <summary>tan(π/4 − θ/2), written so that neither branch cancels; exactly 1 at θ = 0.</summary>
    private static double TangentFactor(double sin, double cos) =>
        sin >= 0 ? cos / (1 + sin) : (1 - sin) / cos;

    private static double ToDegrees(double radians) => radians * (180.0 / Math.PI);

    private static void ValidateProfile(in FinProfile p)
    {
        RequirePositiveFinite(p.TopWidthNm);
        RequirePositiveFinite(p.BottomWidthNm);
        RequirePositiveFinite(p.HeightNm);
        RequireNonNegativeFinite(p.CornerRadiusNm);
    }

    // Finiteness is checked first: ThrowIfNegativeOrZero reads the sign bit, so it would let +NaN and +∞ through.
    private static void RequirePositiveFinite(double value, [CallerArgumentExpression(nameof(value))] string? paramName = null)
    {
        RequireFinite(value, paramName);
        ArgumentOutOfRangeException.ThrowIfNegativeOrZero(value, paramName);
    }

    private static void RequireNonNegativeFinite(double value, [CallerArgumentExpression(nameof(value))] string? paramName = null)
    {
        RequireFinite(value, paramName);
        ArgumentOutOfRangeException.ThrowIfNegative(value, paramName);
    }

    private static void RequireFinite(double value, [CallerArgumentExpression(nameof(value))] string? paramName = null)
    {
        if (!double.IsFinite(value))
        {
            ThrowOutOfRange(paramName, value, "The value must be finite.");
        }
    }

    private static void RequireNotNaN(double value, [CallerArgumentExpression(nameof(value))] string? paramName = null)
    {
        if (double.IsNaN(value))
        {
            ThrowOutOfRange(paramName, value, "The value must not be NaN.");
        }
    }

    private static void RequireTaper(double taperRad, [CallerArgumentExpression(nameof(taperRad))] string? paramName = null)
    {
        if (!(Math.Abs(taperRad) <= HalfPi))
        {
            ThrowOutOfRange(paramName, taperRad, "The taper angle must be finite and within [-pi/2, pi/2] rad.");
        }
    }

    private static void RequireFaces(GateFaces faces)
    {
        if (faces is not (GateFaces.TriGate or GateFaces.DoubleGate))
        {
            ThrowOutOfRange(nameof(faces), faces, "Unknown gated-faces value.");
        }
    }

    [DoesNotReturn]
    private static void ThrowOutOfRange(string? paramName, object actualValue, string message) =>
        throw new ArgumentOutOfRangeException(paramName, actualValue, message);
}
