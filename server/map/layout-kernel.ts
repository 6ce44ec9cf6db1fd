/**
 * The layout's SGD rounds (see sgdHalf in optimize-layout.ts) as a WebAssembly kernel: the same
 * arithmetic in the same order, so the same layout to the last bit (test/map/layout-kernel.test.ts
 * checks it against a copy of the loop in TypeScript). The arrays it reads and writes
 * live in a shared WebAssembly memory ({@link KernelSpace}), so a spare thread moves its half
 * there too. Math.exp and Math.log, needed only outside the gradient tables, are imported.
 *
 * Why: the loop is a chain of dependent float64 operations per sample, and V8's code for it keeps
 * typed-array bounds checks, int32 overflow checks and a store and reload for d²'s bits (the
 * table's index), which the kernel does in registers. Measured (2026-12-02, bench documents,
 * 50,000 points, same layout): 10 passes on one thread (node --no-liftoff, two processes of 3
 * alternating runs) 0.72–1.11 s against 1.04–1.53 s for the loop; clipping with f64.min and
 * f64.max, which must order −0 and NaN, instead of selects: 0.77–0.91 s against 0.88–1.45 s. The
 * whole layout stage with the spare thread, 8 alternating fresh runs: median 1.84 s against 2.26 s.
 */
import { F64, I32, op, wasmModule } from '../common/wasm-binary.js';
import { fadd, fdiv, fmul, fsub, iadd, ifElse, ifThen, ishl, isub, loopWhile, type Code } from '../common/wasm-expr.js';
import { CELLS, CELL_BASE, CELL_SHIFT } from './gradient-table.js';

const { get, set, tee } = op;

/** Gradient components are clipped to ±4, as in the reference implementation. */
const CLIP = 4;

/**
 * Byte offsets of a round's parameter block: addresses and counts as i32, then float64s.
 * The caller writes it with {@link writeParams}.
 */
const P = {
  rowStart: 0, tail: 4, pull: 8, due: 12, both: 16, delta: 20, table: 24,
  n: 28, from: 32, to: 36, lo: 40, hi: 44, reach: 48, seed: 52,
  alpha: 56, a: 64, b: 72, negatives: 80, nearby: 88, repulse: 96, attract: 104,
} as const;
/** Bytes of a parameter block. */
export const PARAM_BYTES = 112;

/** What one call moves: see sgdHalf. Addresses are byte offsets into the kernel's memory. */
export interface LayoutRound {
  rowStart: number;
  tail: number;
  pull: number;
  due: number;
  both: number;
  delta: number;
  table: number;
  n: number;
  from: number;
  to: number;
  lo: number;
  hi: number;
  reach: number;
  seed: number;
  alpha: number;
  a: number;
  b: number;
  negatives: number;
  /** nearbyShare · 2³². */
  nearby: number;
  /** 2γb. */
  repulse: number;
  /** −2ab. */
  attract: number;
}

/** Writes a round's parameters at byte `at` of `memory`. */
export function writeParams(memory: WebAssembly.Memory, at: number, r: LayoutRound): void {
  const i32 = new Int32Array(memory.buffer, at, 14);
  const f64 = new Float64Array(memory.buffer, at + P.alpha, 7);
  i32.set([r.rowStart, r.tail, r.pull, r.due, r.both, r.delta, r.table, r.n, r.from, r.to, r.lo, r.hi, r.reach, r.seed | 0]);
  f64.set([r.alpha, r.a, r.b, r.negatives, r.nearby, r.repulse, r.attract]);
}

// Locals: the block's address (the one parameter), then i32s, then f64s.
const BLOCK = 0;
const L = (() => {
  const ints = ['rowStart', 'tail', 'pull', 'due', 'both', 'delta', 'table', 'n', 'from', 'to', 'lo', 'hi', 'reach', 'rng',
    'p', 'wlo', 'whi', 't', 'end', 'k', 'addr', 'cell', 'count', 'q', 'o', 'twoN'] as const;
  const floats = ['alpha', 'a', 'b', 'negatives', 'nearby', 'repulse', 'attract',
    'yx', 'yy', 'nearStep', 'farStep', 'nearScale', 'farScale', 'owed', 'dx', 'dy', 'd2', 'coeff', 'gx', 'gy', 'step', 'u', 'share', 'span', 'qq'] as const;
  const at: Record<string, number> = {};
  ints.forEach((name, i) => (at[name] = 1 + i));
  floats.forEach((name, i) => (at[name] = 1 + ints.length + i));
  return { at: at as Record<(typeof ints)[number] | (typeof floats)[number], number>, ints: ints.length, floats: floats.length };
})();
const v = L.at;

