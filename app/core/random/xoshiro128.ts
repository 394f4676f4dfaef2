/**
 * xoshiro128** 1.1, a small, fast generator with 128 bits of state (Blackman and Vigna,
 * 2018, "Scrambled linear pseudorandom number generators", https://prng.di.unimi.it/).
 * Seeded from one 32-bit integer through SplitMix32 so that nearby seeds give unrelated
 * streams. Every seeded thing in Gazeloom (simulated scenes and trackers, counterbalancing
 * shuffles) uses this generator, so a recorded seed reproduces the same sequence anywhere.
 */
export class Xoshiro128 {
  private s0: number;
  private s1: number;
  private s2: number;
  private s3: number;
  private spareGaussian: number | null = null;

  constructor(seed: number) {
    if (!Number.isInteger(seed)) throw new RangeError(`seed must be an integer, got ${seed}`);
    let z = seed >>> 0;
    const splitmix32 = (): number => {
      z = (z + 0x9e3779b9) >>> 0;
      let r = z;
      r = Math.imul(r ^ (r >>> 16), 0x85ebca6b) >>> 0;
      r = Math.imul(r ^ (r >>> 13), 0xc2b2ae35) >>> 0;
      return (r ^ (r >>> 16)) >>> 0;
    };
    this.s0 = splitmix32();
    this.s1 = splitmix32();
    this.s2 = splitmix32();
    this.s3 = splitmix32();
  }

  /** A generator with the given raw state (the reference implementation's test vectors use it). */
  static fromState(state: readonly [number, number, number, number]): Xoshiro128 {
    const g = new Xoshiro128(0);
    [g.s0, g.s1, g.s2, g.s3] = state.map((v) => v >>> 0) as [number, number, number, number];
    return g;
  }

  /** The next 32-bit unsigned integer. */
  nextUint32(): number {
    const result = Math.imul(rotl(Math.imul(this.s1, 5) >>> 0, 7), 9) >>> 0;
    const t = (this.s1 << 9) >>> 0;
    this.s2 ^= this.s0;
    this.s3 ^= this.s1;
    this.s1 ^= this.s2;
    this.s0 ^= this.s3;
    this.s2 ^= t;
    this.s3 = rotl(this.s3, 11);
    this.s0 >>>= 0;
    this.s1 >>>= 0;
    this.s2 >>>= 0;
    return result;
  }

  /** Uniform in [0, 1), with 32 bits of resolution. */
  next(): number {
    return this.nextUint32() / 4294967296;
  }

  /** Uniform integer in [0, n), without modulo bias (Lemire's rejection on the low bits). */
  nextInt(n: number): number {
    if (!Number.isInteger(n) || n <= 0 || n > 4294967296) throw new RangeError(`n must be an integer in 1..2^32, got ${n}`);
    const limit = 4294967296 - (4294967296 % n);
    let r = this.nextUint32();
    while (r >= limit) r = this.nextUint32();
    return r % n;
  }

  /** Standard normal deviate (Marsaglia's polar method; the spare is kept for the next call). */
  nextGaussian(): number {
    if (this.spareGaussian !== null) {
      const spare = this.spareGaussian;
      this.spareGaussian = null;
      return spare;
    }
    let u: number;
    let v: number;
    let s: number;
    do {
      u = this.next() * 2 - 1;
      v = this.next() * 2 - 1;
      s = u * u + v * v;
    } while (s >= 1 || s === 0);
    const factor = Math.sqrt((-2 * Math.log(s)) / s);
    this.spareGaussian = v * factor;
    return u * factor;
  }

  /** Exponentially distributed waiting time with the given rate (events per unit). */
  nextExponential(rate: number): number {
    if (!(rate > 0)) throw new RangeError(`rate must be > 0, got ${rate}`);
    return -Math.log(1 - this.next()) / rate;
  }
}

const rotl = (x: number, k: number): number => ((x << k) | (x >>> (32 - k))) >>> 0;
