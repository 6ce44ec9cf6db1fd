/**
 * Dot products of float32 rows, the inner loops of the neighbour search (candidate distances and
 * tree splits), as small WebAssembly SIMD kernels. Measured on this project's 2-core machine
 * (random unit rows, 100 columns), the plain TypeScript loop (`rowCosineDistance`: four float64
 * sums of float32 products) took 175–430 ns per pair and the kernel 57–87 ns: V8 does not
 * vectorise typed-array loops, and a dot product of float32 rows is arithmetic-bound, not
 * memory-bound (pairs drawn near one another cost the same as pairs from anywhere). The module is
 * written as bytes by server/common/wasm-binary.ts; its memory is shared, so a spare thread runs
 * the same kernels on the same rows and buffers.
 *
 * Arithmetic of a dot product (what test/map/row-kernel.test.ts restates to check it bit for
 * bit): float32 products and sums in 16 lanes (four vectors of four: lane l of vector v sums the
 * products of elements 16i + 4v + l), then the leftover groups of four into vector 0, the last
 * cols mod 4 elements into a scalar t, all in float32; then S = (v0 + v1) + (v2 + v3) lane by
 * lane and dot = ((S0 + S1) + (S2 + S3)) + t. For unit rows this is within about 1e-7 of the
 * exact value.
 */
import { F32, F64, I32, V128, op, wasmModule } from '../common/wasm-binary.js';

const { get, set, tee } = op;

/** Locals both kernels use for the dot product, after their own parameters and locals. */
interface DotLocals {
  cols: number;
  /** Byte addresses walking the two rows. */
  a: number;
  b: number;
  end16: number;
  end4: number;
  stop: number;
  /** Four v128 accumulators, then an f32 tail. */
  v: number[];
  tail: number;
}

/** `while (local < limit) { body }` on unsigned addresses. */
const whileBelow = (local: number, limit: number, body: number[]) => [
  ...op.block, ...op.loop, ...get(local), ...get(limit), ...op.i32GeU, ...op.brIf(1), ...body, ...op.br(0), ...op.end, ...op.end,
];

/** Leaves the float32 dot product of the rows at byte addresses `a` and `b` on the stack (see the header). */
function dotOf(l: DotLocals): number[] {
  const step = (v: number, offset: number) => [
    ...get(v), ...get(l.a), ...op.v128Load(offset), ...get(l.b), ...op.v128Load(offset), ...op.f32x4Mul, ...op.f32x4Add, ...set(v),
  ];
  const advance = (bytes: number) => [...get(l.a), ...op.i32Const(bytes), ...op.i32Add, ...set(l.a), ...get(l.b), ...op.i32Const(bytes), ...op.i32Add, ...set(l.b)];
  const limit = (mask: number) => [...get(l.a), ...get(l.cols), ...op.i32Const(mask), ...op.i32And, ...op.i32Const(2), ...op.i32Shl, ...op.i32Add];
  const lane = (i: number) => [...get(l.v[0]), ...op.f32x4ExtractLane(i)];
  const [v0, v1, v2, v3] = l.v;
  return [
    ...get(l.a), ...get(l.cols), ...op.i32Const(2), ...op.i32Shl, ...op.i32Add, ...set(l.stop),
    ...limit(-16), ...set(l.end16),
    ...limit(-4), ...set(l.end4),
    ...op.v128Zero, ...tee(v0), ...tee(v1), ...tee(v2), ...set(v3),
    ...whileBelow(l.a, l.end16, [...step(v0, 0), ...step(v1, 16), ...step(v2, 32), ...step(v3, 48), ...advance(64)]),
    ...whileBelow(l.a, l.end4, [...step(v0, 0), ...advance(16)]),
    ...op.f32Zero, ...set(l.tail),
    ...whileBelow(l.a, l.stop, [...get(l.tail), ...get(l.a), ...op.f32Load(), ...get(l.b), ...op.f32Load(), ...op.f32Mul, ...op.f32Add, ...set(l.tail), ...advance(4)]),
    ...get(v0), ...get(v1), ...op.f32x4Add, ...get(v2), ...get(v3), ...op.f32x4Add, ...op.f32x4Add, ...set(v0),
    ...lane(0), ...lane(1), ...op.f32Add, ...lane(2), ...lane(3), ...op.f32Add, ...op.f32Add, ...get(l.tail), ...op.f32Add,
  ];
}

