/**
 * The words that set a cluster apart from the rest of the corpus, scored by the weighted
 * log-odds ratio with an informative Dirichlet prior (Monroe, Colaresi & Quinn 2008,
 * "Fightin' Words: Lexical Feature Selection and Evaluation for Identifying the Content of
 * Political Conflict", Political Analysis 16(4), §3.5, eqs. 16, 18 and 22).
 *
 * Counts: y_w is the number of documents that contain term w (the non-zero pattern of the
 * TF-IDF rows), not a sum of weights. The TF-IDF values cannot give raw counts back (they are
 * sublinear, idf-scaled and length-normalised), the pattern is exact, and "how many documents
 * say this" is what a person naming a theme needs: one long document repeating a word fifty
 * times should not name its cluster. Summing TF-IDF weights would also apply idf twice, since
 * the prior already discounts words common everywhere.
 */
import type { Csr } from '../common/matrix.js';

/**
 * Document counts per cluster and term: `out[c * cols + w]` is the number of documents of
 * cluster c whose row has term w. Documents with a label outside 0..k−1 are ignored.
 * @param tfidf document rows.
 * @param labels cluster index per row.
 * @param k number of clusters.
 * @param out optional k × cols buffer (zeroed here).
 */
export function clusterTermCounts(tfidf: Csr, labels: Int32Array, k: number, out = new Float64Array(k * tfidf.cols)): Float64Array {
  out.fill(0);
  const { indptr, indices, values, cols } = tfidf;
  for (let r = 0; r < tfidf.rows; r++) {
    const c = labels[r];
    if (c < 0 || c >= k) continue;
    const base = c * cols;
    for (let p = indptr[r]; p < indptr[r + 1]; p++) if (values[p] !== 0) out[base + indices[p]]++;
  }
  return out;
}

/**
 * Z-scores of the log-odds of each term in one group (i) versus everything else (j),
 * with the informative Dirichlet prior α_w = α₀ · y_w / n taken from the whole corpus:
 *
 *   δ_w = ln[(y_wi + α_w) / (n_i + α₀ − y_wi − α_w)] − ln[(y_wj + α_w) / (n_j + α₀ − y_wj − α_w)]   (eq. 16)
 *   σ²_w ≈ 1/(y_wi + α_w) + 1/(y_wj + α_w)                                                          (eq. 18)
 *   z_w = δ_w / σ_w                                                                                 (eq. 22)
 *
 * where y_wi is the count of w in the group, n_i the group's total count, and j is the rest
 * (y_wj = y_w − y_wi, n_j = n − n_i). Terms with no count anywhere get NaN.
 * @param groupCounts y_wi per term.
 * @param corpusCounts y_w per term (the group included).
 * @param priorStrength α₀ > 0.
 * @param out z per term.
 */
export function logOddsZ(groupCounts: ArrayLike<number>, corpusCounts: ArrayLike<number>, priorStrength: number, out: Float64Array = new Float64Array(corpusCounts.length)): Float64Array {
  const v = corpusCounts.length;
  let n = 0;
  let ni = 0;
  for (let w = 0; w < v; w++) {
    n += corpusCounts[w];
    ni += groupCounts[w];
  }
  const nj = n - ni;
  const a0 = priorStrength;
  for (let w = 0; w < v; w++) {
    const yw = corpusCounts[w];
    if (!(yw > 0)) {
      out[w] = NaN;
      continue;
    }
    const aw = (a0 * yw) / n;
    const yi = groupCounts[w];
    const yj = yw - yi;
    const delta = Math.log((yi + aw) / (ni + a0 - yi - aw)) - Math.log((yj + aw) / (nj + a0 - yj - aw));
    out[w] = delta / Math.sqrt(1 / (yi + aw) + 1 / (yj + aw));
  }
  return out;
}

/**
 * The most distinctive terms of every cluster, as readable labels, most distinctive first.
 * A term qualifies for a cluster when at least one of its documents has it and its z-score is
 * positive (over-represented); terms whose label repeats an already listed one are skipped.
 * @param counts k × V document counts (`clusterTermCounts`).
 * @param k number of clusters.
 * @param termLabels readable label per column (length V).
 * @param perCluster how many terms to list.
 * @param priorStrength α₀ of the prior.
 * @param skip clusters to leave empty (e.g. the no-content cluster); optional.
 * @returns per cluster, `{ columns, labels, z }`.
 */
export function distinctiveTerms(
  counts: Float64Array,
  k: number,
  termLabels: readonly string[],
  perCluster: number,
  priorStrength: number,
  skip?: (cluster: number) => boolean,
): { columns: number[]; labels: string[]; z: number[] }[] {
  const v = termLabels.length;
  const corpus = new Float64Array(v);
  for (let c = 0; c < k; c++) for (let w = 0; w < v; w++) corpus[w] += counts[c * v + w];
  const z = new Float64Array(v);
  const pool = perCluster * 2 + 4;
  const top = new Int32Array(pool);
  const out: { columns: number[]; labels: string[]; z: number[] }[] = [];
  for (let c = 0; c < k; c++) {
    const row = counts.subarray(c * v, (c + 1) * v);
    if (skip?.(c) || perCluster === 0) {
      out.push({ columns: [], labels: [], z: [] });
      continue;
    }
    logOddsZ(row, corpus, priorStrength, z);
    // Keep the best `pool` candidates in a small sorted buffer (pool ≪ V), ties by column.
    let filled = 0;
    for (let w = 0; w < v; w++) {
      const zw = z[w];
      if (!(row[w] > 0 && zw > 0)) continue;
      if (filled === pool && zw <= z[top[pool - 1]]) continue;
      let p = filled < pool ? filled++ : pool - 1;
      while (p > 0 && z[top[p - 1]] < zw) {
        top[p] = top[p - 1];
        p--;
      }
      top[p] = w;
    }
    const entry = { columns: [] as number[], labels: [] as string[], z: [] as number[] };
    const seen = new Set<string>();
    for (let p = 0; p < filled && entry.columns.length < perCluster; p++) {
      const label = termLabels[top[p]];
      if (seen.has(label)) continue;
      seen.add(label);
      entry.columns.push(top[p]);
      entry.labels.push(label);
      entry.z.push(z[top[p]]);
    }
    out.push(entry);
  }
  return out;
}
