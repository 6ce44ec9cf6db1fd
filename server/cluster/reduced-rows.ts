import { subRows, type Csr, type Dense } from '../common/matrix.js';
import type { Random } from '../common/random.js';
import { sharedFloat32, sharedUint32, type Spare } from '../common/spare.js';
import type { Stepwise } from '../common/step.js';
import { lsaSteps } from './lsa.js';
import { CLUSTER_INLINE } from './spare-tasks.js';

export { subRows } from '../common/matrix.js';

/** Row indices of the documents whose TF-IDF row has any non-zero weight. */
export function contentRows(tfidf: Csr): Int32Array {
  const out: number[] = [];
  for (let r = 0; r < tfidf.rows; r++) {
    let any = false;
    for (let p = tfidf.indptr[r]; p < tfidf.indptr[r + 1] && !any; p++) any = tfidf.values[p] !== 0;
    if (any) out.push(r);
  }
  return Int32Array.from(out);
}

/** Spreads rows of the content documents back to all `n` documents; the others stay zero. */
export function spreadRows(reducedContent: Dense, content: Int32Array, n: number): Dense {
  const d = reducedContent.cols;
  const reduced: Dense = { rows: n, cols: d, data: new Float32Array(n * d) };
  for (let s = 0; s < content.length; s++) reduced.data.set(reducedContent.data.subarray(s * d, (s + 1) * d), content[s] * d);
  return reduced;
}

/**
 * The LSA rows of the documents with content (Halko, Martinsson & Tropp 2011), drawing from
 * `random` exactly as {@link analyseSteps} does first.
 * @throws RangeError when fewer than 2 documents have content.
 */
export function* lsaOfContentSteps(tfidf: Csr, content: Int32Array, dimensions: number, random: Random, spare: Spare = CLUSTER_INLINE): Stepwise<Dense> {
  if (content.length < 2) {
    throw new RangeError(`Only ${content.length} of ${tfidf.rows} documents have any usable terms; clustering needs at least 2 (are the texts empty or only stop words?)`);
  }
  // On shared memory straight away when a spare will read them (lsaSteps would copy them there).
  const rows = subRows(tfidf, content, spare.threads > 0 ? { u32: sharedUint32, f32: sharedFloat32 } : undefined);
  const fit = yield* lsaSteps(rows, { dimensions, random, spare });
  return fit.reduced;
}
