import { DomainError } from '../errors';

/**
 * Seeded pseudo-random numbers for reproducible Monte Carlo runs.
 *
 * Generator: xoshiro128** 1.0 (D. Blackman & S. Vigna, "Scrambled linear pseudorandom number
 * generators", ACM Trans. Math. Softw. 47 (2021) 36; public-domain reference code at
 * https://prng.di.unimi.it/xoshiro128starstar.c). 128-bit state, period 2^128 − 1, 32-bit output.
 *
 * Seeding: the four state words are the high and low halves of the first two outputs of
 * SplitMix64 (G. L. Steele, D. Lea, C. H. Flood, "Fast splittable pseudorandom number
 * generators", OOPSLA 2014; https://prng.di.unimi.it/splitmix64.c), as the xoshiro authors
 * recommend. Any integer seed, including 0, gives a valid non-zero state.
 *
 * Not for cryptography.
 */
export interface Rng {
  /** Next raw 32-bit output, an integer in [0, 2^32). */
  nextUint32(): number;
  /** Uniform double in [0, 1) with 53 random bits. */
  next(): number;
  /** Uniform double in the open interval (0, 1): never exactly 0, for logarithms and inverse CDFs. */
  nextOpen(): number;
  /** Standard normal deviate (Marsaglia polar method). */
  nextNormal(): number;
}

const MASK64 = (1n << 64n) - 1n;

/**
 * SplitMix64 sequence from a 64-bit seed (BigInt arithmetic; used only for seeding).
 * z ← seed + k·0x9E3779B97F4A7C15; z ← (z ⊕ z≫30)·0xBF58476D1CE4E5B9; z ← (z ⊕ z≫27)·0x94D049BB133111EB; z ⊕ z≫31.
 */
export function splitMix64(seed: bigint, count: number): bigint[] {
  let x = BigInt.asUintN(64, seed);
  const out: bigint[] = [];
  for (let i = 0; i < count; i++) {
    x = (x + 0x9e3779b97f4a7c15n) & MASK64;
    let z = x;
    z = ((z ^ (z >> 30n)) * 0xbf58476d1ce4e5b9n) & MASK64;
    z = ((z ^ (z >> 27n)) * 0x94d049bb133111ebn) & MASK64;
    out.push(z ^ (z >> 31n));
  }
  return out;
}

function rotl(x: number, k: number): number {
  return (x << k) | (x >>> (32 - k));
}

/**
 * xoshiro128** from an explicit state of four 32-bit words (not all zero).
 * Exposed for checking against the reference implementation; use {@link createRng} otherwise.
 */
export function xoshiro128ss(state: readonly [number, number, number, number]): Rng {
  return new Xoshiro128StarStar(state[0] >>> 0, state[1] >>> 0, state[2] >>> 0, state[3] >>> 0);
}

/** A class with numeric fields keeps the state in registers in hot loops (no closure context). */
class Xoshiro128StarStar implements Rng {
  private spare = 0;
  private hasSpare = false;

  constructor(
    private s0: number,
    private s1: number,
    private s2: number,
    private s3: number,
  ) {
    if ((s0 | s1 | s2 | s3) === 0) {
      throw new DomainError('invalid-input', 'The generator state must not be all zero.', 'seed');
    }
  }

  nextUint32(): number {
    const s1 = this.s1;
    const result = Math.imul(rotl(Math.imul(s1, 5), 7), 9) >>> 0;
    const t = s1 << 9;
    this.s2 ^= this.s0;
    this.s3 ^= s1;
    this.s1 = s1 ^ this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    return result;
  }

  // 53-bit double: 27 high bits and 26 low bits of two outputs (the usual construction).
  next(): number {
    const hi = this.nextUint32() >>> 5;
    const lo = this.nextUint32() >>> 6;
    return (hi * 67108864 + lo) / 9007199254740992;
  }

  nextOpen(): number {
    let u = this.next();
    while (u === 0) u = this.next();
    return u;
  }

  // Marsaglia & Bray (1964) polar method: exact, no trigonometric calls; caches the second deviate.
  nextNormal(): number {
    if (this.hasSpare) {
      this.hasSpare = false;
      return this.spare;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = 2 * this.next() - 1;
      v = 2 * this.next() - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const m = Math.sqrt((-2 * Math.log(s)) / s);
    this.spare = v * m;
    this.hasSpare = true;
    return u * m;
  }
}

/** Seeded generator: same seed → same sequence on every platform. Seed: any safe integer. */
export function createRng(seed: number): Rng {
  if (!Number.isSafeInteger(seed)) {
    throw new DomainError('invalid-input', `The random seed must be an integer (got ${String(seed)}).`, 'seed');
  }
  const [a, b] = splitMix64(BigInt(seed), 2);
  return xoshiro128ss([
    Number(a >> 32n),
    Number(a & 0xffffffffn),
    Number(b >> 32n),
    Number(b & 0xffffffffn),
  ]);
}
