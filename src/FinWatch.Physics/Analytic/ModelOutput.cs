namespace FinWatch.Physics.Analytic;

/// <summary>The four reported model outputs (G.1).</summary>
public enum ModelOutput
{
    /// <summary>V_T,eff at V_DS,lin, in mV.</summary>
    ThresholdLin,

    /// <summary>V_T,eff at V_DS,sat, in mV.</summary>
    ThresholdSat,

    /// <summary>S_eff at V_DS,lin, in mV/decade.</summary>
    SwingLin,

    /// <summary>DIBL_eff between the two drain voltages, in mV/V.</summary>
    Dibl,
}
