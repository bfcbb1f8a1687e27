namespace FinWatch.SeedDemo;

/// <summary>
/// Seeded random streams. Every stream is a <c>new Random(int)</c> whose seed is derived from the user's seed, so the
/// output depends on nothing but the seed (no clock, no unseeded generator).
/// </summary>
internal static class SeededRandom
{
    /// <summary>Stream ids: one planning stream, and per lot one for lot/wafer effects and one per step for site noise.</summary>
    public const int PlanStream = 0;
    public const int LotStream = 1;
    public const int ProfileNoiseStream = 2;
    public const int CdNoiseStream = 3;

    /// <summary>A generator for stream <paramref name="stream"/> of item <paramref name="item"/> under <paramref name="seed"/>.</summary>
    public static Random Create(int seed, int item, int stream) => new(DeriveSeed(seed, item, stream));

    /// <summary>Mixes the three ints with the SplitMix64 finaliser (Steele, Lea and Flood 2014) into a non-negative seed.</summary>
    public static int DeriveSeed(int seed, int item, int stream)
    {
        unchecked
        {
            ulong z = ((ulong)(uint)seed << 32) ^ ((ulong)(uint)item << 4) ^ (uint)stream;
            z += 0x9E3779B97F4A7C15UL;
            z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
            z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
            z ^= z >> 31;
            return (int)(z >> 33);
        }
    }

    /// <summary>A standard normal deviate by the Box–Muller transform (Box and Muller 1958); uses two uniforms.</summary>
    public static double NextGaussian(this Random random)
    {
        double u1 = 1.0 - random.NextDouble();
        double u2 = random.NextDouble();
        return Math.Sqrt(-2.0 * Math.Log(u1)) * Math.Cos(2.0 * Math.PI * u2);
    }

    /// <summary>A uniform deviate in [<paramref name="low"/>, <paramref name="high"/>).</summary>
    public static double NextUniform(this Random random, double low, double high) => low + (high - low) * random.NextDouble();
}
