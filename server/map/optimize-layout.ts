import type { Random } from '../common/random.js';
import type { Stepwise } from '../common/step.js';
import type { FuzzyGraph } from './api.js';
import type { Spare } from '../common/spare.js';
import { gradientTables } from './gradient-table.js';
import { PARAM_BYTES, sgdRows, writeParams } from './layout-kernel.js';
import { localityOrder } from './locality-order.js';
import { KernelSpace, kernelBytes } from './row-kernel.js';

/** Settings of {@link optimizeLayoutSteps}, already merged and validated by the caller. */
export interface LayoutSettings {
  epochs: number;
  /** Curve parameters of the low-dimensional similarity 1 / (1 + a·d^(2b)). */
  a: number;
  b: number;
  learningRate: number;
  /** The learning rate in epoch e of E is learningRate · (1 − e/E)^learningRateFall. */
  learningRateFall: number;
  negativeSampleRate: number;
  repulsionStrength: number;
  /** Share of the negative samples drawn near the head in the locality order (see MapOptions.nearbyShare). */
  nearbyShare: number;
  /** How far "near" reaches on either side, in points of the locality order (see MapOptions.nearbyReach). */
  nearbyReach: number;
  sliceEdges: number;
  /** Points from which the layout moves two halves side by side (see MapOptions.halvesFrom). */
  halvesFrom: number;
  random: Random;
  /** A thread for the second half of the points; the layout is the same without one. */
  spare: Spare;
}

/**
 * UMAP's layout optimisation (McInnes, Healy & Melville 2018, §3.2 and Algorithm 5): stochastic
 * gradient descent on the fuzzy cross-entropy, pulling the two ends of each edge together and
 * pushing the head away from `negativeSampleRate` drawn points for each unit of edge weight
 * (weights scaled so the heaviest edge is 1). The learning rate falls to zero (quadratically by
 * default, where the reference falls linearly: see MapOptions.learningRateFall). Edges lighter
 * than max(w)/epochs, which the reference would never sample within the run, are dropped.
 *
 * Written here on typed arrays rather than driving umap-js: fed a precomputed kNN graph, umap-js
 * still builds its fuzzy graph and a search graph on string-keyed sparse maps, which took 49 s and
 * 2.6 GB at n = 50,000 (bench/map.ts), and its optimiser walks number[][] with Math.pow per sample.
 *
 * Two departures change what each pass does, both estimating the same gradient with less noise,
 * which is what a large map's few passes lack. Every edge pulls in every pass, by its scaled weight,
 * where the reference samples edge e once every max(w)/wₑ epochs at full strength (same mean pull;
 * a light edge is no longer a pull every tenth pass or none at all). And a share of the negative
 * samples (`nearbyShare`) is drawn from the points within `nearbyReach` of the head in the
 * locality order (breadth-first over the graph, so mostly points of the same region of the map,
 * whose pushes are the ones that shape it), each push weighted by the ratio of the uniform draw's
 * probability to this mixture's, so the mean push is that of uniform draws. Measured on a
 * prototype of this loop (the same mixture, drawn from other bits; this code gives the documents
 * 0.96310 over seeds 1–2) at n = 50,000, 30 passes, whole-map trustworthiness@10 from 2,000
 * queries, layout seeds 1–4, on `npm run bench map`'s sets (2026-12-02): glosses 0.98152 (seeds 1–2) with the reference's
 * sampling, 0.98391 with every edge pulling, 0.98428 with a quarter of the negatives near;
 * generated documents 0.96028 (seeds 1–2), 0.96162, 0.96350 (plain umap-js, 200 epochs, seeds 42,
 * 7, 1: 0.9625, 0.9626, 0.9624); blobs 0.98508 (seeds 1–2), 0.98525, 0.98568. Half the negatives
 * near did better on the documents (0.96390) and worse on the glosses (0.98389 and 0.98274, two
 * draws of seeds 1–2); reaches of 1,000 and 8,000 were worse on both than 3,000. The negatives
 * are spread over the head's edges, after each pull, as in the reference: all of them after all
 * the pulls gave 0.95958 against 0.96103 (documents, from the principal axes).
 *
 * The rest is for speed. Both gradient coefficients are read from tables indexed by the bits of d²
 * (see gradientTables; the first table, for the repulsion alone, cut the layout at n = 50,000,
 * 40 epochs, from 5.8 s to 2.5 s of CPU on our 2-core machine, trustworthiness@10 0.9858 exact vs
 * 0.9856 tabulated on a 3,000-point sample). The points are renumbered in breadth-first order of
 * the graph (see localityOrder), so an edge's two ends are usually close in memory. Negative
 * samples are drawn by an inline xorshift32 seeded from `random` once per round and half. The
 * rounds run in a WebAssembly kernel (layout-kernel.ts), the same arithmetic as the TypeScript
 * loop it replaced, bit for bit. And the points are split in two halves, each seeing the other as
 * it was when the round began (a round is about `sliceEdges` edges per half), so that a spare
 * thread can move one half while this thread moves the other, with the same result either way.
 * Yields `{stage: "layout", done, total}` in edge-updates after each round of about `sliceEdges`
 * edges per half (see the halves below).
 * @param graph symmetric fuzzy graph (both directions stored)
 * @param positions n×2 starting positions, interleaved; moved in place and returned
 * @param s settings
 */
