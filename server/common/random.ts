/**
 * Seeded pseudo-random numbers. Every engine function that needs randomness takes a
 * `random: () => number` so that the same seed gives the same result.
 */

/** A function returning uniform numbers in [0, 1). */
export type Random = () => number;

/**
 * Mulberry32: a small, fast 32-bit generator. Its period (2^32) is ample for sampling and
 * initialisation; it is not for cryptography.
 * @param seed any integer; equal seeds give equal sequences.
 */
export function seededRandom(seed: number): Random {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Integer in [0, n). */
export function randomInt(random: Random, n: number): number {
  return Math.floor(random() * n);
}

/** In-place Fisher–Yates shuffle of `arr`. */
export function shuffleInPlace<T extends { length: number; [i: number]: unknown }>(random: Random, arr: T): T {
  for (let i = arr.length - 1; i > 0; i--) {
    const j = randomInt(random, i + 1);
    const tmp = arr[i];
    arr[i] = arr[j];
    arr[j] = tmp;
  }
  return arr;
}

/** Standard normal deviate (Box–Muller). */
export function randomNormal(random: Random): number {
  let u = 0;
  while (u === 0) u = random();
  const v = random();
  return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
}

/** A seeded sample of `size` distinct row indices from 0..n−1 (all of them when size ≥ n), ascending. */
export function sampleIndices(n: number, size: number, random: Random = seededRandom(1)): Int32Array {
  if (size >= n) return Int32Array.from({ length: n }, (_, i) => i);
  const all = Int32Array.from({ length: n }, (_, i) => i);
  for (let i = 0; i < size; i++) {
    const j = i + Math.floor(random() * (n - i));
    const t = all[i];
    all[i] = all[j];
    all[j] = t;
  }
  return all.slice(0, size).sort();
}
