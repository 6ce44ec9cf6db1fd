import type { Dense } from '../common/matrix.js';
import { seededRandom, type Random } from '../common/random.js';
import { rowDots, type KernelSpace } from './row-kernel.js';

/** The leaves of one random-projection tree: leaf `t` is `order[bounds[t] .. bounds[t+1])`. */
export interface TreeLeaves {
  order: Int32Array;
  bounds: Int32Array;
}

/** Point visits (one dot product with a split normal each) between pauses of the tree build. */
const VISITS_PER_PAUSE = 65_536;

/** Where a tree is built: the rows and the tree's buffers are views on one kernel memory (see row-kernel.ts). */
export interface TreeSpace {
  memory: WebAssembly.Memory;
  /** Unit rows. */
  x: Dense;
  /** n entries: the points, permuted into leaf order as the tree is built. */
  order: Int32Array;
  /** cols entries: the current split's normal. */
  normal: Float32Array;
  /** n entries: each point's dot product with the normal. */
  dots: Float64Array;
}

/** Takes a tree's buffers for the rows `x` (already in `space`) from `space`. */
export function treeSpace(space: KernelSpace, x: Dense): TreeSpace {
  return { memory: space.memory, x, order: space.int32(x.rows), normal: space.float32(x.cols), dots: space.float64(x.rows) };
}

/** Bytes {@link treeSpace} takes for n rows of `cols` columns, as kernelBytes counts them. */
export function treeSpaceBytes(n: number, cols: number): number[] {
  return [4 * n, 4 * cols, 8 * n];
}

/**
 * Splits the rows into leaves of at most `leafSize` points with an angular random-projection tree
 * (Dasgupta & Freund 2008, as used to seed NN-descent in UMAP): each node is cut by the hyperplane
 * through the origin that bisects two of its points chosen at random, so nearby unit vectors tend
 * to share a leaf. A split that leaves one side empty (identical rows, for example) falls back to
 * halving the node, so every leaf respects the size bound.
 * The dot products with each normal come from the SIMD kernel (row-kernel.ts).
 * @param t the rows and the tree's buffers
 * @param leafSize largest leaf
 * @param random uniform numbers in [0, 1)
 * @returns a generator that pauses (yields the visits so far) every ~64k point visits, so the
 *   caller can report progress, and finally returns the leaves (`order` is `t.order`)
 */
export function* randomProjectionTreeSteps(t: TreeSpace, leafSize: number, random: Random): Generator<number, TreeLeaves, void> {
  let visits = 0;
  let nextPause = VISITS_PER_PAUSE;
  const { x, order, normal } = t;
  const n = x.rows;
  const d = x.cols;
  const data = x.data;
  for (let i = 0; i < n; i++) order[i] = i;
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
    rowDots(t.memory, data, d, order, normal, t.dots, start, end);
    const left = splitRange(t.dots, order, start, end, side, scratch, random);
    const mid = left === 0 || left === size ? start + (size >> 1) : start + left;
    stack.push(mid, end, start, mid);
  }
  // The stack pops the left child first, so leaf starts are already ascending.
  bounds.push(n);
  return { order, bounds: Int32Array.from(bounds) };
}

/**
 * Marks which side of the hyperplane each point of `order[start..end)` falls on (by its dot
 * product with the normal, in `dots`) and, unless one side is empty, partitions the range stably
 * (left side first). A plain function, not part of the generator, so V8 optimises it on its own.
 * @returns the number of points on the left side
 */
function splitRange(dots: Float64Array, order: Int32Array, start: number, end: number, side: Uint8Array, scratch: Int32Array, random: Random): number {
  let left = 0;
  for (let p = start; p < end; p++) {
    const s = dots[p];
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

/** Input of the spare task `knn.tree`. */
export interface TreeInput { space: TreeSpace; leafSize: number; seed: number }

/** A whole tree at once, from its own seeded stream (what a spare thread builds). */
export function randomProjectionTree(i: TreeInput): TreeLeaves {
  const gen = randomProjectionTreeSteps(i.space, i.leafSize, seededRandom(i.seed));
  for (;;) {
    const r = gen.next();
    if (r.done) return r.value;
  }
}
