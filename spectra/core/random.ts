/**
 * A small seeded pseudo-random source for reproducible Monte Carlo checks: xoshiro128** for uniforms,
 * Box–Muller for normals, Knuth's product method and Hörmann's PTRS for Poisson counts.
 * The same seed gives the same sequence on every JavaScript engine (only 32-bit integer arithmetic).
 */
import { SpectraError } from './errors';

/** A reproducible stream of random numbers. */
export interface RandomSource {
  /** Uniform in the open interval (0, 1), 32-bit resolution. */
  uniform(): number;
  /** Standard normal (mean 0, variance 1). */
  normal(): number;
  /** Poisson count with the given mean (≥ 0). */
  poisson(mean: number): number;
}

// Golden-ratio increment 0x9E3779B9 and MurmurHash3's fmix32 finaliser (A. Appleby, MurmurHash3, public-domain
// code, 2011; constants from memory, unverified here) spread one 32-bit seed over the four state words.
function mix32(x: number): number {
  x ^= x >>> 16;
  x = Math.imul(x, 0x85ebca6b);
  x ^= x >>> 13;
  x = Math.imul(x, 0xc2b2ae35);
  return (x ^ (x >>> 16)) >>> 0;
}

const rotl = (x: number, k: number) => (x << k) | (x >>> (32 - k));

/**
 * xoshiro128** by Blackman & Vigna, "Scrambled linear pseudorandom number generators",
 * ACM Trans. Math. Softw. 2021, 47(4), 36. Returns a function giving uniform 32-bit integers.
 */
function xoshiro128ss(seed: number): () => number {
  const s = new Uint32Array(4);
  for (let k = 0; k < 4; k++) s[k] = mix32((seed + Math.imul(k + 1, 0x9e3779b9)) >>> 0);
  if ((s[0] | s[1] | s[2] | s[3]) === 0) s[0] = 1; // the all-zero state is a fixed point
  return () => {
    const result = Math.imul(rotl(Math.imul(s[1], 5), 7), 9) >>> 0;
    const t = s[1] << 9;
    s[2] ^= s[0];
    s[3] ^= s[1];
    s[1] ^= s[2];
    s[0] ^= s[3];
    s[2] ^= t;
    s[3] = rotl(s[3], 11);
    return result;
  };
}

const LOG_FACTORIAL_TABLE_SIZE = 256;
const logFactorialTable = new Float64Array(LOG_FACTORIAL_TABLE_SIZE);
for (let k = 1; k < LOG_FACTORIAL_TABLE_SIZE; k++) logFactorialTable[k] = logFactorialTable[k - 1] + Math.log(k);

/**
 * ln(k!) for integer k ≥ 0: exact summation below 256, Stirling's series with three correction terms above
 * (absolute error below 1e-12 there; Abramowitz & Stegun 1964, eq. 6.1.41).
 */
export function logFactorial(k: number): number {
  if (k < LOG_FACTORIAL_TABLE_SIZE) return logFactorialTable[k];
  const inv = 1 / k;
  const inv2 = inv * inv;
  return (k + 0.5) * Math.log(k) - k + 0.5 * Math.log(2 * Math.PI) + inv * (1 / 12 - inv2 * (1 / 360 - inv2 / 1260));
}

/**
 * Creates a seeded random source. `seed` is any integer (taken modulo 2^32).
 * @example const rng = createRandom(42); rng.poisson(3.5);
 */
export function createRandom(seed: number): RandomSource {
  if (!Number.isFinite(seed)) throw new SpectraError('invalid_input', 'seed must be a finite number', ['seed']);
  const nextU32 = xoshiro128ss(Math.trunc(seed) >>> 0);
  const uniform = () => (nextU32() + 0.5) / 4294967296;
  let spare: number | null = null;
  // Box & Muller, Ann. Math. Statist. 1958, 29, 610: two uniforms give two independent normals.
  const normal = () => {
    if (spare !== null) {
      const z = spare;
      spare = null;
      return z;
    }
    const r = Math.sqrt(-2 * Math.log(uniform()));
    const theta = 2 * Math.PI * uniform();
    spare = r * Math.sin(theta);
    return r * Math.cos(theta);
  };
  const poisson = (mean: number) => {
    if (!(mean >= 0) || !Number.isFinite(mean)) {
      throw new SpectraError('invalid_input', `Poisson mean must be finite and ≥ 0, got ${mean}`, ['mean']);
    }
    if (mean === 0) return 0;
    return mean < 10 ? poissonKnuth(uniform, mean) : poissonPtrs(uniform, mean);
  };
  return { uniform, normal, poisson };
}

// Knuth, The Art of Computer Programming Vol. 2, 3rd ed. 1997, §3.4.1: multiply uniforms until the product
// falls below e^-mean. Cost grows with the mean, so it is used only below 10.
function poissonKnuth(uniform: () => number, mean: number): number {
  const limit = Math.exp(-mean);
  let k = 0;
  let product = uniform();
  while (product > limit) {
    k++;
    product *= uniform();
  }
  return k;
}

// Hörmann, "The transformed rejection method for generating Poisson random variables", Insurance: Mathematics and
// Economics 1993, 12, 39–45 (PTRS, valid for mean ≥ 10). Constants as printed there, transcribed from memory.
function poissonPtrs(uniform: () => number, mean: number): number {
  const sqrtMean = Math.sqrt(mean);
  const logMean = Math.log(mean);
  const b = 0.931 + 2.53 * sqrtMean;
  const a = -0.059 + 0.02483 * b;
  const invAlpha = 1.1239 + 1.1328 / (b - 3.4);
  const vr = 0.9277 - 3.6224 / (b - 2);
  for (;;) {
    const u = uniform() - 0.5;
    const v = uniform();
    const us = 0.5 - Math.abs(u);
    const k = Math.floor(((2 * a) / us + b) * u + mean + 0.43);
    if (us >= 0.07 && v <= vr) return k;
    if (k < 0 || (us < 0.013 && v > us)) continue;
    if (Math.log(v) + Math.log(invAlpha) - Math.log(a / (us * us) + b) <= -mean + k * logMean - logFactorial(k)) {
      return k;
    }
  }
}
