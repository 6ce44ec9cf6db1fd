import type { Random } from '../common/random.js';
import type { Stepwise } from '../common/step.js';
import type { FuzzyGraph } from './api.js';
import { sharedFloat64, sharedInt32, toShared, type Spare } from '../common/spare.js';
import { CELLS, CELL_BASE, CELL_SHIFT, gradientTables } from './gradient-table.js';
import { localityOrder } from './locality-order.js';

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
  sliceEdges: number;
  /** Points from which the layout moves two halves side by side (see MapOptions.halvesFrom). */
  halvesFrom: number;
  random: Random;
  /** A thread for the second half of the points; the layout is the same without one. */
  spare: Spare;
}

/** Gradient components are clipped to ±4, as in the reference implementation. */
const CLIP = 4;
/** Where the attraction's table starts in {@link EdgeState.table}. */
const ATTRACTION = 2 * CELLS;
// d²'s bits, read through a view of the same 8 bytes, give its table cell without a logarithm.
const bits = new Float64Array(1);
const high = new Uint32Array(bits.buffer);
/** Index of the high 32 bits of a float64 in `high` (1 on little-endian machines). */
const HIGH = new Uint8Array(new Float64Array([1]).buffer)[7] === 0x3f ? 1 : 0;

/**
 * UMAP's layout optimisation (McInnes, Healy & Melville 2018, §3.2 and Algorithm 5): stochastic
 * gradient descent on the fuzzy cross-entropy, sampling each edge in proportion to its weight
 * (edge e every max(w)/wₑ epochs), moving both ends together, and pushing the head away from
 * `negativeSampleRate` uniformly drawn points per positive sample. The learning rate falls to zero
 * (quadratically by default, where the reference falls linearly: see MapOptions.learningRateFall).
 * Edges lighter than max(w)/epochs are never sampled within the run and are dropped.
 *
 * Written here on typed arrays rather than driving umap-js: fed a precomputed kNN graph, umap-js
 * still builds its fuzzy graph and a search graph on string-keyed sparse maps, which took 49 s and
 * 2.6 GB at n = 50,000 (bench/map.ts), and its optimiser walks number[][] with Math.pow per sample.
 * Four departures from the reference loop, all for speed. Both gradient coefficients are read from
 * tables indexed by the bits of d² (see gradientTables; the first table, for the repulsion
 * alone, cut the layout at n = 50,000, 40 epochs, from 5.8 s to 2.5 s of CPU on our 2-core
 * machine, trustworthiness@10 0.9858 exact vs 0.9856 tabulated on a 3,000-point sample). The
 * points are renumbered in breadth-first order of the graph (see localityOrder), so an edge's two
 * ends are usually close in memory. Negative samples are drawn by an inline xorshift32 seeded from
 * `random` once per round and half. And the points are split in two halves, each seeing the other
 * as it was when the round began (a round is about `sliceEdges` edges per half), so that a spare
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
  const gamma = s.repulsionStrength;
  // Renumbered so that neighbours sit near one another in memory (see localityOrder); positions
  // are read in and written back in the caller's order.
  const order = localityOrder(graph);
  const { head, tail, perSample, nextSample, perNegative, nextNegative } = edgeSchedule(graph, order, epochs, s.negativeSampleRate, n >= s.halvesFrom && s.spare.threads > 0);
  const edges = head.length;

  const table = gradientTables(a, b, gamma);
  // Two halves of the points (edges are in head order, so each half owns a run of edges), cut
  // where the edges split evenly. Each half moves only its own points at once; within a round it
  // sees the other half as it was when the round began, and its pulls on the other half's points
  // are added when the round ends. Either half can run on its own thread, and the result does
  // not depend on whether they do.
  // Below `halvesFrom` points the layout is quick anyway, and small maps (many epochs, so a stale
  // half would lag by many updates) stay exactly as the reference loop makes them.
  const split = n >= s.halvesFrom && edges > 1;
  const mid = split ? head[edges >> 1] : n;
  let e0 = split ? 0 : edges;
  while (e0 < edges && head[e0] < mid) e0++;
  const shared = split && s.spare.threads > 0;
  const f64 = (len: number) => (shared ? sharedFloat64(len) : new Float64Array(len));
  // Positions and the round's snapshot live in one array (snapshot from 2n), so a read can pick
  // either by an offset computed without a branch: whether a negative sample (a uniform draw) is
  // a half's own point is a coin toss the branch predictor loses.
  const both = f64(4 * n);
  for (let p = 0; p < n; p++) {
    both[2 * p] = positions[2 * order[p]];
    both[2 * p + 1] = positions[2 * order[p] + 1];
  }
  const y = both.subarray(0, 2 * n);
  const snap = both.subarray(2 * n);
  const deltas = [f64(2 * n), f64(2 * n)];
  const state: EdgeState = { head, tail, perSample, nextSample, perNegative, nextNegative, table: shared ? toShared(table) : table, both, y, snap, n, a, b, gamma };
  const halves = split ? [{ from: 0, to: e0, lo: 0, hi: mid }, { from: e0, to: edges, lo: mid, hi: n }] : [{ from: 0, to: edges, lo: 0, hi: n }];
  const total = epochs * edges;
  const slice = Math.max(1, s.sliceEdges);
  const rounds = Math.max(1, Math.ceil(Math.max(e0, edges - e0) / slice));
  yield { stage: 'layout', done: 0, total };
  for (let epoch = 0; epoch < epochs; epoch++) {
    const alpha = s.learningRate * Math.pow(1 - epoch / epochs, s.learningRateFall);
    for (let r = 0; r < rounds; r++) {
      if (split) snap.set(y);
      const parts = halves.map((h, i): HalfRound => {
        const len = h.to - h.from;
        return {
          epoch, alpha, lo: h.lo, hi: h.hi, delta: deltas[i],
          from: split ? h.from + Math.floor((len * r) / rounds) : Math.min(edges, r * slice),
          to: split ? h.from + Math.floor((len * (r + 1)) / rounds) : Math.min(edges, (r + 1) * slice),
          seed: (Math.floor(random() * 4294967296) | 1) >>> 0,
        };
      });
      const far = shared ? s.spare.start('layout.half', { state, part: parts[1] } satisfies HalfInput) : null;
      sgdHalf(state, parts[0]);
      if (far) far.wait();
      else if (split) sgdHalf(state, parts[1]);
      if (!split) {
        const done = epoch * edges + parts[0].to;
        if (done < total) yield { stage: 'layout', done, total };
        continue;
      }
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
      const done = epoch * edges + parts[0].to - halves[0].from + parts[1].to - halves[1].from;
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

/**
 * The edges the layout samples, in the renumbered points' head order, with their sampling
 * periods: edge e every max(w)/wₑ epochs, its negative samples `negativeSampleRate` times as
 * often; edges lighter than max(w)/epochs are dropped. Made outside the generator (which V8
 * optimised less) and, for a spare, straight on shared memory.
 */
