// Whole-upload behaviour of parseDocuments: chunk boundaries anywhere give the same result,
// arbitrary bytes only ever end in an IngestError, and memory follows the batch, not the file.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { collectDocuments, IngestError, parseDocuments, type ParseOptions } from '../../server/ingest/index.js';
import { bytesOf, parse, rejection, streamOf } from './chunks.js';

type Outcome = { ok: true; value: unknown } | { ok: false; code: string; message: string; details: unknown };

/** Runs a parse and describes how it ended; anything but an IngestError is rethrown. */
async function outcome(input: Uint8Array, cuts: number[], opts: Partial<ParseOptions>): Promise<Outcome> {
  try {
    return { ok: true, value: await collectDocuments(streamOf(input, cuts), opts) };
  } catch (err) {
    if (!(err instanceof IngestError)) throw err;
    return { ok: false, code: err.code, message: err.message, details: err.details };
  }
}

const SAMPLES: Record<string, [string, Partial<ParseOptions>]> = {
  csv: ['\uFEFFid,text,note\r\n1,"café, ""naïve""\r\n日本",x\r\n2,😀 plain,\r\n3,"",y\r\n4,last row', { idField: 'id' }],
  ndjson: ['{"text":"é 😀","n":1}\r\n\n{"text":"broken\n{"text":"日本","n":[2]}', {}],
  json: ['[\n {"text":"é","n":{"a":"]"}},\n "😀 \\" x",\n {"text":""}\n]\n', {}],
  text: ['first é\r\n\r\nsecond 😀\rthird 日本', {}],
};

describe('whole uploads', () => {
  it('refuses a zero-byte upload and one of only spaces and line breaks as empty', async () => {
    for (const input of ['', ' \r\n\t\n']) {
      const err = await rejection(parse(input));
      expect(err).toBeInstanceOf(IngestError);
      expect(err.code).toBe('unprocessable');
      expect(err.message).toContain('empty');
    }
  });

  it('refuses a CSV whose every text is empty, listing the first reasons with their lines', async () => {
    const err = await rejection(parse('id,text\n1,\n2,"  "\n3,\n'));
    expect(err.code).toBe('unprocessable');
    expect(err.message).toBe('None of the 3 records holds a usable document (line 2: empty text; line 3: empty text; line 4: empty text).');
    expect(err.details).toMatchObject({ skippedCount: 3 });
  });

  it('drops a byte order mark before NDJSON and JSON too', async () => {
    const bom = '\uFEFF';
    expect((await parse(`${bom}{"text":"a"}\n`)).documents[0]!.text).toBe('a');
    expect((await parse(`${bom}["a"]`)).documents[0]!.text).toBe('a');
  });

  it('lists at most maxReported skipped lines but counts them all', async () => {
    const input = 'text\n' + '""\n'.repeat(50) + 'kept\n';
    const { summary } = await parse(input, { maxReported: 10 });
    expect(summary.skipped).toHaveLength(10);
    expect(summary.skippedCount).toBe(50);
    expect(summary.documentCount).toBe(1);
  });

  it('yields batches of batchSize documents in input order', async () => {
    const input = 'text\n' + Array.from({ length: 25 }, (_, i) => `doc ${i + 1}`).join('\n');
    const sizes: number[] = [];
    const ids: string[] = [];
    const gen = parseDocuments(streamOf(input), { batchSize: 10 });
    for (let next = await gen.next(); !next.done; next = await gen.next()) {
      sizes.push(next.value.length);
      ids.push(...next.value.map((d) => d.id));
    }
    expect(sizes).toEqual([10, 10, 5]);
    expect(ids).toEqual(Array.from({ length: 25 }, (_, i) => String(i + 1)));
  });
});

describe('chunk boundaries', () => {
  for (const [format, [input, opts]] of Object.entries(SAMPLES)) {
    it(`gives the same ${format} result when the bytes are cut at any position or byte by byte`, async () => {
      const bytes = bytesOf(input);
      const whole = await outcome(bytes, [], opts);
      expect(whole.ok).toBe(true);
      for (let i = 0; i <= bytes.length; i++) expect(await outcome(bytes, [i], opts)).toEqual(whole);
      expect(await outcome(bytes, [...bytes.keys()], opts)).toEqual(whole);
    });
  }

  it('detects every sample format automatically', async () => {
    for (const [format, [input, opts]] of Object.entries(SAMPLES)) {
      const { summary } = await collectDocuments(streamOf(input), opts);
      expect(summary.format).toBe(format);
    }
  });
});

