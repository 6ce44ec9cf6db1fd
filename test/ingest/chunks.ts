// Helpers shared by the ingest tests: uploads as async byte streams.
import { collectDocuments, type ParseOptions } from '../../server/ingest/index.js';

/** The bytes of `input` (UTF-8 for strings). */
export function bytesOf(input: string | Uint8Array): Uint8Array {
  return typeof input === 'string' ? new TextEncoder().encode(input) : input;
}

/** An async stream of `input` cut at the given byte positions. */
export async function* streamOf(input: string | Uint8Array, cuts: readonly number[] = []): AsyncGenerator<Uint8Array> {
  const bytes = bytesOf(input);
  let from = 0;
  for (const cut of [...cuts, bytes.length]) {
    yield bytes.subarray(from, cut);
    from = cut;
  }
}

/** An async stream of `input` in chunks of `size` bytes. */
export async function* chunked(input: string | Uint8Array, size: number): AsyncGenerator<Uint8Array> {
  const bytes = bytesOf(input);
  for (let i = 0; i < bytes.length; i += size) yield bytes.subarray(i, i + size);
}

/** Parses a whole upload given as one chunk. */
export function parse(input: string | Uint8Array, opts: Partial<ParseOptions> = {}) {
  return collectDocuments(streamOf(input), opts);
}

/** The error a promise rejects with (fails when it resolves). */
export async function rejection(p: Promise<unknown>): Promise<Error & { code?: string; details?: Record<string, unknown> }> {
  try {
    await p;
  } catch (err) {
    return err as Error;
  }
  throw new Error('expected a rejection, but the promise resolved');
}
