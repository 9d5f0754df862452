/**
 * The xoshiro128** generator (Blackman & Vigna 2018, "Scrambled linear pseudorandom number generators"):
 * 128 bits of state as four unsigned 32-bit words, period 2¹²⁸ − 1. Returns a function that yields the next
 * unsigned 32-bit output (0…2³²−1) on each call. The state words are copied; the array given is never written.
 * The state must not be all zero (the one fixed point of the linear engine). Not for cryptography.
 */
export function xoshiro128StarStar(state: readonly [number, number, number, number]): () => number {
  let [s0, s1, s2, s3] = state.map((word) => word >>> 0) as [number, number, number, number];
  return () => {
    // Scrambler **: rotl(s1 · 5, 7) · 9, in 32-bit arithmetic.
    const product = Math.imul(s1, 5);
    const result = Math.imul((product << 7) | (product >>> 25), 9) >>> 0;
    // Linear engine: xorshift step then rotate s3 left by 11.
    const t = s1 << 9;
    s2 ^= s0;
    s3 ^= s1;
    s1 ^= s2;
    s0 ^= s3;
    s2 ^= t;
    s3 = (s3 << 11) | (s3 >>> 21);
    return result;
  };
}