describe('properties (fast-check, fixed seed)', () => {
  const formats = fc.constantFrom<ParseOptions['format']>('auto', 'csv', 'ndjson', 'json', 'text');
  const cutsFor = (length: number) => fc.uniqueArray(fc.nat(length), { maxLength: 6 }).map((c) => c.sort((a, b) => a - b));

  it('ends arbitrary bytes in documents or an IngestError, never another error and never a hang', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc
          .oneof(
            fc.uint8Array({ maxLength: 300 }),
            // Mostly text with stray bytes, so the parsers run before an encoding error stops them.
            fc
              .array(fc.oneof(fc.constantFrom('text,id\n', '"', ',', '\r\n', '{"text":"a"}', '[', ']', 'é', ' x').map(bytesOf), fc.uint8Array({ maxLength: 2 })), {
                maxLength: 40,
              })
              .map((parts) => Uint8Array.from(parts.flatMap((p) => [...p]))),
          )
          .chain((b) => fc.tuple(fc.constant(b), cutsFor(b.length), formats)),
        async ([bytes, cuts, format]) => {
          const result = await outcome(bytes, cuts, { format });
          if (!result.ok) expect(['unsupported_media_type', 'unprocessable', 'bad_request']).toContain(result.code);
        },
      ),
      { numRuns: 400, seed: 20261201, plugins: [fc.timeout(5000)] },
    );
  });

  it('gives the same outcome for text made of CSV and JSON punctuation however it is chunked', async () => {
    const piece = fc.constantFrom('"', ',', ';', '\t', '\r', '\n', '\r\n', '{', '}', '[', ']', ':', '\\', 'a', 'text', 'id', 'é', '😀', ' ', '"text":', '0', '\uFEFF');
    await fc.assert(
      fc.asyncProperty(
        fc
          .array(piece, { maxLength: 60 })
          .map((p) => bytesOf(p.join('')))
          .chain((b) => fc.tuple(fc.constant(b), cutsFor(b.length), formats, fc.option(fc.constant('id'), { nil: undefined }))),
        async ([bytes, cuts, format, idField]) => {
          const opts = { format, idField };
          expect(await outcome(bytes, cuts, opts)).toEqual(await outcome(bytes, [], opts));
        },
      ),
      { numRuns: 400, seed: 7, plugins: [fc.timeout(5000)] },
    );
  });
});

describe('streaming', () => {
  /** A lazily generated CSV of `rows` rows of about 400 bytes; counts what has been read and whether it was closed. */
  function source(rows: number) {
    const state = { bytesRead: 0, closed: false };
    const line = (i: number) => `${i},"ticket ${i}: the printer on floor ${i % 7} says ""paper jam"", again, after the update",${'word '.repeat(60)}\n`;
    async function* gen(): AsyncGenerator<Uint8Array> {
      try {
        const enc = new TextEncoder();
        let pending = 'id,text,notes\n';
        for (let i = 1; i <= rows; i++) {
          pending += line(i);
          if (pending.length >= 65536 || i === rows) {
            const chunk = enc.encode(pending);
            state.bytesRead += chunk.length;
            pending = '';
            yield chunk;
          }
        }
      } finally {
        state.closed = true;
      }
    }
    return { state, chunks: gen() };
  }

  it('yields the first batch after reading about one batch of a 50 MB CSV, not the file', async () => {
    const rows = 130_000; // ≈ 50.7 MB
    const { state, chunks } = source(rows);
    const gen = parseDocuments(chunks, { idField: 'id', batchSize: 1000 });
    const first = await gen.next();
    expect(first.done).toBe(false);
    expect((first.value as unknown[]).length).toBe(1000);
    expect(state.bytesRead).toBeLessThan(1_000_000);
    let count = 1000;
    let largest = 0;
    let last: IteratorResult<unknown[], unknown>;
    while (!(last = await gen.next()).done) {
      count += last.value.length;
      largest = Math.max(largest, last.value.length);
    }
    expect(largest).toBeLessThanOrEqual(1000);
    expect(count).toBe(rows);
    expect(state.bytesRead).toBeGreaterThan(50_000_000);
    expect(last.value).toMatchObject({ format: 'csv', documentCount: rows, skippedCount: 0, fields: ['notes'] });
  });

  it('stops reading and closes the source when the consumer stops (a cancelled upload)', async () => {
    const { state, chunks } = source(125_000);
    const gen = parseDocuments(chunks);
    await gen.next();
    const readAtStop = state.bytesRead;
    await gen.return(undefined as never);
    expect(state.closed).toBe(true);
    expect(state.bytesRead).toBe(readAtStop);
  });
});
