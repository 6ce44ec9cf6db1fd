import { describe, expect, it } from 'vitest';
import { op, sleb, uleb, wasmModule } from '../../server/common/wasm-binary.js';

describe('WebAssembly binary writer', () => {
  it('encodes LEB128 as the DWARF 4 specification tabulates it (§7.6, figures 22 and 23, values from memory)', () => {
    expect([2, 127, 128, 129, 130, 12857].map(uleb)).toEqual([[2], [127], [0x80, 1], [0x81, 1], [0x82, 1], [0xb9, 0x64]]);
    expect([2, -2, 127, -127, 128, -128, 129, -129].map(sleb)).toEqual([[2], [0x7e], [0xff, 0], [0x81, 0x7f], [0x80, 1], [0x80, 0x7f], [0x81, 1], [0xff, 0x7e]]);
  });

  it('writes a module V8 validates and runs, reading and writing the shared memory it imports', () => {
    // square(out, at): the float64 at byte `out` becomes the square of the float32 at byte `at`.
    const body = [...op.get(0), ...op.get(1), ...op.f32Load(), ...op.get(1), ...op.f32Load(), ...op.f32Mul, ...op.f64PromoteF32, ...op.f64Store()];
    const bytes = wasmModule([{ name: 'square', params: 2, locals: [], body }]);
    expect(WebAssembly.validate(bytes)).toBe(true);
    const memory = new WebAssembly.Memory({ initial: 1, maximum: 1, shared: true });
    const square = new WebAssembly.Instance(new WebAssembly.Module(bytes), { env: { memory } }).exports.square as (out: number, at: number) => void;
    new Float32Array(memory.buffer, 64, 1)[0] = 1.5;
    square(8, 64);
    expect(new Float64Array(memory.buffer, 8, 1)[0]).toBe(2.25);
  });

  it('calls the functions it imports, numbered before its own, and branches with if/else', () => {
    // pick(out, at): the float64 at byte `out` becomes x < 0 ? neg(x) : sqrt(x), x the float64 at byte `at`.
    const x = [...op.get(1), ...op.f64Load()];
    const body = [
      ...x, ...op.f64Const(0), ...op.f64Lt, ...op.if,
      ...op.get(0), ...x, ...op.call(1), ...op.f64Store(),
      ...op.else,
      ...op.get(0), ...x, ...op.call(0), ...op.f64Store(),
      ...op.end,
    ];
    const bytes = wasmModule([{ name: 'pick', params: 2, locals: [], body }], [{ name: 'sqrt', params: 1 }, { name: 'neg', params: 1 }]);
    expect(WebAssembly.validate(bytes)).toBe(true);
    const memory = new WebAssembly.Memory({ initial: 1, maximum: 1, shared: true });
    const env = { memory, sqrt: Math.sqrt, neg: (v: number) => -v };
    const pick = new WebAssembly.Instance(new WebAssembly.Module(bytes), { env }).exports.pick as (out: number, at: number) => void;
    const f64 = new Float64Array(memory.buffer, 0, 4);
    f64[1] = 6.25;
    pick(0, 8);
    expect(f64[0]).toBe(2.5);
    f64[1] = -3;
    pick(16, 8);
    expect(f64[2]).toBe(3);
  });
});
