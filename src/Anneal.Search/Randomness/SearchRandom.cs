namespace Anneal.Search.Randomness;

/// <summary>
/// The searches' random source: xoshiro256** (Blackman &amp; Vigna 2018) seeded through SplitMix64, with Lemire's
/// multiply-shift for bounded draws (Lemire 2019, ACM TOMACS 29(1)). A seeded <see cref="Random"/> runs the
/// older subtractive generator, whose draws cost a visible share of a move evaluation; this one is a few
/// instructions, and it is sealed so calls through the concrete type are not virtual. Same seed, same sequence,
/// on every platform.
/// </summary>
public sealed class SearchRandom : Random
{
    private ulong _s0;
    private ulong _s1;
    private ulong _s2;
    private ulong _s3;

    public SearchRandom(int seed)
    {
        ulong x = unchecked((ulong)seed);
        _s0 = SplitMix(ref x);
        _s1 = SplitMix(ref x);
        _s2 = SplitMix(ref x);
        _s3 = SplitMix(ref x);
    }

    private static ulong SplitMix(ref ulong x)
    {
        ulong z = unchecked(x += 0x9E3779B97F4A7C15UL);
        z = unchecked((z ^ (z >> 30)) * 0xBF58476D1CE4E5B9UL);
        z = unchecked((z ^ (z >> 27)) * 0x94D049BB133111EBUL);
        return z ^ (z >> 31);
    }

    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    private ulong NextBits()
    {
        ulong result = unchecked(ulong.RotateLeft(_s1 * 5, 7) * 9);
        ulong t = _s1 << 17;
        _s2 ^= _s0;
        _s3 ^= _s1;
        _s1 ^= _s2;
        _s0 ^= _s3;
        _s2 ^= t;
        _s3 = ulong.RotateLeft(_s3, 45);
        return result;
    }

    /// <summary>Uniform in [0, maxValue); the slight bias of multiply-shift (below 2^-32 relative) is immaterial to a search.</summary>
    [System.Runtime.CompilerServices.MethodImpl(System.Runtime.CompilerServices.MethodImplOptions.AggressiveInlining)]
    public override int Next(int maxValue) => maxValue <= 0 ? 0 : (int)(((NextBits() >> 32) * (ulong)maxValue) >> 32);

    public override int Next(int minValue, int maxValue) => minValue + Next(maxValue - minValue);

    public override int Next() => (int)(NextBits() >> 33);

    public override double NextDouble() => (NextBits() >> 11) * (1.0 / (1UL << 53));

    protected override double Sample() => NextDouble();
}
