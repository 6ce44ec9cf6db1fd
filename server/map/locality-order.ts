import type { FuzzyGraph } from './api.js';

/**
 * An order of the points in which neighbours in the graph sit near one another: breadth-first
 * from the lowest-numbered point not yet reached, component by component. The layout renumbers
 * the points in this order before its passes, so the tail of an edge is usually in a cache
 * line the head's neighbours just used, and the two halves it moves side by side share few edges.
 * Measured on `npm run bench map`'s data (50,000 points, 30 passes, fastest of 6–8 alternating
 * runs): one thread 1.30–1.47 s against 1.35–1.49 s in the input order; with the spare thread
 * 1.41 s (median 1.46) against 1.51 s (median 1.89), as the halves, cut in this order, share
 * fewer edges; trustworthiness@10 (whole map, 6 seeds) 0.98502 against 0.98466.
 * @param graph symmetric fuzzy graph
 * @returns order[p] = the point placed at position p (a permutation of 0 … n−1)
 */
export function localityOrder(graph: FuzzyGraph): Int32Array {
  const { n, indptr, indices } = graph;
  const order = new Int32Array(n);
  const seen = new Uint8Array(n);
  let read = 0;
  let write = 0;
  for (let start = 0; start < n; start++) {
    if (seen[start]) continue;
    seen[start] = 1;
    order[write++] = start;
    while (read < write) {
      const i = order[read++];
      for (let t = indptr[i]; t < indptr[i + 1]; t++) {
        const j = indices[t];
        if (!seen[j]) {
          seen[j] = 1;
          order[write++] = j;
        }
      }
    }
  }
  return order;
}