export function* optimizeLayoutSteps(graph: FuzzyGraph, positions: Float64Array, s: LayoutSettings): Stepwise<Float64Array> {
  const n = graph.n;
  const { epochs, a, b, random } = s;
  // Renumbered so that neighbours sit near one another in memory (see localityOrder); positions
  // are read in and written back in the caller's order.
  const order = localityOrder(graph);
  const shared = n >= s.halvesFrom && s.spare.threads > 0;
  const { edges, cut, maxW } = edgeCut(graph, epochs);
  const state = edgeState(n, edges, gradientTables(a, b, s.repulsionStrength));
  pullRows(graph, order, cut, maxW, state);
  Object.assign(state, { a, b, gamma: s.repulsionStrength, negatives: s.negativeSampleRate, nearby: s.nearbyShare * 4294967296, reach: s.nearbyReach });
  const { rowStart, both, y, snap, deltas } = state;
  for (let p = 0; p < n; p++) {
    both[2 * p] = positions[2 * order[p]];
    both[2 * p + 1] = positions[2 * order[p] + 1];
  }

  // Two halves of the points (each owns the edges it heads), cut where the edges split evenly.
  // Each half moves only its own points at once; within a round it sees the other half as it was
  // when the round began, and its pulls on the other half's points are added when the round ends.
  // Either half can run on its own thread, and the result does not depend on whether they do.
  // Below `halvesFrom` points the layout is quick anyway, and small maps (many epochs, so a stale
  // half would lag by many updates) see every update at once.
  const split = n >= s.halvesFrom && edges > 1;
  const mid = split ? pointAtEdge(rowStart, edges >> 1) : n;
  const halves = split ? [{ lo: 0, hi: mid }, { lo: mid, hi: n }] : [{ lo: 0, hi: n }];
  const slice = Math.max(1, s.sliceEdges);
  const rounds = Math.max(1, Math.ceil(Math.max(rowStart[mid], edges - rowStart[mid]) / slice));
  // Round r of a half covers its points [cuts[r], cuts[r + 1]), about equal shares of its edges.
  const cuts = halves.map(({ lo, hi }) => {
    const c = new Int32Array(rounds + 1);
    const len = rowStart[hi] - rowStart[lo];
    for (let r = 0; r < rounds; r++) c[r] = Math.max(lo, pointAtEdge(rowStart, rowStart[lo] + Math.floor((len * r) / rounds)));
    c[0] = lo;
    c[rounds] = hi;
    return c;
  });
  const total = epochs * edges;
  yield { stage: 'layout', done: 0, total };
  for (let epoch = 0; epoch < epochs; epoch++) {
    const alpha = s.learningRate * Math.pow(1 - epoch / epochs, s.learningRateFall);
    for (let r = 0; r < rounds; r++) {
      if (split) snap.set(y);
      const parts = halves.map((h, i): HalfRound => ({
        alpha,
        from: cuts[i][r],
        to: cuts[i][r + 1],
        lo: h.lo,
        hi: h.hi,
        delta: deltas[i],
        block: state.blocks[i],
        seed: (Math.floor(random() * 4294967296) | 1) >>> 0,
      }));
      const far = split && shared ? s.spare.start('layout.half', { state, part: parts[1] } satisfies HalfInput) : null;
      sgdHalf(state, parts[0]);
      if (far) far.wait();
      else if (split) sgdHalf(state, parts[1]);
      if (split) {
        // Each half's pulls on the other half's points, added now.
        for (let i = 0; i < 2; i++) {
          const delta = deltas[i];
          const lo = 2 * (i === 0 ? mid : 0), hi = 2 * (i === 0 ? n : mid);
          for (let c = lo; c < hi; c++) {
            if (delta[c] !== 0) {
              y[c] += delta[c];
              delta[c] = 0;
            }
          }
        }
      }
      let done = epoch * edges;
      for (let i = 0; i < halves.length; i++) done += rowStart[parts[i].to] - rowStart[halves[i].lo];
      if (done < total) yield { stage: 'layout', done, total };
    }
  }
  for (let p = 0; p < n; p++) {
    positions[2 * order[p]] = y[2 * p];
    positions[2 * order[p] + 1] = y[2 * p + 1];
  }
  yield { stage: 'layout', done: total, total };
  return positions;
}

