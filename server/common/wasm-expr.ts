/**
 * Expression helpers for kernels written with wasm-binary.ts: each returns the bytes that leave
 * one value on the stack (or, for the control forms, none), so a kernel reads like the loop it
 * states rather than as a flat list of stack operations.
 */
import { op } from './wasm-binary.js';

/** A run of instruction bytes. */
export type Code = readonly number[];

const bin = (o: Code) => (x: Code, y: Code): Code => [...x, ...y, ...o];
export const iadd = bin(op.i32Add);
export const isub = bin(op.i32Sub);
export const imul = bin(op.i32Mul);
/** x shifted left by the constant n. */
export const ishl = (x: Code, n: number): Code => [...x, ...op.i32Const(n), ...op.i32Shl];
export const fadd = bin(op.f64Add);
export const fsub = bin(op.f64Sub);
export const fmul = bin(op.f64Mul);
export const fdiv = bin(op.f64Div);
/** `if (cond) then` */
export const ifThen = (cond: Code, then: Code): Code => [...cond, ...op.if, ...then, ...op.end];
/** `if (cond) then else other` */
export const ifElse = (cond: Code, then: Code, other: Code): Code => [...cond, ...op.if, ...then, ...op.else, ...other, ...op.end];
/** `while (cond) body` */
export const loopWhile = (cond: Code, body: Code): Code => [...op.block, ...op.loop, ...cond, ...op.i32Eqz, ...op.brIf(1), ...body, ...op.br(0), ...op.end, ...op.end];
