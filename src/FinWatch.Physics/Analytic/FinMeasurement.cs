namespace FinWatch.Physics.Analytic;

/// <summary>One measured fin as the analytic model takes it (G.2 step 1). All lengths in nm.</summary>
/// <param name="Profile">W_t, W_b (straight-sidewall extrapolation, A.2/A.5), H (gated height) and r.</param>
/// <param name="EotNm">Gate dielectric as EOT, Σ tᵢ·3.9/kᵢ, in nm (A.6).</param>
/// <param name="PhysicalThicknessNm">
/// Physical dielectric thickness Σ tᵢ in nm (A.6). Carried for the stamp and the 2-D solver; the analytic D.2
/// corner form uses EOT only (its physical-thickness term, D.3, is a 2-D-solver calibration).
/// </param>
/// <param name="Faces">Gated faces: tri-gate, or double gate under a hard mask (A.7).</param>
public readonly record struct FinMeasurement(FinProfile Profile, double EotNm, double PhysicalThicknessNm, GateFaces Faces);