function edgeSchedule(graph: FuzzyGraph, order: Int32Array, epochs: number, negativeSampleRate: number, shared: boolean) {
  const { n, indptr, indices, weights } = graph;
  let maxW = 0;
  for (let t = 0; t < weights.length; t++) if (weights[t] > maxW) maxW = weights[t];
  const cut = maxW / epochs;
  let edges = 0;
  for (let t = 0; t < weights.length; t++) if (weights[t] >= cut && weights[t] > 0) edges++;
  const i32 = (len: number) => (shared ? sharedInt32(len) : new Int32Array(len));
  const f64 = (len: number) => (shared ? sharedFloat64(len) : new Float64Array(len));
  const head = i32(edges);
  const tail = i32(edges);
  const perSample = f64(edges);
  const place = new Int32Array(n);
  for (let p = 0; p < n; p++) place[order[p]] = p;
  let e = 0;
  for (let p = 0; p < n; p++) {
    const i = order[p];
    for (let t = indptr[i]; t < indptr[i + 1]; t++) {
      const w = weights[t];
      if (w < cut || !(w > 0)) continue;
      head[e] = p;
      tail[e] = place[indices[t]];
      perSample[e] = maxW / w;
      e++;
    }
  }
  const nextSample = f64(edges);
  const perNegative = f64(edges);
  const nextNegative = f64(edges);
  for (let t = 0; t < edges; t++) {
    nextSample[t] = perSample[t];
    perNegative[t] = perSample[t] / negativeSampleRate;
    nextNegative[t] = perNegative[t];
  }
  return { head, tail, perSample, nextSample, perNegative, nextNegative };
}

/** Everything the SGD rounds read and write (typed arrays shared with a spare thread when there is one). */
export interface EdgeState {
  head: Int32Array;
  tail: Int32Array;
  perSample: Float64Array;
  nextSample: Float64Array;
  perNegative: Float64Array;
  nextNegative: Float64Array;
  /** Positions (n×2 interleaved, from 0), then the snapshot (from 2n). */
  both: Float64Array;
  /** Positions, n×2 interleaved: `both`'s first half. */
  y: Float64Array;
  /** Positions when the round began (what a half sees of the other half): `both`'s second half. */
  snap: Float64Array;
  n: number;
  a: number;
  b: number;
  gamma: number;
  /** The gradient coefficients' tables (see gradientTables). */
  table: Float64Array;
}

/** One half's share of a round: its edges [from, to), its points [lo, hi). */
export interface HalfRound {
  epoch: number;
  alpha: number;
  from: number;
  to: number;
  lo: number;
  hi: number;
  /** Pulls on the other half's points, added by the caller after the round. */
  delta: Float64Array;
  /** Seed of the negative samples' xorshift32 (odd, non-zero). */
  seed: number;
}

