namespace FinWatch.Physics.Analytic;

/// <summary>The independent sensitivity basis of G.4 (never W_t, W_b and θ together).</summary>
public enum SensitivityParameter
{
    /// <summary>w_mid, mid-height width; per nm; step 0.1 nm.</summary>
    MidWidth,

    /// <summary>θ at fixed w_mid; per degree; step 0.2°.</summary>
    Taper,

    /// <summary>H at fixed w_mid and θ; per nm; step 0.5 nm.</summary>
    Height,

    /// <summary>r, top-corner radius; per nm; step 0.1 nm.</summary>
    CornerRadius,

    /// <summary>EOT; per nm; step 0.02 nm.</summary>
    Eot,

    /// <summary>L_eff; per nm; step 0.2 nm.</summary>
    GateLength,

    /// <summary>N_A; per 1e17 cm⁻³; step 1e16 cm⁻³.</summary>
    Doping,
}
