using FinWatch.Physics.Analytic;

namespace FinWatch.Physics.Tests.Analytic;

/// <summary>Nominal cached per parameter set (G.2 step 6; brief: cache the nominal per parameter set).</summary>
public sealed class ThresholdModelCacheTests
{
    [Fact]
    public void GetOrCreate_EqualParameterSets_ReturnsSameModel()
    {
        var cache = new ThresholdModelCache();
        ThresholdModel a = cache.GetOrCreate(AnalyticFixtures.G4Parameters);
        ThresholdModel b = cache.GetOrCreate(AnalyticFixtures.G4Parameters with { });
        Assert.Same(a, b);
        Assert.Equal(1, cache.Count);
    }

    [Fact]
    public void GetOrCreate_NewVersion_BuildsNewModel()
    {
        var cache = new ThresholdModelCache();
        ThresholdModel a = cache.GetOrCreate(AnalyticFixtures.G4Parameters);
        ThresholdModel b = cache.GetOrCreate(AnalyticFixtures.G4Parameters with { Version = "2" });
        Assert.NotSame(a, b);
        Assert.Equal("2", b.Predict(AnalyticFixtures.G4Nominal).ParameterSetVersion);
    }

    [Fact]
    public void GetOrCreate_PunchingThroughSet_ThrowsAndDoesNotCache()
    {
        var cache = new ThresholdModelCache();
        Assert.Throws<ArgumentException>(() => cache.GetOrCreate(AnalyticFixtures.G4Parameters with { GateLengthNm = 1.5 }));
        Assert.Equal(0, cache.Count);
    }
}
