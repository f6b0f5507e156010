namespace Lumen.Uncertainty;

/// <summary>
/// A small, fast pseudo-random stream (xoshiro256**, Blackman and Vigna 2018, public domain), seeded from a seed and a
/// stream number through SplitMix64, so draw k of a run is the same whatever thread computes it and in whatever order.
/// Normal deviates by the Box–Muller transform (both values used).
/// </summary>
internal struct RandomStream
{
    private ulong _s0, _s1, _s2, _s3;
    private double _spare;
    private bool _hasSpare;

    /// <summary>Creates stream <paramref name="stream"/> of seed <paramref name="seed"/>.</summary>
    public RandomStream(ulong seed, ulong stream)
    {
        ulong x = seed ^ (stream * 0xD1B54A32D192ED03UL);
        _s0 = SplitMix(ref x); _s1 = SplitMix(ref x); _s2 = SplitMix(ref x); _s3 = SplitMix(ref x);
        _spare = 0;
        _hasSpare = false;
    }

    private static ulong SplitMix(ref ulong x)
    {
        ulong z = x += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    private ulong Next()
    {
        ulong result = ulong.RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0; _s3 ^= _s1; _s1 ^= _s2; _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform in (0, 1): 53 random bits, never 0.</summary>
    public double NextDouble() => ((Next() >> 11) + 0.5) * (1.0 / (1UL << 53));

    /// <summary>A standard normal deviate.</summary>
    public double NextGaussian()
    {
        if (_hasSpare) { _hasSpare = false; return _spare; }
        double r = Math.Sqrt(-2 * Math.Log(NextDouble())), phi = 2 * Math.PI * NextDouble();
        _spare = r * Math.Sin(phi);
        _hasSpare = true;
        return r * Math.Cos(phi);
    }
}
