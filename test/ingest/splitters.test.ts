// The three incremental splitters must not depend on where the text is cut: property checks
// with fast-check (fixed seeds) over text made of the characters that matter to them.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { CsvSplitter, JsonArraySplitter, LineSplitter } from '../../server/ingest/index.js';

interface Feeder<R> {
  feed(text: string, final: boolean, out: R[]): void;
}

/** Feeds `text` cut at `cuts`, returns the records or the error message. */
function run<R>(make: () => Feeder<R>, text: string, cuts: number[]): { records: R[] } | { error: string } {
  const splitter = make();
  const out: R[] = [];
  try {
    let from = 0;
    for (const cut of cuts) {
      splitter.feed(text.slice(from, cut), false, out);
      from = cut;
    }
    splitter.feed(text.slice(from), true, out);
    return { records: out };
  } catch (err) {
    return { error: (err as Error).message };
  }
}

const piece = fc.constantFrom('"', '""', ',', ';', '\t', '\r', '\n', '\r\n', '{', '}', '[', ']', ':', '\\', '\\"', 'a', 'é', '😀', ' ', '"t"', '1');
const textAndCuts = fc
  .array(piece, { maxLength: 80 })
  .map((p) => p.join(''))
  .chain((t) =>
    fc.tuple(
      fc.constant(t),
      // decodeUtf8 never cuts inside a character, so neither do these cuts (no split surrogate pairs).
      fc
        .uniqueArray(fc.nat(t.length), { maxLength: 8 })
        .map((c) => c.filter((i) => !(t.charCodeAt(i) >= 0xdc00 && t.charCodeAt(i) <= 0xdfff)).sort((a, b) => a - b)),
    ),
  );

const makers: Record<string, () => Feeder<unknown>> = {
  'CsvSplitter (comma)': () => new CsvSplitter(',', 1e9),
  'CsvSplitter (semicolon)': () => new CsvSplitter(';', 1e9),
  'CsvSplitter (tab)': () => new CsvSplitter('\t', 1e9),
  LineSplitter: () => new LineSplitter(1e9, 'Line'),
  JsonArraySplitter: () => new JsonArraySplitter(1e9),
};

describe('splitters are independent of chunk boundaries', () => {
  for (const [name, make] of Object.entries(makers)) {
    it(`${name} gives the same records or error however the text is cut`, () => {
      fc.assert(
        fc.property(textAndCuts, ([text, cuts]) => {
          expect(run(make, text, cuts)).toEqual(run(make, text, []));
        }),
        { numRuns: 1500, seed: 42 },
      );
    });
  }

  it('LineSplitter numbers lines the same with CRLF, LF and lone CR, even with CRLF cut in half', () => {
    const text = 'a\r\nb\nc\rd\r\n';
    for (let cut = 0; cut <= text.length; cut++) {
      expect(run(() => new LineSplitter(1e9, 'Line'), text, [cut])).toEqual({
        records: [
          { line: 1, text: 'a' },
          { line: 2, text: 'b' },
          { line: 3, text: 'c' },
          { line: 4, text: 'd' },
        ],
      });
    }
  });

  it('CsvSplitter refuses a record longer than its limit with the record start line', () => {
    expect(run(() => new CsvSplitter(',', 10), 'a\n"' + 'x'.repeat(30), ['a\n"'.length + 20])).toEqual({
      error: expect.stringContaining('starting on line 2'),
    });
  });
});