// Small expression helpers: each returns the bytes that leave one value on the stack.
const g = (local: number): Code => get(local);
const f = (x: number): Code => op.f64Const(x);
const c = (x: number): Code => op.i32Const(x);
const load64 = (addr: Code, offset = 0): Code => [...addr, ...op.f64Load(offset)];
const load32 = (addr: Code, offset = 0): Code => [...addr, ...op.i32Load(offset)];
const loadF32 = (addr: Code): Code => [...addr, ...op.f32Load(), ...op.f64PromoteF32];
/** Byte address of entry `index` of an array of 2^shift-byte entries at the address in local `base`. */
const at = (base: number, index: Code, shift: number): Code => iadd(g(base), ishl(index, shift));
const store64 = (addr: Code, value: Code, offset = 0): Code => [...addr, ...value, ...op.f64Store(offset)];
const floor = (x: Code): Code => [...x, ...op.f64Floor, ...op.i32TruncF64S];
/**
 * Local x clipped to ±CLIP by the comparisons of the TypeScript loop (x > CLIP ? CLIP : x < −CLIP
 * ? −CLIP : x), as selects: f64.min and f64.max must order −0 and NaN, which costs branches.
 */
const clip = (x: number): Code => [
  ...f(CLIP), ...f(-CLIP), ...g(x), ...g(x), ...f(-CLIP), ...op.f64Lt, ...op.select, ...g(x), ...f(CLIP), ...op.f64Gt, ...op.select,
];
/** 0 for a point of [lo, hi), 2n for others: (k − lo) | (hi − 1 − k) is negative exactly outside. */
const offsetOf = (k: Code): Code => [...isub(k, g(v.lo)), ...isub(isub(g(v.hi), c(1)), k), ...op.i32Or, ...c(31), ...op.i32ShrS, ...g(v.twoN), ...op.i32And];
/** The table cell of d² (local), from the high word of its bits. */
const cellOf = (): Code => [...g(v.d2), ...op.i64ReinterpretF64, ...op.i64Const(32), ...op.i64ShrU, ...op.i32WrapI64, ...c(CELL_SHIFT), ...op.i32ShrU, ...c(CELL_BASE), ...op.i32Sub];
const EXP = 0;
const LOG = 1;
const call = (fn: number, x: Code): Code => [...x, ...op.call(fn)];

/** dx, dy and d² from the point in locals (yx, yy) to point `k` (a local), read live or from the snapshot. */
const distanceTo = (k: number): Code => [
  // addr = both + 8·(offset + 2k)
  ...at(v.both, iadd(offsetOf(g(k)), ishl(g(k), 1)), 3), ...set(v.addr),
  ...fsub(g(v.yx), load64(g(v.addr))), ...set(v.dx),
  ...fsub(g(v.yy), load64(g(v.addr), 8)), ...set(v.dy),
  ...fadd(fmul(g(v.dx), g(v.dx)), fmul(g(v.dy), g(v.dy))), ...set(v.d2),
];

/**
 * coeff from the table starting at entry `from` (the line of d²'s cell), or from `exact` outside
 * the tables; then gx, gy = coeff·(dx, dy), each clipped.
 */
const gradient = (from: number, exact: Code): Code => {
  const line = at(v.table, iadd(c(from), ishl(g(v.cell), 1)), 3);
  return [
    ...cellOf(), ...set(v.cell),
    ...ifElse([...g(v.cell), ...c(CELLS), ...op.i32LtU], [...fadd(load64(line), fmul(load64(line, 8), g(v.d2))), ...set(v.coeff)], [...exact, ...set(v.coeff)]),
    ...fmul(g(v.coeff), g(v.dx)), ...set(v.gx),
    ...clip(v.gx), ...set(v.gx),
    ...fmul(g(v.coeff), g(v.dy)), ...set(v.gy),
    ...clip(v.gy), ...set(v.gy),
  ];
};

