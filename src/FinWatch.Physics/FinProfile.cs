namespace FinWatch.Physics;

/// <summary>
/// A measured fin cross-section: a symmetric trapezoid with straight sidewalls whose two top corners are
/// rounded by circular arcs (docs/model.md §A.1–A.4). All lengths are in nm.
/// </summary>
/// <remarks>
/// The record does not validate on construction (it is a plain carrier for ingested rows); every
/// <see cref="FinCrossSection"/> method that takes a profile validates it and throws
/// <see cref="ArgumentOutOfRangeException"/> for a non-finite or non-positive width or height, or a non-finite
/// or negative radius.
/// </remarks>
/// <param name="TopWidthNm">
/// W_t: width of the straight-sidewall trapezoid at the top (z = H), in nm; finite and &gt; 0. This is the
/// extrapolated sharp-corner width of A.2/A.5, not a top CD measured below a rounded top.
/// </param>
/// <param name="BottomWidthNm">W_b: width at the fin foot (z = 0, the STI top), in nm; finite and &gt; 0.</param>
/// <param name="HeightNm">H: electrically active fin height above the isolation top, in nm; finite and &gt; 0.</param>
/// <param name="CornerRadiusNm">
/// r: radius of each top-corner arc, in nm; finite and ≥ 0 (0 means sharp corners). A radius above the
/// geometric limit is flagged and clipped by <see cref="FinCrossSection.Derive(in FinProfile, GateFaces)"/>.
/// </param>
public readonly record struct FinProfile(double TopWidthNm, double BottomWidthNm, double HeightNm, double CornerRadiusNm);