/** The first point whose edges start at or after edge e (rowStart is non-decreasing). */
function pointAtEdge(rowStart: Int32Array, e: number): number {
  let lo = 0;
  let hi = rowStart.length - 1;
  while (lo < hi) {
    const m = (lo + hi) >> 1;
    if (rowStart[m] < e) lo = m + 1;
    else hi = m;
  }
  return lo;
}

/** The heaviest weight, the cut below which edges are dropped (see {@link pullRows}) and the edges kept. */
function edgeCut(graph: FuzzyGraph, epochs: number): { edges: number; cut: number; maxW: number } {
  const { weights } = graph;
  let maxW = 0;
  for (let t = 0; t < weights.length; t++) if (weights[t] > maxW) maxW = weights[t];
  const cut = maxW / epochs;
  let edges = 0;
  for (let t = 0; t < weights.length; t++) if (weights[t] >= cut && weights[t] > 0) edges++;
  return { edges, cut, maxW };
}

/**
 * The edges the layout pulls along, row by row in the renumbered order, written into the state:
 * point p heads the edges [rowStart[p], rowStart[p + 1]) to `tail`, each pulling by w/max(w)
 * (`pull`) and bringing negativeSampleRate · pull negative samples a pass. Edges lighter than
 * max(w)/epochs (`cut`) are dropped, as the reference drops them (0.96171 against 0.96136 kept,
 * documents, seeds 1–2). Made outside the generator, which V8 optimised less.
 */
function pullRows(graph: FuzzyGraph, order: Int32Array, cut: number, maxW: number, st: EdgeState): void {
  const { n, indptr, indices, weights } = graph;
  const { rowStart, tail, pull } = st;
  const place = new Int32Array(n);
  for (let p = 0; p < n; p++) place[order[p]] = p;
  let e = 0;
  for (let p = 0; p < n; p++) {
    const i = order[p];
    rowStart[p] = e;
    for (let t = indptr[i]; t < indptr[i + 1]; t++) {
      const w = weights[t];
      if (w < cut || !(w > 0)) continue;
      tail[e] = place[indices[t]];
      pull[e] = w / maxW;
      e++;
    }
  }
  rowStart[n] = e;
}

/**
 * The arrays of an {@link EdgeState} for n points and `edges` edges, all in one shared kernel
 * memory (see layout-kernel.ts), with `due` at ½ and the given gradient tables; the scalar
 * fields are left for the caller to set.
 */