function sgdRowsBody(): Code {
  const ints = ['rowStart', 'tail', 'pull', 'due', 'both', 'delta', 'table', 'n', 'from', 'to', 'lo', 'hi', 'reach', 'rng'] as const;
  const floats = ['alpha', 'a', 'b', 'negatives', 'nearby', 'repulse', 'attract'] as const;
  const ATTRACTION = 2 * CELLS;
  const attraction: Code = [
    ...g(v.tail), ...g(v.t), ...c(2), ...op.i32Shl, ...op.i32Add, ...op.i32Load(), ...set(v.k),
    ...distanceTo(v.k),
    ...ifThen([...g(v.d2), ...f(0), ...op.f64Gt], [
      ...gradient(ATTRACTION, [
        ...call(EXP, fmul(fsub(g(v.b), f(1)), call(LOG, g(v.d2)))), ...set(v.qq),
        ...fdiv(fmul(g(v.attract), g(v.qq)), fadd(fmul(fmul(g(v.a), g(v.qq)), g(v.d2)), f(1))),
      ]),
      ...fmul(loadF32(at(v.pull, g(v.t), 2)), g(v.alpha)), ...set(v.step),
      ...fmul(g(v.gx), g(v.step)), ...set(v.gx),
      ...fmul(g(v.gy), g(v.step)), ...set(v.gy),
      ...fadd(g(v.yx), g(v.gx)), ...set(v.yx),
      ...fadd(g(v.yy), g(v.gy)), ...set(v.yy),
      // Own points move now; pulls on the other half's go to delta.
      ...ifElse([...isub(g(v.k), g(v.lo)), ...isub(g(v.hi), g(v.lo)), ...op.i32LtU], [
        ...at(v.both, ishl(g(v.k), 1), 3), ...set(v.addr),
      ], [
        ...at(v.delta, ishl(g(v.k), 1), 3), ...set(v.addr),
      ]),
      ...store64(g(v.addr), fsub(load64(g(v.addr)), g(v.gx))),
      ...store64(g(v.addr), fsub(load64(g(v.addr), 8), g(v.gy)), 8),
    ]),
  ];
  const xorshift: Code = [
    ...g(v.rng), ...g(v.rng), ...c(13), ...op.i32Shl, ...op.i32Xor, ...set(v.rng),
    ...g(v.rng), ...g(v.rng), ...c(17), ...op.i32ShrU, ...op.i32Xor, ...set(v.rng),
    ...g(v.rng), ...g(v.rng), ...c(5), ...op.i32Shl, ...op.i32Xor, ...set(v.rng),
  ];
  const negative: Code = [
    ...xorshift,
    ...g(v.rng), ...op.f64ConvertI32U, ...set(v.u),
    ...ifElse([...g(v.u), ...g(v.nearby), ...op.f64Lt],
      [...iadd(g(v.wlo), floor(fmul(g(v.u), g(v.nearScale)))), ...set(v.o)],
      [...floor(fmul(fsub(g(v.u), g(v.nearby)), g(v.farScale))), ...set(v.o)]),
    // The same point: no push, as in the reference.
    ...ifThen([...g(v.o), ...g(v.p), ...op.i32Ne], [
      // step = o in [wlo, whi] ? nearStep : farStep
      ...g(v.nearStep), ...g(v.farStep), ...isub(g(v.o), g(v.wlo)), ...isub(g(v.whi), g(v.wlo)), ...op.i32LeU, ...op.select, ...set(v.step),
      ...distanceTo(v.o),
      ...ifElse([...g(v.d2), ...f(0), ...op.f64Gt], [
        ...gradient(0, fdiv(g(v.repulse), fmul(fadd(f(0.001), g(v.d2)), fadd(fmul(g(v.a), call(EXP, fmul(g(v.b), call(LOG, g(v.d2))))), f(1))))),
        ...fadd(g(v.yx), fmul(g(v.gx), g(v.step))), ...set(v.yx),
        ...fadd(g(v.yy), fmul(g(v.gy), g(v.step))), ...set(v.yy),
      ], [
        // Two distinct points on the same spot: the reference pushes by the clip value.
        ...fadd(g(v.yx), fmul(f(CLIP), g(v.step))), ...set(v.yx),
        ...fadd(g(v.yy), fmul(f(CLIP), g(v.step))), ...set(v.yy),
      ]),
    ]),
  ];
  const edge: Code = [
    ...attraction,
    // This edge's share of the point's negative samples, right after its pull.
    ...fadd(g(v.owed), fmul(loadF32(at(v.pull, g(v.t), 2)), g(v.negatives))), ...set(v.owed),
    ...g(v.owed), ...op.f64Floor, ...op.i32TruncF64S, ...set(v.count),
    ...fsub(g(v.owed), [...g(v.count), ...op.f64ConvertI32S]), ...set(v.owed),
    ...c(0), ...set(v.q),
    ...loopWhile([...g(v.q), ...g(v.count), ...op.i32LtS], [...negative, ...iadd(g(v.q), c(1)), ...set(v.q)]),
    ...iadd(g(v.t), c(1)), ...set(v.t),
  ];
  const point: Code = [
    ...at(v.both, ishl(g(v.p), 1), 3), ...set(v.addr),
    ...load64(g(v.addr)), ...set(v.yx),
    ...load64(g(v.addr), 8), ...set(v.yy),
    // wlo = max(p − reach, 0), whi = min(p + reach, n − 1)
    ...c(0), ...isub(g(v.p), g(v.reach)), ...tee(v.wlo), ...g(v.wlo), ...c(0), ...op.i32LtS, ...op.select, ...set(v.wlo),
    ...isub(g(v.n), c(1)), ...iadd(g(v.p), g(v.reach)), ...tee(v.whi), ...g(v.whi), ...g(v.n), ...op.i32GeS, ...op.select, ...set(v.whi),
    ...isub(g(v.whi), g(v.wlo)), ...c(1), ...op.i32Add, ...op.f64ConvertI32S, ...set(v.span),
    ...fdiv(g(v.alpha), fadd(fsub(f(1), g(v.share)), fdiv(fmul(g(v.share), [...g(v.n), ...op.f64ConvertI32S]), g(v.span)))), ...set(v.nearStep),
    ...fdiv(g(v.alpha), fsub(f(1), g(v.share))), ...set(v.farStep),
    ...fdiv(g(v.span), g(v.nearby)), ...set(v.nearScale),
    ...fdiv([...g(v.n), ...op.f64ConvertI32S], fsub(f(4294967296), g(v.nearby))), ...set(v.farScale),
    ...load64(at(v.due, g(v.p), 3)), ...set(v.owed),
    ...load32(at(v.rowStart, g(v.p), 2), 4), ...set(v.end),
    ...load32(at(v.rowStart, g(v.p), 2)), ...set(v.t),
    ...loopWhile([...g(v.t), ...g(v.end), ...op.i32LtS], edge),
    ...at(v.both, ishl(g(v.p), 1), 3), ...set(v.addr),
    ...store64(g(v.addr), g(v.yx)),
    ...store64(g(v.addr), g(v.yy), 8),
    ...store64(at(v.due, g(v.p), 3), g(v.owed)),
    ...iadd(g(v.p), c(1)), ...set(v.p),
  ];
  return [
    ...ints.flatMap((name) => [...load32(g(BLOCK), P[name === 'rng' ? 'seed' : name]), ...set(v[name])]),
    ...floats.flatMap((name) => [...load64(g(BLOCK), P[name]), ...set(v[name])]),
    ...fdiv(g(v.nearby), f(4294967296)), ...set(v.share),
    ...ishl(g(v.n), 1), ...set(v.twoN),
    ...g(v.from), ...set(v.p),
    ...loopWhile([...g(v.p), ...g(v.to), ...op.i32LtS], point),
  ];
}

let compiled: WebAssembly.Module | null = null;
function kernelModule(): WebAssembly.Module {
  compiled ??= new WebAssembly.Module(
    wasmModule(
      [{ name: 'sgdRows', params: 1, locals: [[L.ints, I32], [L.floats, F64]], body: [...sgdRowsBody()] }],
      [{ name: 'exp', params: 1 }, { name: 'log', params: 1 }],
    ),
  );
  return compiled;
}

/** Instances by memory: a memory posted to another thread arrives as a new object, so each thread keeps its own. */
const instances = new WeakMap<WebAssembly.Memory, (block: number) => void>();

/** Runs one round on the parameter block at byte `block` of `memory` (see {@link writeParams}). */
export function sgdRows(memory: WebAssembly.Memory, block: number): void {
  let run = instances.get(memory);
  if (!run) {
    const exports = new WebAssembly.Instance(kernelModule(), { env: { memory, exp: Math.exp, log: Math.log } }).exports as { sgdRows(block: number): void };
    run = exports.sgdRows;
    instances.set(memory, run);
  }
  run(block);
}
