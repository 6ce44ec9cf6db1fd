import type { Dense } from '../common/matrix.js';
import { seededRandom, type Random } from '../common/random.js';

/** The leaves of one random-projection tree: leaf `t` is `order[bounds[t] .. bounds[t+1])`. */
export interface TreeLeaves {
  order: Int32Array;
  bounds: Int32Array;
}

/** Point visits (one dot product with a split normal each) between pauses of the tree build. */
const VISITS_PER_PAUSE = 32_768;

/**
 * Splits the rows into leaves of at most `leafSize` points with an angular random-projection tree
 * (Dasgupta & Freund 2008, as used to seed NN-descent in UMAP): each node is cut by the hyperplane
 * through the origin that bisects two of its points chosen at random, so nearby unit vectors tend
 * to share a leaf. A split that leaves one side empty (identical rows, for example) falls back to
 * halving the node, so every leaf respects the size bound.
 * @param x unit-length rows
 * @param leafSize largest leaf
 * @param random uniform numbers in [0, 1)
 * @returns a generator that pauses (yields the visits so far) every ~32k point visits, so the
 *   caller can report progress, and finally returns the leaves
 */
export function* randomProjectionTreeSteps(x: Dense, leafSize: number, random: Random): Generator<number, TreeLeaves, void> {
  let visits = 0;
  let nextPause = VISITS_PER_PAUSE;
  const n = x.rows;
  const d = x.cols;
  const data = x.data;
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const normal = new Float32Array(d);
  const side = new Uint8Array(n);
  const scratch = new Int32Array(n);
  const bounds: number[] = [];
  // Explicit stack of [start, end) ranges, processed depth first so leaves come out in order.
  const stack: number[] = [0, n];
  while (stack.length > 0) {
    const end = stack.pop() as number;
    const start = stack.pop() as number;
    const size = end - start;
    if (size <= leafSize) {
      if (size > 0) bounds.push(start);
      continue;
    }
    const ia = Math.floor(random() * size);
    let ib = Math.floor(random() * (size - 1));
    if (ib >= ia) ib++;
    const a = order[start + ia];
    const b = order[start + ib];
    for (let c = 0; c < d; c++) normal[c] = data[a * d + c] - data[b * d + c];
    visits += size;
    if (visits >= nextPause) {
      nextPause = visits + VISITS_PER_PAUSE;
      yield visits;
    }
    const left = splitRange(data, d, order, start, end, normal, side, scratch, random);
    const mid = left === 0 || left === size ? start + (size >> 1) : start + left;
    stack.push(mid, end, start, mid);
  }
  // The stack pops the left child first, so leaf starts are already ascending.
  bounds.push(n);
  return { order, bounds: Int32Array.from(bounds) };
}

/**
 * Marks which side of the hyperplane with `normal` each point of `order[start..end)` falls on and,
 * unless one side is empty, partitions the range stably (left side first).
 * A plain function, not part of the generator, so V8 optimises this hot loop on its own.
 * @returns the number of points on the left side
 */
function splitRange(
  data: Float32Array,
  d: number,
  order: Int32Array,
  start: number,
  end: number,
  normal: Float32Array,
  side: Uint8Array,
  scratch: Int32Array,
  random: Random,
): number {
  let left = 0;
  for (let p = start; p < end; p++) {
    const s = dotWithRow(data, order[p] * d, normal, d);
    const goLeft = s < 0 || (s === 0 && random() < 0.5);
    side[p - start] = goLeft ? 1 : 0;
    if (goLeft) left++;
  }
  const size = end - start;
  if (left === 0 || left === size) return left;
  let w = start;
  let r = 0;
  for (let p = start; p < end; p++) {
    if (side[p - start] === 1) order[w++] = order[p];
    else scratch[r++] = order[p];
  }
  order.set(scratch.subarray(0, r), w);
  return left;
}

/** Dot product of the row starting at `row` with `v` (a separate function so V8 optimises it on its own). */
function dotWithRow(data: Float32Array, row: number, v: Float32Array, d: number): number {
  let s0 = 0;
  let s1 = 0;
  let s2 = 0;
  let s3 = 0;
  let c = 0;
  for (; c + 3 < d; c += 4) {
    s0 += data[row + c] * v[c];
    s1 += data[row + c + 1] * v[c + 1];
    s2 += data[row + c + 2] * v[c + 2];
    s3 += data[row + c + 3] * v[c + 3];
  }
  for (; c < d; c++) s0 += data[row + c] * v[c];
  return s0 + s1 + (s2 + s3);
}

/** Input of the spare task `knn.tree`. */
export interface TreeInput { x: Dense; leafSize: number; seed: number }

/** A whole tree at once, from its own seeded stream (what a spare thread builds). */
export function randomProjectionTree(i: TreeInput): TreeLeaves {
  const gen = randomProjectionTreeSteps(i.x, i.leafSize, seededRandom(i.seed));
  for (;;) {
    const r = gen.next();
    if (r.done) return r.value;
  }
}