/** Input of the spare task `layout.half`. */
export interface HalfInput {
  state: EdgeState;
  part: HalfRound;
}

/**
 * One half's round of SGD: its edges [from, to) in epoch `epoch`, moving its own points in place,
 * reading the other half's from the round's snapshot and adding its pulls on them to `delta`
 * (outside the generator so V8 optimises it fully).
 */
export function sgdHalf(st: EdgeState, part: HalfRound): void {
  const { head, tail, perSample, nextSample, perNegative, nextNegative, both, y, n, a, b, gamma, table } = st;
  const { epoch, alpha, from, to, lo, hi, delta } = part;
  // Negative samples come from an inline xorshift32 seeded once per round and half: same seed,
  // same layout, without a closure call per sample. Outside the tables x^y is computed as
  // exp(y·ln x), which measured about 2× faster than Math.pow in V8.
  let rng = part.seed >>> 0;
  const toIndex = n / 4294967296;
  const repulse = 2 * gamma * b;
  const attract = -2 * a * b;
  const twoN = 2 * n;
  for (let t = from; t < to; t++) {
    if (nextSample[t] > epoch) continue;
    const j = head[t];
    const k = tail[t];
    const jx = 2 * j;
    const kx = 2 * k;
    // The head's position stays in locals through its negative samples (written back once).
    let yjx = y[jx];
    let yjy = y[jx + 1];
    const tailOwn = k >= lo && k < hi;
    // 0 for a point of this half, 2n (the snapshot) for the other's: (k − lo) | (hi − 1 − k) is
    // negative exactly when k is outside [lo, hi).
    const tk = (((k - lo) | (hi - 1 - k)) >> 31) & twoN;
    let dx = yjx - both[tk + kx];
    let dy = yjy - both[tk + kx + 1];
    let d2 = dx * dx + dy * dy;
    if (d2 > 0) {
      bits[0] = d2;
      const cell = (high[HIGH] >>> CELL_SHIFT) - CELL_BASE;
      let coeff: number;
      if (cell >= 0 && cell < CELLS) {
        coeff = table[ATTRACTION + 2 * cell] + table[ATTRACTION + 2 * cell + 1] * d2;
      } else {
        const p = Math.exp((b - 1) * Math.log(d2));
        coeff = (attract * p) / (a * p * d2 + 1);
      }
      let gx = coeff * dx;
      let gy = coeff * dy;
      gx = gx > CLIP ? CLIP : gx < -CLIP ? -CLIP : gx;
      gy = gy > CLIP ? CLIP : gy < -CLIP ? -CLIP : gy;
      yjx += gx * alpha;
      yjy += gy * alpha;
      if (tailOwn) {
        y[kx] -= gx * alpha;
        y[kx + 1] -= gy * alpha;
      } else {
        delta[kx] -= gx * alpha;
        delta[kx + 1] -= gy * alpha;
      }
    }
    nextSample[t] += perSample[t];

    const negatives = Math.floor((epoch - nextNegative[t]) / perNegative[t]);
    for (let q = 0; q < negatives; q++) {
      rng ^= rng << 13;
      rng ^= rng >>> 17;
      rng ^= rng << 5;
      const o = Math.floor((rng >>> 0) * toIndex);
      if (o === j) continue; // d² = 0 and the same point: no push, as in the reference.
      const ox = ((((o - lo) | (hi - 1 - o)) >> 31) & twoN) + 2 * o;
      dx = yjx - both[ox];
      dy = yjy - both[ox + 1];
      d2 = dx * dx + dy * dy;
      if (d2 > 0) {
        bits[0] = d2;
        const cell = (high[HIGH] >>> CELL_SHIFT) - CELL_BASE;
        let coeff: number;
        if (cell >= 0 && cell < CELLS) {
          coeff = table[2 * cell] + table[2 * cell + 1] * d2;
        } else {
          coeff = repulse / ((0.001 + d2) * (a * Math.exp(b * Math.log(d2)) + 1));
        }
        let gx = coeff * dx;
        let gy = coeff * dy;
        gx = gx > CLIP ? CLIP : gx < -CLIP ? -CLIP : gx;
        gy = gy > CLIP ? CLIP : gy < -CLIP ? -CLIP : gy;
        yjx += gx * alpha;
        yjy += gy * alpha;
      } else {
        // Two distinct points on the same spot: the reference pushes by the clip value.
        yjx += CLIP * alpha;
        yjy += CLIP * alpha;
      }
    }
    y[jx] = yjx;
    y[jx + 1] = yjy;
    if (negatives > 0) nextNegative[t] += negatives * perNegative[t];
  }
}
