import type { ParseSummary } from './api.js';

/**
 * Splits a parser into what a store import wants: the batches as a plain async iterable, and the
 * summary once the batches have run out (null before that).
 */
export function batchesOf<T>(parse: AsyncGenerator<T[], ParseSummary>): { batches: AsyncIterable<T[]>; summary: () => ParseSummary | null } {
  let summary: ParseSummary | null = null;
  async function* batches(): AsyncGenerator<T[]> {
    for (;;) {
      const next = await parse.next();
      if (next.done) {
        summary = next.value;
        return;
      }
      yield next.value;
    }
  }
  return { batches: batches(), summary: () => summary };
}