/** Byte address of entry `index` (an i32 local) of an i32 or f64 array at the address in local `base`. */
const entry = (base: number, index: number, shift: number, extra = 0) => [
  ...get(base), ...get(index), ...op.i32Const(shift), ...op.i32Shl, ...op.i32Add, ...(extra ? [...op.i32Const(extra), ...op.i32Add] : []),
];

/**
 * pairDistances(rows, cols, pairs, distances, from, to), addresses in bytes: for c in [from, to),
 * distances[c] = max(1 − dot(rows[pairs[2c]], rows[pairs[2c + 1]]), 0) in float64.
 */
function pairDistancesBody(): number[] {
  const [ROWS, COLS, PAIRS, DIST, C, TO] = [0, 1, 2, 3, 4, 5];
  const l: DotLocals = { cols: COLS, a: 6, b: 7, end16: 8, end4: 9, stop: 10, v: [12, 13, 14, 15], tail: 16 };
  const ROW_BYTES = 11, D = 17;
  const rowOf = (half: number) => [...entry(PAIRS, C, 3, 4 * half), ...op.i32Load(), ...get(ROW_BYTES), ...op.i32Mul, ...get(ROWS), ...op.i32Add];
  return [
    ...get(COLS), ...op.i32Const(2), ...op.i32Shl, ...set(ROW_BYTES),
    ...whileBelow(C, TO, [
      ...rowOf(0), ...set(l.a),
      ...rowOf(1), ...set(l.b),
      ...entry(DIST, C, 3),
      ...op.f64Const(1), ...dotOf(l), ...op.f64PromoteF32, ...op.f64Sub, ...tee(D),
      // select(d, 0, d > 0): NaN gives 0, as `d > 0 ? d : 0` does in TypeScript.
      ...op.f64Const(0), ...get(D), ...op.f64Const(0), ...op.f64Gt, ...op.select,
      ...op.f64Store(),
      ...get(C), ...op.i32Const(1), ...op.i32Add, ...set(C),
    ]),
  ];
}

/**
 * rowDots(rows, cols, order, v, out, from, to), addresses in bytes: for i in [from, to),
 * out[i] = dot(rows[order[i]], v) in float32, widened to float64.
 */
function rowDotsBody(): number[] {
  const [ROWS, COLS, ORDER, VEC, OUT, I, TO] = [0, 1, 2, 3, 4, 5, 6];
  const l: DotLocals = { cols: COLS, a: 7, b: 8, end16: 9, end4: 10, stop: 11, v: [13, 14, 15, 16], tail: 17 };
  const ROW_BYTES = 12;
  return [
    ...get(COLS), ...op.i32Const(2), ...op.i32Shl, ...set(ROW_BYTES),
    ...whileBelow(I, TO, [
      ...entry(ORDER, I, 2), ...op.i32Load(), ...get(ROW_BYTES), ...op.i32Mul, ...get(ROWS), ...op.i32Add, ...set(l.a),
      ...get(VEC), ...set(l.b),
      ...entry(OUT, I, 3),
      ...dotOf(l), ...op.f64PromoteF32,
      ...op.f64Store(),
      ...get(I), ...op.i32Const(1), ...op.i32Add, ...set(I),
    ]),
  ];
}

let compiled: WebAssembly.Module | null = null;
function kernelModule(): WebAssembly.Module {
  compiled ??= new WebAssembly.Module(
    wasmModule([
      { name: 'pairDistances', params: 6, locals: [[6, I32], [4, V128], [1, F32], [1, F64]], body: pairDistancesBody() },
      { name: 'rowDots', params: 7, locals: [[6, I32], [4, V128], [1, F32]], body: rowDotsBody() },
    ]),
  );
  return compiled;
}

