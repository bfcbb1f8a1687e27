namespace FinWatch.Physics.Analytic;

/// <summary>Validity warnings attached to a prediction (G.2 step 1 and 7; H.1 ranges; B.5 validity).</summary>
[Flags]
public enum ModelWarnings
{
    /// <summary>No warning.</summary>
    None = 0,

    /// <summary>Mid-height width outside 5–10 nm (H.1).</summary>
    WidthOutOfRange = 1 << 0,

    /// <summary>Gated height outside 30–55 nm (H.1).</summary>
    HeightOutOfRange = 1 << 1,

    /// <summary>Taper outside 0–6° (H.1); includes re-entrant fins.</summary>
    TaperOutOfRange = 1 << 2,

    /// <summary>Corner radius outside 0–4 nm (H.1).</summary>
    RadiusOutOfRange = 1 << 3,

    /// <summary>Corner radius above r_max: clipped, the fit is inconsistent (A.4).</summary>
    RadiusExceedsMax = 1 << 4,

    /// <summary>EOT outside 0.8–1.2 nm (H.1).</summary>
    EotOutOfRange = 1 << 5,

    /// <summary>L_eff of the parameter set outside 14–26 nm (H.1).</summary>
    GateLengthOutOfRange = 1 << 6,

    /// <summary>Channel doping of the parameter set above 1e18 cm⁻³ (H.1).</summary>
    DopingOutOfRange = 1 << 7,

    /// <summary>L_eff/λ &lt; 3 somewhere in the fin: the first-mode SCE model is not meaningful (punch-through regime, B.5).</summary>
    LengthToScaleBelowThree = 1 << 8,

    /// <summary>The barrier is gone (no threshold root, B.5); the shifts are NaN.</summary>
    PunchThrough = 1 << 9,

    /// <summary>|full − linear| exceeds 20 % of |full| or 5 mV for V_T,lin or V_T,sat (G.2 step 7).</summary>
    Nonlinear = 1 << 10,

    /// <summary>The profile is not a valid fin (non-finite or non-positive size, non-positive EOT); the shifts are NaN.</summary>
    InvalidInput = 1 << 11,

    /// <summary>Physical dielectric thickness is below the EOT or not finite (A.6: Σ tᵢ ≥ EOT for k ≥ 3.9).</summary>
    DielectricInconsistent = 1 << 12,
}
