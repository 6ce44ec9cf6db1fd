/**
 * NN-descent's offers of measured pairs to the neighbour lists (offerPairs in local-join.ts) as a
 * WebAssembly kernel: the same comparisons and moves in the same order as the TypeScript loop,
 * so the same lists to the last bit (test/map/local-join.test.ts checks it against a
 * transcription). The lists and the pairs live in the neighbour search's shared kernel memory
 * (row-kernel.ts's {@link KernelSpace}), so either thread offers in place.
 *
 * Why: the offers were 40% of the search's CPU time, a loop of bounds-checked typed-array reads
 * and branches that V8 leaves as it is. Measured (2026-12-02, bench documents, 50,000 points, one
 * process, 10 alternating pairs, same graph): the whole search took a median 1,239 ms against
 * 1,468 ms with the TypeScript loop.
 */
import { F64, I32, op, wasmModule } from '../common/wasm-binary.js';

const { get, set } = op;
type Code = readonly number[];

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
const iadd = (x: Code, y: Code): Code => [...x, ...y, ...op.i32Add];
const imul = (x: Code, y: Code): Code => [...x, ...y, ...op.i32Mul];
const ishl = (x: Code, n: number): Code => [...x, ...c(n), ...op.i32Shl];
const dist = (slot: Code): Code => [...iadd(g(DISTANCES), ishl(slot, 3)), ...op.f64Load()];
const idx = (slot: Code): Code => [...iadd(g(INDICES), ishl(slot, 2)), ...op.i32Load()];
const flag = (slot: Code): Code => [...iadd(g(FLAGS), slot), ...op.i32Load8U()];
const ifThen = (cond: Code, then: Code): Code => [...cond, ...op.if, ...then, ...op.end];
const loopWhile = (cond: Code, body: Code): Code => [...op.block, ...op.loop, ...cond, ...op.i32Eqz, ...op.brIf(1), ...body, ...op.br(0), ...op.end, ...op.end];

/**
 * Offers j at distance D to list LIST (heapPush of neighbor-heap.ts with flag 1): kept if nearer
 * than the list's farthest and not already listed, sifted down from the root. Adds 1 to CHANGES
 * when the list changes.
 */
function push(): Code {
  const slot = (pos: number) => iadd(g(BASE), g(pos));
  return [
    ...imul(g(LIST), g(K)), ...set(BASE),
    ...iadd(g(BASE), g(K)), ...set(END),
    // Already listed? DONE = 1 stops the push.
    ...c(0), ...set(DONE),
    ...g(BASE), ...set(S),
    ...loopWhile([...g(S), ...g(END), ...op.i32LtS], [
      ...ifThen([...idx(g(S)), ...g(J), ...op.i32Eq], [...c(1), ...set(DONE), ...g(END), ...set(S)]),
      ...g(S), ...c(1), ...op.i32Add, ...set(S),
    ]),
    ...ifThen([...g(DONE), ...op.i32Eqz], [
      ...c(0), ...set(POS),
      ...op.block, ...op.loop,
      ...ishl(g(POS), 1), ...c(1), ...op.i32Add, ...set(LEFT),
      ...g(LEFT), ...g(K), ...op.i32GeS, ...op.brIf(1),
      ...g(LEFT), ...set(CHILD),
      // right < k && dist[right] > dist[left] → child = right
      ...ifThen([...g(LEFT), ...c(1), ...op.i32Add, ...g(K), ...op.i32LtS], [
        ...ifThen([...dist(iadd(slot(LEFT), c(1))), ...dist(slot(LEFT)), ...op.f64Gt], [...g(LEFT), ...c(1), ...op.i32Add, ...set(CHILD)]),
      ]),
      ...dist(slot(CHILD)), ...g(D), ...op.f64Le, ...op.brIf(1),
      ...iadd(g(DISTANCES), ishl(slot(POS), 3)), ...dist(slot(CHILD)), ...op.f64Store(),
      ...iadd(g(INDICES), ishl(slot(POS), 2)), ...idx(slot(CHILD)), ...op.i32Store(),
      ...iadd(g(FLAGS), slot(POS)), ...flag(slot(CHILD)), ...op.i32Store8(),
      ...g(CHILD), ...set(POS),
      ...op.br(0), ...op.end, ...op.end,
      ...iadd(g(DISTANCES), ishl(slot(POS), 3)), ...g(D), ...op.f64Store(),
      ...iadd(g(INDICES), ishl(slot(POS), 2)), ...g(J), ...op.i32Store(),
      ...iadd(g(FLAGS), slot(POS)), ...c(1), ...op.i32Store8(),
      ...g(CHANGES), ...c(1), ...op.i32Add, ...set(CHANGES),
    ]),
  ];
}

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
