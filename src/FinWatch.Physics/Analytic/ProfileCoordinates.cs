namespace FinWatch.Physics.Analytic;

/// <summary>
/// A fin in the independent profile basis of G.4: w_mid (nm), θ at fixed w_mid (degrees), H (nm), r (nm), EOT (nm).
/// W_t = w_mid − H·tan θ and W_b = w_mid + H·tan θ (A.1, A.3). The height direction keeps W_t and W_b fixed
/// (so θ follows H); the taper direction keeps w_mid and H fixed. This is the chart in which the G.4 example of docs/model.md
/// table was computed ([D] prototype: its H row equals the fixed-W_t/W_b derivative).
/// </summary>
/// <param name="MidWidthNm">w_mid in nm.</param>
/// <param name="TaperDeg">θ in degrees (positive: wider foot).</param>
/// <param name="HeightNm">H in nm.</param>
/// <param name="CornerRadiusNm">r in nm.</param>
/// <param name="EotNm">EOT in nm.</param>
public readonly record struct ProfileCoordinates(double MidWidthNm, double TaperDeg, double HeightNm, double CornerRadiusNm, double EotNm)
{
    /// <summary>The coordinates of a measured fin.</summary>
    /// <param name="fin">The fin; its profile must be valid for <see cref="FinCrossSection"/>.</param>
    /// <returns>The coordinates.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The profile is invalid.</exception>
    public static ProfileCoordinates From(in FinMeasurement fin)
    {
        FinProfile p = fin.Profile;
        return new ProfileCoordinates(
            FinCrossSection.MidHeightWidthNm(p.TopWidthNm, p.BottomWidthNm),
            FinCrossSection.TaperAngleDeg(p.TopWidthNm, p.BottomWidthNm, p.HeightNm),
            p.HeightNm,
            p.CornerRadiusNm,
            fin.EotNm);
    }

    /// <summary>The profile with these coordinates: W_t = w_mid − H tan θ, W_b = w_mid + H tan θ.</summary>
    /// <returns>The profile (not validated here).</returns>
    public FinProfile ToProfile()
    {
        double half = HeightNm * Math.Tan(TaperDeg * Math.PI / 180);
        return new FinProfile(MidWidthNm - half, MidWidthNm + half, HeightNm, CornerRadiusNm);
    }

    /// <summary>The taper, in degrees, that keeps this fin's W_b − W_t at another height: atan(tan θ·H/H′).</summary>
    /// <param name="heightNm">H′ in nm; finite and &gt; 0.</param>
    /// <returns>θ′ in degrees.</returns>
    public double TaperAtHeightDeg(double heightNm) => heightNm == HeightNm
        ? TaperDeg
        : Math.Atan(Math.Tan(TaperDeg * Math.PI / 180) * HeightNm / heightNm) * 180 / Math.PI;

    /// <summary>The value of one profile parameter.</summary>
    /// <param name="parameter">A profile parameter (not <see cref="SensitivityParameter.GateLength"/> or <see cref="SensitivityParameter.Doping"/>).</param>
    /// <returns>The value in the parameter's unit.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The parameter is not a profile parameter.</exception>
    public double Get(SensitivityParameter parameter) => parameter switch
    {
        SensitivityParameter.MidWidth => MidWidthNm,
        SensitivityParameter.Taper => TaperDeg,
        SensitivityParameter.Height => HeightNm,
        SensitivityParameter.CornerRadius => CornerRadiusNm,
        SensitivityParameter.Eot => EotNm,
        _ => throw new ArgumentOutOfRangeException(nameof(parameter)),
    };

    /// <summary>A copy with one profile parameter replaced.</summary>
    /// <param name="parameter">A profile parameter.</param>
    /// <param name="value">The new value in the parameter's unit.</param>
    /// <returns>The new coordinates.</returns>
    /// <exception cref="ArgumentOutOfRangeException">The parameter is not a profile parameter.</exception>
    public ProfileCoordinates With(SensitivityParameter parameter, double value) => parameter switch
    {
        SensitivityParameter.MidWidth => this with { MidWidthNm = value },
        SensitivityParameter.Taper => this with { TaperDeg = value },
        SensitivityParameter.Height => this with { HeightNm = value, TaperDeg = TaperAtHeightDeg(value) },
        SensitivityParameter.CornerRadius => this with { CornerRadiusNm = value },
        SensitivityParameter.Eot => this with { EotNm = value },
        _ => throw new ArgumentOutOfRangeException(nameof(parameter)),
    };
}
