namespace Thermostrat.Model.Numerics.Ode;

/// <summary>
/// Reproducible standard normal variates: the xoshiro256** generator (Blackman and Vigna 2021, ACM Trans. Math. Softw. 47, 36),
/// seeded through SplitMix64 (Steele, Lea and Flood 2014) as its authors recommend, and Marsaglia's polar method
/// (Marsaglia and Bray 1964, SIAM Rev. 6, 260). Equal seeds give equal streams on every platform and runtime version.
/// </summary>
internal struct GaussianSource
{
    private ulong _s0, _s1, _s2, _s3;
    private double _spare;
    private bool _hasSpare;

    public GaussianSource(ulong seed)
    {
        ulong x = seed;
        _s0 = SplitMix64(ref x);
        _s1 = SplitMix64(ref x);
        _s2 = SplitMix64(ref x);
        _s3 = SplitMix64(ref x);
        _spare = 0;
        _hasSpare = false;
    }

    private static ulong SplitMix64(ref ulong x)
    {
        ulong z = x += 0x9E3779B97F4A7C15UL;
        z = (z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL;
        z = (z ^ (z >> 27)) * 0x94D049BB133111EBUL;
        return z ^ (z >> 31);
    }

    /// <summary>The next 64 random bits.</summary>
    public ulong NextUInt64()
    {
        ulong result = ulong.RotateLeft(_s1 * 5, 7) * 9;
        ulong t = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform on [0, 1) with 53 random bits.</summary>
    public double NextUniform() => (NextUInt64() >> 11) * (1.0 / (1UL << 53));

    /// <summary>A standard normal variate.</summary>
    public double NextGaussian()
    {
        if (_hasSpare)
        {
            _hasSpare = false;
            return _spare;
        }
        double u, v, s;
        do
        {
            u = 2.0 * NextUniform() - 1.0;
            v = 2.0 * NextUniform() - 1.0;
            s = u * u + v * v;
        } while (s >= 1.0 || s == 0.0);
        double m = Math.Sqrt(-2.0 * Math.Log(s) / s);
        _spare = v * m;
        _hasSpare = true;
        return u * m;
    }
}
