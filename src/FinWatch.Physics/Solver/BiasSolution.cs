namespace FinWatch.Physics.Solver;

/// <summary>
/// The converged solution at one gate voltage (docs/model.md §F.4, F.6): potential and electron maps on
/// the grid, the charges per unit channel length and the Newton convergence record.
/// </summary>
public sealed class BiasSolution
{
    internal BiasSolution(
        SolverGrid grid,
        double gateVoltageV,
        double[] potentialV,
        double[] electronDensityCm3,
        double[] siliconFraction,
        double electronsPerNm,
        double siliconChargeElementaryPerNm,
        double gateChargeElementaryPerNm,
        int newtonIterations,
        double finalUpdateV)
    {
        Grid = grid;
        GateVoltageV = gateVoltageV;
        PotentialV = potentialV;
        ElectronDensityCm3 = electronDensityCm3;
        SiliconFraction = siliconFraction;
        ElectronsPerNm = electronsPerNm;
        SiliconChargeElementaryPerNm = siliconChargeElementaryPerNm;
        GateChargeElementaryPerNm = gateChargeElementaryPerNm;
        NewtonIterations = newtonIterations;
        FinalUpdateV = finalUpdateV;
    }

    /// <summary>The grid the maps live on (index = j·NodesX + i).</summary>
    public SolverGrid Grid { get; }

    /// <summary>Gate voltage V_G in V.</summary>
    public double GateVoltageV { get; }

    /// <summary>Electrostatic potential ψ at every node, in V, referred to the intrinsic level (section 0).</summary>
    public double[] PotentialV { get; }

    /// <summary>Electron density n = nᵢ·e^{ψ/v_t} at every node whose control volume holds silicon, in cm⁻³; 0 elsewhere.</summary>
    public double[] ElectronDensityCm3 { get; }

    /// <summary>Silicon fraction f_si of every control volume (fraction of h², from 4 × 4 sub-samples, F.3).</summary>
    public double[] SiliconFraction { get; }

    /// <summary>Electron line density N′ = Σ h² f_si n per nm of channel length, in nm⁻¹ (F.6); ×1e7 for cm⁻¹.</summary>
    public double ElectronsPerNm { get; }

    /// <summary>Silicon space charge Σ h² f_si (p − n − N_A) per nm of channel length, in elementary charges per nm (negative for electrons/acceptors).</summary>
    public double SiliconChargeElementaryPerNm { get; }

    /// <summary>Gate charge per nm of channel length from the flux into the gate nodes, in elementary charges per nm; equals −<see cref="SiliconChargeElementaryPerNm"/> (Gauss).</summary>
    public double GateChargeElementaryPerNm { get; }

    /// <summary>Newton iterations used at this bias.</summary>
    public int NewtonIterations { get; }

    /// <summary>max|δψ| of the last Newton step, in V (&lt; 1e-8 V on success).</summary>
    public double FinalUpdateV { get; }

    /// <summary>Potential at (x, y) by bilinear interpolation of the nodal ψ, in V; NaN outside the grid.</summary>
    /// <param name="xNm">x from the fin centre line, in nm.</param>
    /// <param name="yNm">y above the fin foot, in nm.</param>
    /// <returns>ψ in V.</returns>
    public double PotentialAtV(double xNm, double yNm)
    {
        double h = Grid.SpacingNm;
        double u = (xNm - Grid.OriginXNm) / h;
        double v = (yNm - Grid.OriginYNm) / h;
        if (!(u >= 0 && v >= 0 && u <= Grid.NodesX - 1 && v <= Grid.NodesY - 1))
        {
            return double.NaN;
        }

        int i = Math.Min((int)u, Grid.NodesX - 2);
        int j = Math.Min((int)v, Grid.NodesY - 2);
        double fu = u - i;
        double fv = v - j;
        double p00 = PotentialV[Grid.Index(i, j)];
        double p10 = PotentialV[Grid.Index(i + 1, j)];
        double p01 = PotentialV[Grid.Index(i, j + 1)];
        double p11 = PotentialV[Grid.Index(i + 1, j + 1)];
        return ((1 - fv) * (((1 - fu) * p00) + (fu * p10))) + (fv * (((1 - fu) * p01) + (fu * p11)));
    }
}
