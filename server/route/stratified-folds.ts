/**
 * Stratified k-fold assignment: every fold gets each label in (nearly) the same proportion as
 * the whole set, so a small label is tested in every fold.
 */
import type { Random } from '../common/random.js';
import { shuffleInPlace } from '../common/random.js';

/**
 * Assigns each document to one of `folds` folds. Within each label the documents are shuffled and
 * dealt round-robin; the dealing continues across labels where the previous label stopped, so fold
 * sizes differ by at most one.
 * @param y label index of each document, in [0, classCount).
 * @param classCount number of labels.
 * @param folds number of folds (≥ 2, ≤ the size of the smallest label for every fold to see it).
 * @param random injected randomness; the same generator state gives the same folds.
 * @returns the fold index of each document.
 */
export function stratifiedFolds(y: Int32Array, classCount: number, folds: number, random: Random): Int32Array {
  if (!Number.isInteger(folds) || folds < 2) throw new RangeError(`folds must be an integer ≥ 2; got ${folds}`);
  if (y.length < folds) throw new RangeError(`Cannot split ${y.length} documents into ${folds} folds`);
  const byClass: number[][] = Array.from({ length: classCount }, () => []);
  for (let i = 0; i < y.length; i++) byClass[y[i]].push(i);
  const out = new Int32Array(y.length);
  let next = 0;
  for (const members of byClass) {
    shuffleInPlace(random, members);
    for (const i of members) {
      out[i] = next;
      next = (next + 1) % folds;
    }
  }
  return out;
}
