namespace FinWatch.Physics.Solver;

/// <summary>
/// The uniform square grid of the 2-D solver (docs/model.md §F.2, F.3). Nodes are stored row by row,
/// x fastest: node (i, j) has index j·<see cref="NodesX"/> + i and sits at
/// (<see cref="OriginXNm"/> + i·h, <see cref="OriginYNm"/> + j·h). x is measured from the fin centre line and y
/// (the z of <see cref="FinCrossSection"/>) up from the fin foot; the grid is symmetric about x = 0.
/// </summary>
/// <param name="NodesX">Number of nodes across (x), odd, so that x = 0 is a node.</param>
/// <param name="NodesY">Number of node rows (y).</param>
/// <param name="OriginXNm">x of node column 0, in nm (negative).</param>
/// <param name="OriginYNm">y of node row 0, in nm: −t_box.</param>
/// <param name="SpacingNm">Grid spacing h in nm.</param>
public readonly record struct SolverGrid(int NodesX, int NodesY, double OriginXNm, double OriginYNm, double SpacingNm)
{
    /// <summary>Total number of nodes, NodesX·NodesY.</summary>
    public int NodeCount => checked(NodesX * NodesY);

    /// <summary>x of node column <paramref name="i"/>, in nm.</summary>
    /// <param name="i">Column index, 0 ≤ i &lt; <see cref="NodesX"/>.</param>
    /// <returns>x in nm.</returns>
    public double XNm(int i) => OriginXNm + (i * SpacingNm);

    /// <summary>y of node row <paramref name="j"/>, in nm.</summary>
    /// <param name="j">Row index, 0 ≤ j &lt; <see cref="NodesY"/>.</param>
    /// <returns>y in nm.</returns>
    public double YNm(int j) => OriginYNm + (j * SpacingNm);

    /// <summary>Linear index of node (i, j) in the maps.</summary>
    /// <param name="i">Column index.</param>
    /// <param name="j">Row index.</param>
    /// <returns>j·NodesX + i.</returns>
    public int Index(int i, int j) => checked((j * NodesX) + i);
}