interface Kernels {
  pairDistances(rows: number, cols: number, pairs: number, distances: number, from: number, to: number): void;
  rowDots(rows: number, cols: number, order: number, v: number, out: number, from: number, to: number): void;
}

/** Instances by memory: a memory posted to another thread arrives as a new object, so each thread keeps its own. */
const instances = new WeakMap<WebAssembly.Memory, Kernels>();
function kernelsFor(memory: WebAssembly.Memory): Kernels {
  let k = instances.get(memory);
  if (!k) {
    k = new WebAssembly.Instance(kernelModule(), { env: { memory } }).exports as unknown as Kernels;
    instances.set(memory, k);
  }
  return k;
}

const PAGE = 65536;
const MAX_PAGES = 65536;

/**
 * A shared WebAssembly memory carved into typed arrays for the kernel: the rows and the pair
 * buffers must live in it. Views are 16-byte aligned; sizes are fixed when it is made.
 */
export class KernelSpace {
  readonly memory: WebAssembly.Memory;
  private used = 0;

  /** @param bytes room for every view to be taken, each rounded up to 16 bytes */
  constructor(bytes: number) {
    const pages = Math.max(1, Math.ceil(bytes / PAGE));
    if (pages > MAX_PAGES) throw new RangeError(`the neighbour search needs ${Math.ceil(bytes / 2 ** 20)} MB for its rows and buffers; the kernel's limit is 4096 MB (fewer documents or fewer dimensions)`);
    this.memory = new WebAssembly.Memory({ initial: pages, maximum: pages, shared: true });
  }

  private take(bytes: number): number {
    const at = this.used;
    const end = at + Math.ceil(bytes / 16) * 16;
    if (end > this.memory.buffer.byteLength) throw new RangeError('kernel space exhausted (a sizing error in the caller)');
    this.used = end;
    return at;
  }

  float32(length: number): Float32Array {
    return new Float32Array(this.memory.buffer, this.take(4 * length), length);
  }

  int32(length: number): Int32Array {
    return new Int32Array(this.memory.buffer, this.take(4 * length), length);
  }

  float64(length: number): Float64Array {
    return new Float64Array(this.memory.buffer, this.take(8 * length), length);
  }

  uint8(length: number): Uint8Array {
    return new Uint8Array(this.memory.buffer, this.take(length), length);
  }
}

/** Bytes a {@link KernelSpace} needs for these array lengths (each rounded up to 16 bytes). */
export function kernelBytes(...byteLengths: number[]): number {
  return byteLengths.reduce((s, b) => s + Math.ceil(b / 16) * 16, 0);
}

/** Input of {@link pairDistances}; every array is a view on `memory`. */
export interface DistancesInput {
  memory: WebAssembly.Memory;
  /** Rows, row-major, `cols` per row. */
  data: Float32Array;
  cols: number;
  /** p, q of each pair. */
  pairs: Int32Array;
  distances: Float64Array;
  /** Pairs [from, to) are measured. */
  from: number;
  to: number;
}

/** Cosine distances of pairs [from, to): distances[c] for the rows pairs[2c], pairs[2c + 1] (see the header). */
export function pairDistances(i: DistancesInput): void {
  if (i.to <= i.from) return;
  if (2 * i.to > i.pairs.length || i.to > i.distances.length) throw new RangeError(`pairs ${i.from}..${i.to} exceed the buffer`);
  kernelsFor(i.memory).pairDistances(i.data.byteOffset, i.cols, i.pairs.byteOffset, i.distances.byteOffset, i.from, i.to);
}

/**
 * out[i] = dot(row order[i] of `data`, v) for i in [from, to) (see the header); every array is a
 * view on `memory`.
 */
export function rowDots(memory: WebAssembly.Memory, data: Float32Array, cols: number, order: Int32Array, v: Float32Array, out: Float64Array, from: number, to: number): void {
  if (to <= from) return;
  if (to > order.length || to > out.length || v.length < cols) throw new RangeError(`rows ${from}..${to} exceed the buffers`);
  kernelsFor(memory).rowDots(data.byteOffset, cols, order.byteOffset, v.byteOffset, out.byteOffset, from, to);
}
