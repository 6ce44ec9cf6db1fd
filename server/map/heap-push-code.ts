/**
 * heapPush of neighbor-heap.ts as WebAssembly instructions, for the kernels that offer to
 * neighbour lists in place (offer-kernel.ts, sample-kernel.ts): the same comparisons and moves in
 * the same order, so the same lists to the last bit.
 */
import { op } from '../common/wasm-binary.js';
import { iadd, ifThen, imul, ishl, loopWhile, type Code } from '../common/wasm-expr.js';

const { get: g, set } = op;
const c = op.i32Const;

/** Locals a push reads (the lists' byte addresses, k, the list, the neighbour j, its f64 distance d) and uses. */
export interface PushLocals {
  indices: number;
  distances: number;
  flags: number;
  k: number;
  list: number;
  j: number;
  d: number;
  base: number;
  end: number;
  s: number;
  pos: number;
  left: number;
  child: number;
  done: number;
}

/**
 * Offers j at distance d to the list: kept if nearer than the list's farthest (tested here only
 * when `checkRoot`, for callers that have not) and not already listed, sifted down from the root
 * with `flag`; `changed` runs when the list changes.
 */
export function heapPushCode(l: PushLocals, flag: number, checkRoot: boolean, changed: Code): Code {
  const slot = (pos: number) => iadd(g(l.base), g(pos));
  const dist = (at: Code): Code => [...iadd(g(l.distances), ishl(at, 3)), ...op.f64Load()];
  const idx = (at: Code): Code => [...iadd(g(l.indices), ishl(at, 2)), ...op.i32Load()];
  const flagAt = (at: Code): Code => [...iadd(g(l.flags), at), ...op.i32Load8U()];
  return [
    ...imul(g(l.list), g(l.k)), ...set(l.base),
    ...iadd(g(l.base), g(l.k)), ...set(l.end),
    // done = 1 stops the push: a root not farther than d, or j already listed.
    ...c(0), ...set(l.done),
    ...(checkRoot ? ifThen([...g(l.d), ...dist(g(l.base)), ...op.f64Lt, ...op.i32Eqz], [...c(1), ...set(l.done)]) : []),
    ...g(l.base), ...set(l.s),
    ...loopWhile([...g(l.done), ...op.i32Eqz, ...g(l.s), ...g(l.end), ...op.i32LtS, ...op.i32And], [
      ...ifThen([...idx(g(l.s)), ...g(l.j), ...op.i32Eq], [...c(1), ...set(l.done)]),
      ...g(l.s), ...c(1), ...op.i32Add, ...set(l.s),
    ]),
    ...ifThen([...g(l.done), ...op.i32Eqz], [
      ...c(0), ...set(l.pos),
      ...op.block, ...op.loop,
      ...ishl(g(l.pos), 1), ...c(1), ...op.i32Add, ...set(l.left),
      ...g(l.left), ...g(l.k), ...op.i32GeS, ...op.brIf(1),
      ...g(l.left), ...set(l.child),
      // right < k && dist[right] > dist[left] → child = right
      ...ifThen([...g(l.left), ...c(1), ...op.i32Add, ...g(l.k), ...op.i32LtS], [
        ...ifThen([...dist(iadd(slot(l.left), c(1))), ...dist(slot(l.left)), ...op.f64Gt], [...g(l.left), ...c(1), ...op.i32Add, ...set(l.child)]),
      ]),
      ...dist(slot(l.child)), ...g(l.d), ...op.f64Le, ...op.brIf(1),
      ...iadd(g(l.distances), ishl(slot(l.pos), 3)), ...dist(slot(l.child)), ...op.f64Store(),
      ...iadd(g(l.indices), ishl(slot(l.pos), 2)), ...idx(slot(l.child)), ...op.i32Store(),
      ...iadd(g(l.flags), slot(l.pos)), ...flagAt(slot(l.child)), ...op.i32Store8(),
      ...g(l.child), ...set(l.pos),
      ...op.br(0), ...op.end, ...op.end,
      ...iadd(g(l.distances), ishl(slot(l.pos), 3)), ...g(l.d), ...op.f64Store(),
      ...iadd(g(l.indices), ishl(slot(l.pos), 2)), ...g(l.j), ...op.i32Store(),
      ...iadd(g(l.flags), slot(l.pos)), ...c(flag), ...op.i32Store8(),
      ...changed,
    ]),
  ];
}
