/**
 * NN-descent's offers of measured pairs to the neighbour lists (offerPairs in local-join.ts) as a
 * WebAssembly kernel: the same comparisons and moves in the same order as the TypeScript loop,
 * so the same lists to the last bit (test/map/local-join.test.ts checks it against a copy of the
 * loop in TypeScript). The lists and the pairs live in the neighbour search's shared kernel
 * memory (row-kernel.ts's {@link KernelSpace}), so either thread offers in place.
 *
 * Why: the offers were 40% of the search's CPU time, a loop of bounds-checked typed-array reads
 * and branches that V8 leaves as it is. Measured (2026-12-02, bench documents, 50,000 points, one
 * process, 10 alternating pairs, same graph): the whole search took a median 1,239 ms against
 * 1,468 ms with the TypeScript loop.
 */
import { F64, I32, op, wasmModule } from '../common/wasm-binary.js';
import { iadd, ifThen, imul, ishl, loopWhile, type Code } from '../common/wasm-expr.js';
import { heapPushCode, type PushLocals } from './heap-push-code.js';

const { get, set } = op;

// Parameters: the lists' indices, distances and flags (byte addresses), k, the pairs and their
// distances, the pair count, the part of the lists not offered to (2: none), the address of the
// i32 the change count is written to.
const [INDICES, DISTANCES, FLAGS, K, PAIRS, PAIR_DISTANCES, COUNT, OTHER, OUT] = [0, 1, 2, 3, 4, 5, 6, 7, 8];
// Locals.
const [C, P, Q, CHANGES, BASE, S, END, POS, LEFT, CHILD, LIST, J, DONE] = [9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20, 21];
const D = 22; // f64
const RUN = 5; // LIST_RUN of local-join.ts: lists alternate between the parts in runs of 32.

const g = get;
const c = op.i32Const;
const dist = (slot: Code): Code => [...iadd(g(DISTANCES), ishl(slot, 3)), ...op.f64Load()];
const locals: PushLocals = { indices: INDICES, distances: DISTANCES, flags: FLAGS, k: K, list: LIST, j: J, d: D, base: BASE, end: END, s: S, pos: POS, left: LEFT, child: CHILD, done: DONE };
/** heapPush with flag 1 (the root was tested by the caller); adds 1 to CHANGES when the list changes. */
const push = (): Code => heapPushCode(locals, 1, false, [...g(CHANGES), ...c(1), ...op.i32Add, ...set(CHANGES)]);

/** Offers to `list` (a local) the point `other` (a local) when the list is in this part and D is below its root. */
function offerTo(list: number, other: number): Code {
  return ifThen([...g(list), ...c(RUN), ...op.i32ShrS, ...c(1), ...op.i32And, ...g(OTHER), ...op.i32Ne], [
    ...ifThen([...g(D), ...dist(imul(g(list), g(K))), ...op.f64Lt], [...g(list), ...set(LIST), ...g(other), ...set(J), ...push()]),
  ]);
}

function offerPairsBody(): Code {
  return [
    ...c(0), ...set(CHANGES),
    ...c(0), ...set(C),
    ...loopWhile([...g(C), ...g(COUNT), ...op.i32LtS], [
      ...iadd(g(PAIRS), ishl(g(C), 3)), ...op.i32Load(), ...set(P),
      ...iadd(g(PAIRS), ishl(g(C), 3)), ...op.i32Load(4), ...set(Q),
      ...iadd(g(PAIR_DISTANCES), ishl(g(C), 3)), ...op.f64Load(), ...set(D),
      ...offerTo(P, Q),
      ...offerTo(Q, P),
      ...g(C), ...c(1), ...op.i32Add, ...set(C),
    ]),
    ...g(OUT), ...g(CHANGES), ...op.i32Store(),
  ];
}

let compiled: WebAssembly.Module | null = null;
function kernelModule(): WebAssembly.Module {
  compiled ??= new WebAssembly.Module(wasmModule([{ name: 'offerPairs', params: 9, locals: [[13, I32], [1, F64]], body: [...offerPairsBody()] }]));
  return compiled;
}

type Offer = (indices: number, distances: number, flags: number, k: number, pairs: number, pairDistances: number, count: number, other: number, out: number) => void;
/** Instances by memory: a memory posted to another thread arrives as a new object, so each thread keeps its own. */
const instances = new WeakMap<WebAssembly.Memory, Offer>();

/** The kernel's offer function for `memory`. */
export function offerKernel(memory: WebAssembly.Memory): Offer {
  let run = instances.get(memory);
  if (!run) {
    run = (new WebAssembly.Instance(kernelModule(), { env: { memory } }).exports as { offerPairs: Offer }).offerPairs;
    instances.set(memory, run);
  }
  return run;
}
