/**
 * Just enough of the WebAssembly binary format (WebAssembly Core Specification 2.0, chapter 5,
 * with the fixed-width SIMD instructions) to write a small numeric kernel as bytes in TypeScript,
 * so no compiler or build step outside Node is needed. A module here has one imported shared
 * memory, optionally imported functions of float64s (for what the kernels rarely need, such as
 * Math.exp), and exported functions of i32 parameters without results.
 */

/** Value types (§5.3.1). */
export const I32 = 0x7f;
export const F32 = 0x7d;
export const F64 = 0x7c;
export const V128 = 0x7b;

/** Unsigned LEB128. */
export function uleb(n: number): number[] {
  const out: number[] = [];
  do {
    let byte = n & 0x7f;
    n >>>= 7;
    if (n !== 0) byte |= 0x80;
    out.push(byte);
  } while (n !== 0);
  return out;
}

/** Signed LEB128 (for i32.const). */
export function sleb(n: number): number[] {
  const out: number[] = [];
  for (;;) {
    const byte = n & 0x7f;
    n >>= 7;
    if ((n === 0 && (byte & 0x40) === 0) || (n === -1 && (byte & 0x40) !== 0)) {
      out.push(byte);
      return out;
    }
    out.push(byte | 0x80);
  }
}

function name(text: string): number[] {
  const bytes = [...new TextEncoder().encode(text)];
  return [...uleb(bytes.length), ...bytes];
}

function vector(items: number[][]): number[] {
  return [...uleb(items.length), ...items.flat()];
}

function section(id: number, body: number[]): number[] {
  return [id, ...uleb(body.length), ...body];
}

/** Instructions used by our kernels, as byte sequences (§5.4). */
export const op = {
  block: [0x02, 0x40],
  loop: [0x03, 0x40],
  /** `if` without a result; `else` and `end` close it. */
  if: [0x04, 0x40],
  else: [0x05],
  end: [0x0b],
  br: (depth: number) => [0x0c, ...uleb(depth)],
  brIf: (depth: number) => [0x0d, ...uleb(depth)],
  /** Calls function `index` (imports first, then the module's own). */
  call: (index: number) => [0x10, ...uleb(index)],
  select: [0x1b],
  get: (i: number) => [0x20, ...uleb(i)],
  set: (i: number) => [0x21, ...uleb(i)],
  tee: (i: number) => [0x22, ...uleb(i)],
  /** Loads and stores: alignment exponent, then byte offset. */
  i32Load: (offset = 0) => [0x28, 2, ...uleb(offset)],
  f32Load: (offset = 0) => [0x2a, 2, ...uleb(offset)],
  i32Load8U: (offset = 0) => [0x2d, 0, ...uleb(offset)],
  i32Store: (offset = 0) => [0x36, 2, ...uleb(offset)],
  i32Store8: (offset = 0) => [0x3a, 0, ...uleb(offset)],
  f64Load: (offset = 0) => [0x2b, 3, ...uleb(offset)],
  f64Store: (offset = 0) => [0x39, 3, ...uleb(offset)],
  i32Const: (v: number) => [0x41, ...sleb(v)],
  f32Zero: [0x43, 0, 0, 0, 0],
  f64Const: (v: number) => [0x44, ...new Uint8Array(new Float64Array([v]).buffer)],
  i32Eq: [0x46],
  i32Ne: [0x47],
  i32LtS: [0x48],
  i32LtU: [0x49],
  i32GtS: [0x4a],
  i32LeU: [0x4d],
  i32GeS: [0x4e],
  i32GeU: [0x4f],
  i32Eqz: [0x45],
  f64Le: [0x65],
  f64Lt: [0x63],
  f64Gt: [0x64],
  i32Add: [0x6a],
  i32Sub: [0x6b],
  i32Mul: [0x6c],
  i32And: [0x71],
  i32Or: [0x72],
  i32Xor: [0x73],
  i32Shl: [0x74],
  i32ShrS: [0x75],
  i32ShrU: [0x76],
  i64ShrU: [0x88],
  f32Add: [0x92],
  f32Mul: [0x94],
  f64Floor: [0x9c],
  f64Add: [0xa0],
  f64Sub: [0xa1],
  f64Mul: [0xa2],
  f64Div: [0xa3],
  f64Min: [0xa4],
  f64Max: [0xa5],
  i32WrapI64: [0xa7],
  i32TruncF64S: [0xaa],
  i64Const: (v: number) => [0x42, ...sleb(v)],
  f64ConvertI32S: [0xb7],
  f64ConvertI32U: [0xb8],
  f64PromoteF32: [0xbb],
  i64ReinterpretF64: [0xbd],
  /** SIMD (prefix 0xfd, then the opcode as unsigned LEB128). */
  v128Load: (offset = 0) => [0xfd, ...uleb(0x00), 4, ...uleb(offset)],
  v128Zero: [0xfd, ...uleb(0x0c), ...new Array<number>(16).fill(0)],
  f32x4ExtractLane: (lane: number) => [0xfd, ...uleb(0x1f), lane],
  f32x4Add: [0xfd, ...uleb(0xe4)],
  f32x4Mul: [0xfd, ...uleb(0xe6)],
} as const;

/** One exported function: its i32 parameter count, its extra locals by type, its body (without the final `end`). */
export interface WasmFunction {
  name: string;
  params: number;
  locals: Array<[count: number, type: number]>;
  body: number[];
}

/** A function the module imports from `env`: float64 parameters, one float64 result. */
export interface WasmImport {
  name: string;
  params: number;
}

/**
 * A module importing `env.memory` (a shared memory of up to 65,536 pages) and the functions
 * `imports` (numbered 0, 1, … for `op.call`, the module's own functions following them), and
 * exporting the given functions, each of type (i32 × params) → ().
 */
export function wasmModule(functions: WasmFunction[], imports: WasmImport[] = []): Uint8Array<ArrayBuffer> {
  const importTypes = imports.map((f) => [0x60, ...vector(new Array<number[]>(f.params).fill([F64])), ...vector([[F64]])]);
  const types = [...importTypes, ...functions.map((f) => [0x60, ...vector(new Array<number[]>(f.params).fill([I32])), 0])];
  // Memory import limits: flag 3 = has a maximum and is shared.
  const memory = [...name('env'), ...name('memory'), 0x02, 0x03, ...uleb(1), ...uleb(65536)];
  const calls = imports.map((f, i) => [...name('env'), ...name(f.name), 0x00, ...uleb(i)]);
  const own = (i: number) => imports.length + i;
  const bodies = functions.map((f) => {
    const code = [...vector(f.locals.map(([count, type]) => [...uleb(count), type])), ...f.body, ...op.end];
    return [...uleb(code.length), ...code];
  });
  return new Uint8Array([
    0x00, 0x61, 0x73, 0x6d, 0x01, 0x00, 0x00, 0x00,
    ...section(1, vector(types)),
    ...section(2, vector([memory, ...calls])),
    ...section(3, vector(functions.map((_, i) => uleb(own(i))))),
    ...section(7, vector(functions.map((f, i) => [...name(f.name), 0x00, ...uleb(own(i))]))),
    ...section(10, vector(bodies)),
  ]);
}
