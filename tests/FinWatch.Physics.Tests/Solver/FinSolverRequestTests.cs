using FinWatch.Physics.Solver;

namespace FinWatch.Physics.Tests.Solver;

/// <summary>Shape key and validation of <see cref="FinSolverRequest"/> (task brief: deterministic, rounded cache key).</summary>
public sealed class FinSolverRequestTests
{
    private static FinSolverRequest Nominal() => new()
    {
        Profile = new FinProfile(8, 9, 40, 2),
        DielectricLayers = [new DielectricLayer(0.5, 3.9), new DielectricLayer(1.5, 20)],
        AcceptorDensityCm3 = 1e18,
    };

    [Fact]
    public void ShapeKey_EqualInputsInSeparateInstances_AreEqual()
    {
        // Source: task brief — deterministic shape key of rounded inputs; STYLE 3.3.3 — caller mistakes throw.
        Assert.Equal(Nominal().ShapeKey, Nominal().ShapeKey);
        Assert.Equal(64, Nominal().ShapeKey.Length);
    }

    [Fact]
    public void ShapeKey_DifferenceBelowRounding_IsIgnored()
    {
        // Source: task brief — deterministic shape key of rounded inputs; STYLE 3.3.3 — caller mistakes throw.
        FinSolverRequest a = Nominal();
        FinSolverRequest b = a with { Profile = a.Profile with { TopWidthNm = 8 + 1e-7 } };
        Assert.Equal(a.ShapeKey, b.ShapeKey);
    }

    [Theory]
    [InlineData("width")]
    [InlineData("layer")]
    [InlineData("doping")]
    [InlineData("faces")]
    [InlineData("grid")]
    public void ShapeKey_RelevantChange_ChangesKey(string what)
    {
        // Source: task brief — deterministic shape key of rounded inputs; STYLE 3.3.3 — caller mistakes throw.
        FinSolverRequest a = Nominal();
        FinSolverRequest b = what switch
        {
            "width" => a with { Profile = a.Profile with { TopWidthNm = 8.01 } },
            "layer" => a with { DielectricLayers = [new DielectricLayer(0.5, 3.9), new DielectricLayer(1.6, 20)] },
            "doping" => a with { AcceptorDensityCm3 = 1.01e18 },
            "faces" => a with { Faces = GateFaces.DoubleGate },
            _ => a with { GridSpacingNm = 0.1 },
        };
        Assert.NotEqual(a.ShapeKey, b.ShapeKey);
    }

    [Fact]
    public void Validate_EmptyStack_Throws()
    {
        // Source: task brief — deterministic shape key of rounded inputs; STYLE 3.3.3 — caller mistakes throw.
        Assert.Throws<ArgumentException>(() => (Nominal() with { DielectricLayers = [] }).Validate());
    }

    [Theory]
    [InlineData(0.0, 1e18, -0.2, 1.5)]
    [InlineData(0.2, -1.0, -0.2, 1.5)]
    [InlineData(0.2, 1e18, 1.0, 0.5)]
    [InlineData(0.001, 1e18, -0.2, 1.5)]
    public void Validate_OutOfRangeInput_Throws(double h, double doping, double start, double stop)
    {
        // Source: task brief — deterministic shape key of rounded inputs; STYLE 3.3.3 — caller mistakes throw.
        FinSolverRequest r = Nominal() with { GridSpacingNm = h, AcceptorDensityCm3 = doping, GateStartV = start, GateStopV = stop };
        Assert.Throws<ArgumentOutOfRangeException>(r.Validate);
    }
}
