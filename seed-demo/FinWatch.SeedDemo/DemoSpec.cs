namespace FinWatch.SeedDemo;

/// <summary>
/// One specification of an invented demo product. A null limit means the spec is one-sided.
/// </summary>
/// <param name="Parameter">
/// One of <c>top_width_nm</c>, <c>bottom_width_nm</c>, <c>fin_height_nm</c>, <c>corner_radius_nm</c>,
/// <c>liner_thickness_nm</c>, <c>taper_deg</c>, <c>mid_width_nm</c>.
/// </param>
/// <param name="Lower">Lower spec limit, or null when there is none.</param>
/// <param name="Target">Target value, or null when there is none.</param>
/// <param name="Upper">Upper spec limit, or null when there is none.</param>
public sealed record DemoSpec(string Parameter, double? Lower, double? Target, double? Upper);
