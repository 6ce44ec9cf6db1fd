/**
 * Triage edits as pure functions over the per-document cluster indices. Clusters are referred to
 * by index; the caller maps ids. Both return the new labels and, for every old cluster index, its
 * new index (-1 when it is gone), so names and ids can follow.
 */

/** The outcome of an edit: new labels, the old → new index map and the new cluster count. */
export interface Relabelling {
  labels: Int32Array;
  mapping: Int32Array;
  k: number;
}

/** Renumbers clusters 0..k'-1 in their old order, dropping the empty ones. */
export function compactClusters(labels: Int32Array, k: number): Relabelling {
  const sizes = new Int32Array(k);
  for (let i = 0; i < labels.length; i++) sizes[labels[i]]++;
  const mapping = new Int32Array(k).fill(-1);
  let next = 0;
  for (let c = 0; c < k; c++) if (sizes[c] > 0) mapping[c] = next++;
  const out = new Int32Array(labels.length);
  for (let i = 0; i < labels.length; i++) out[i] = mapping[labels[i]];
  return { labels: out, mapping, k: next };
}

/**
 * Merges clusters into the first one listed. The merged cluster keeps the first's place.
 * @throws RangeError when fewer than two distinct clusters are given or an index is out of range.
 */
export function mergeClusters(labels: Int32Array, k: number, clusters: readonly number[]): Relabelling {
  const distinct = [...new Set(clusters)];
  if (distinct.length < 2) throw new RangeError('Give at least two different themes to merge.');
  for (const c of distinct) if (!Number.isInteger(c) || c < 0 || c >= k) throw new RangeError(`No theme at index ${c}.`);
  const into = distinct[0];
  const absorbed = new Uint8Array(k);
  for (const c of distinct.slice(1)) absorbed[c] = 1;
  const merged = new Int32Array(labels.length);
  for (let i = 0; i < labels.length; i++) merged[i] = absorbed[labels[i]] ? into : labels[i];
  return compactClusters(merged, k);
}

/**
 * Moves documents to a cluster. Clusters left empty are dropped.
 * @throws RangeError when the target or a document index is out of range.
 */
export function moveDocuments(labels: Int32Array, k: number, documents: readonly number[], target: number): Relabelling {
  if (!Number.isInteger(target) || target < 0 || target >= k) throw new RangeError(`No theme at index ${target}.`);
  const moved = Int32Array.from(labels);
  for (const d of documents) {
    if (!Number.isInteger(d) || d < 0 || d >= labels.length) throw new RangeError(`No document at index ${d}.`);
    moved[d] = target;
  }
  return compactClusters(moved, k);
}
