/**
 * Seeded pseudo-random numbers for simulations and the bootstrap.
 * Generator: xoshiro128** (Blackman, D. and Vigna, S. (2021) "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47(4), 36), seeded through splitmix32 so that any integer
 * seed gives a well-mixed state. Normal deviates by the Marsaglia polar method (Marsaglia, G. and
 * Bray, T. A. (1964) SIAM Review 6, 260-264).
 */
export interface RandomSource {
  /** uniform on [0, 1) */
  uniform(): number;
  /** standard normal */
  normal(): number;
  /** integer uniform on [0, n) */
  integer(n: number): number;
}

function splitmix32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x9e3779b9) >>> 0;
    let z = state;
    z = Math.imul(z ^ (z >>> 16), 0x85ebca6b) >>> 0;
    z = Math.imul(z ^ (z >>> 13), 0xc2b2ae35) >>> 0;
    return (z ^ (z >>> 16)) >>> 0;
  };
}

/** A reproducible random source for the given integer seed. */
export function seededRandom(seed: number): RandomSource {
  const mix = splitmix32(Math.floor(seed) | 0);
  let a = mix();
  let b = mix();
  let c = mix();
  let d = mix();
  if ((a | b | c | d) === 0) a = 1;
  const next = (): number => {
    const result = Math.imul(rotl(Math.imul(b, 5) >>> 0, 7), 9) >>> 0;
    const t = (b << 9) >>> 0;
    c ^= a;
    d ^= b;
    b ^= c;
    a ^= d;
    c ^= t;
    d = rotl(d >>> 0, 11);
    a >>>= 0;
    b >>>= 0;
    c >>>= 0;
    return result;
  };
  let spare: number | null = null;
  const uniform = (): number => next() / 4294967296;
  return {
    uniform,
    integer: (n) => Math.floor(uniform() * n),
    normal() {
      if (spare !== null) {
        const value = spare;
        spare = null;
        return value;
      }
      let u = 0;
      let v = 0;
      let q = 0;
      do {
        u = 2 * uniform() - 1;
        v = 2 * uniform() - 1;
        q = u * u + v * v;
      } while (q >= 1 || q === 0);
      const f = Math.sqrt((-2 * Math.log(q)) / q);
      spare = v * f;
      return u * f;
    },
  };
}

function rotl(x: number, k: number): number {
  return ((x << k) | (x >>> (32 - k))) >>> 0;
}