export function edgeState(n: number, edges: number, table: Float64Array): EdgeState {
  const space = new KernelSpace(kernelBytes(4 * (n + 1), 4 * edges, 4 * edges, 8 * n, 32 * n, 16 * n, 16 * n, 8 * table.length, PARAM_BYTES, PARAM_BYTES));
  const rowStart = space.int32(n + 1);
  const tail = space.int32(edges);
  const pull = space.float32(edges);
  const due = space.float64(n).fill(0.5);
  // Positions and the round's snapshot in one array (snapshot from 2n), so a read picks either by
  // an offset computed without a branch: whether a negative sample (a draw) is a half's own point
  // is a coin toss the branch predictor loses.
  const both = space.float64(4 * n);
  const deltas: [Float64Array, Float64Array] = [space.float64(2 * n), space.float64(2 * n)];
  const tables = space.float64(table.length);
  tables.set(table);
  const blocks: [number, number] = [space.float64(PARAM_BYTES / 8).byteOffset, space.float64(PARAM_BYTES / 8).byteOffset];
  return {
    memory: space.memory, blocks, rowStart, tail, pull, due, both, deltas, table: tables,
    y: both.subarray(0, 2 * n), snap: both.subarray(2 * n), n, a: 1, b: 1, negatives: 5, gamma: 1, nearby: 0, reach: 0,
  };
}

/**
 * Everything the SGD rounds read and write: the arrays are views on one shared kernel memory
 * (see {@link edgeState}), so a spare thread and the kernel (layout-kernel.ts) work on them in place.
 */
export interface EdgeState {
  memory: WebAssembly.Memory;
  /** Byte addresses of the two halves' parameter blocks. */
  blocks: [number, number];
  /** Point p heads the edges [rowStart[p], rowStart[p + 1]). */
  rowStart: Int32Array;
  tail: Int32Array;
  /** Each edge's weight over the heaviest's. */
  pull: Float32Array;
  /** Negative samples per unit of pull (negativeSampleRate). */
  negatives: number;
  /** Each point's fraction of a negative sample carried to the next pass (from ½, so counts round). */
  due: Float64Array;
  /** Positions (n×2 interleaved, from 0), then the snapshot (from 2n). */
  both: Float64Array;
  /** Positions, n×2 interleaved: `both`'s first half. */
  y: Float64Array;
  /** Positions when the round began (what a half sees of the other half): `both`'s second half. */
  snap: Float64Array;
  /** Each half's pulls on the other half's points in a round. */
  deltas: [Float64Array, Float64Array];
  n: number;
  a: number;
  b: number;
  gamma: number;
  /** The gradient coefficients' tables (see gradientTables), made with `gamma`. */
  table: Float64Array;
  /** nearbyShare · 2³²: a 32-bit draw below it picks a nearby point. */
  nearby: number;
  /** nearbyReach. */
  reach: number;
}

/** One half's share of a round: the points [from, to) of the half's points [lo, hi). */
export interface HalfRound {
  alpha: number;
  from: number;
  to: number;
  lo: number;
  hi: number;
  /** Pulls on the other half's points, added by the caller after the round: one of the state's `deltas`. */
  delta: Float64Array;
  /** This half's parameter block: one of the state's `blocks`. */
  block: number;
  /** Seed of the negative samples' xorshift32 (odd, non-zero). */
  seed: number;
}

/** Input of the spare task `layout.half`. */
export interface HalfInput {
  state: EdgeState;
  part: HalfRound;
}

/**
 * One half's round of SGD: the points [from, to) pull along their edges and are pushed by their
 * negative samples, moving in place; the other half is read from the round's snapshot and pulls
 * on it are added to `delta`. Run by the kernel in layout-kernel.ts, whose header and test
 * (test/map/layout-kernel.test.ts, against a copy of the loop in TypeScript) give the loop.
 * Negative samples come from an inline xorshift32 seeded once per round and half: same seed,
 * same layout.
 */
export function sgdHalf(st: EdgeState, part: HalfRound): void {
  const at = (x: { byteOffset: number }) => x.byteOffset;
  writeParams(st.memory, part.block, {
    rowStart: at(st.rowStart), tail: at(st.tail), pull: at(st.pull), due: at(st.due), both: at(st.both),
    delta: at(part.delta), table: at(st.table),
    n: st.n, from: part.from, to: part.to, lo: part.lo, hi: part.hi, reach: st.reach, seed: part.seed,
    alpha: part.alpha, a: st.a, b: st.b, negatives: st.negatives, nearby: st.nearby,
    repulse: 2 * st.gamma * st.b, attract: -2 * st.a * st.b,
  });
  sgdRows(st.memory, part.block);
}
