/**
 * The clustering engine's tasks a spare thread can run (see server/common/spare.ts). Inputs carry
 * typed arrays on shared memory; each task writes its range of rows into the shared output.
 */
import type { Csr } from '../common/matrix.js';
import { inlineSpare, type Spare, type SpareTasks } from '../common/spare.js';
import { gramRows, multiplyRange, solveRange } from './lsa-kernels.js';
import { freshRuns } from './sweep-runs.js';

/** Input of `lsa.multiply`: rows r0..r1 of out (rows×w) = X · D. */
export interface MultiplyInput { x: Csr; dense: Float32Array; w: number; out: Float64Array; r0: number; r1: number }
/** Input of `lsa.gram`: Gram rows i0..i1 of AᵀA. */
export interface GramInput { a: Float64Array; rows: number; w: number; out: Float64Array; i0: number; i1: number }
/** Input of `lsa.solve`: rows r0..r1 of A solved against R in place. */
export interface SolveInput { a: Float64Array; w: number; r: Float64Array; r0: number; r1: number }

export const CLUSTER_SPARE_TASKS: SpareTasks = {
  'lsa.multiply': (i: MultiplyInput) => multiplyRange(i.x, i.dense, i.w, i.out, i.r0, i.r1),
  'lsa.gram': (i: GramInput) => gramRows(i.a, i.rows, i.w, i.out, i.i0, i.i1),
  'lsa.solve': (i: SolveInput) => solveRange(i.a, i.w, i.r, i.r0, i.r1),
  'sweep.fresh': freshRuns,
};

/** The clustering engine's tasks run in the calling thread: the default wherever a spare is optional. */
export const CLUSTER_INLINE: Spare = inlineSpare(CLUSTER_SPARE_TASKS);
