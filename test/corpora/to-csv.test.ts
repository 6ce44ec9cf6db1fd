import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { toCsv } from '../../corpora/to-csv.js';
import { readRfc4180 } from './rfc4180.js';

describe('toCsv', () => {
  it('follows the quoting rules of RFC 4180 §2 on hand-made fields', () => {
    // Expected strings written by hand from RFC 4180 §2 rules 5–7 (Shafranovich, 2005).
    const csv = toCsv({ header: ['a', 'b'], rows: [['plain', 'x,y'], ['say "hi"', 'two\nlines'], ['', ' pad']] });
    expect(csv).toBe('a,b\r\nplain,"x,y"\r\n"say ""hi""","two\nlines"\r\n," pad"\r\n');
  });

  it('refuses a row that is narrower or wider than the header', () => {
    expect(() => toCsv({ header: ['a', 'b'], rows: [['1']] })).toThrow(RangeError);
    expect(() => toCsv({ header: ['a', 'b'], rows: [['1', '2', '3']] })).toThrow(/row 1 has 3 fields/);
  });

  it('round-trips any table of strings through a strict RFC 4180 reader', () => {
    const cell = fc.string({ unit: fc.constantFrom('a', 'é', ',', '"', '\r', '\n', ' ', '£', '😊', 'x'), maxLength: 8 });
    const table = fc.integer({ min: 1, max: 4 }).chain((width) =>
      fc.record({
        header: fc.array(cell, { minLength: width, maxLength: width }),
        rows: fc.array(fc.array(cell, { minLength: width, maxLength: width }), { maxLength: 6 }),
      }),
    );
    fc.assert(
      fc.property(table, ({ header, rows }) => {
        expect(readRfc4180(toCsv({ header, rows }))).toEqual([header, ...rows]);
      }),
      { seed: 4180, numRuns: 300 },
    );
  });
});

describe('readRfc4180 (the test reader itself)', () => {
  it('rejects what RFC 4180 does not allow', () => {
    expect(() => readRfc4180('a,b"c\r\n')).toThrow(/double quote inside an unquoted field/);
    expect(() => readRfc4180('"ab"c\r\n')).toThrow(/text after a closing quote/);
    expect(() => readRfc4180('"abc\r\n')).toThrow(/never closed/);
    expect(() => readRfc4180('a,b\nc,d\r\n')).toThrow(/not CRLF/);
  });

  it('reads quoted commas, doubled quotes and inner line breaks', () => {
    expect(readRfc4180('x,"1,2"\r\n"a""b","c\r\nd"\r\n')).toEqual([['x', '1,2'], ['a"b', 'c\r\nd']]);
  });
});
