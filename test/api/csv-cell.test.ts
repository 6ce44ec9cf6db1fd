import { describe, expect, it } from 'vitest';
import { csvCell, csvRow } from '../../server/api/csv-cell.js';

describe('CSV export cells', () => {
  it('quotes fields with commas, quotes and line breaks, doubling inner quotes (RFC 4180 §2.5–2.7)', () => {
    expect(csvCell('a,b')).toBe('"a,b"');
    expect(csvCell('say "hi"')).toBe('"say ""hi"""');
    expect(csvCell('two\r\nlines')).toBe('"two\r\nlines"');
    expect(csvCell('plain')).toBe('plain');
    expect(csvRow(['a', 1.5, null])).toBe('a,1.5,\r\n');
  });

  it('neutralises cells a spreadsheet would run as formulas (OWASP CSV injection guidance)', () => {
    for (const s of ['=1+1', '+SUM(A1)', '-2+3', '@cmd', '\tx', '\rx']) expect(csvCell(s).replace(/^"/, '').startsWith("'")).toBe(true);
    expect(csvCell('=HYPERLINK("http://x","y")')).toBe(`"'=HYPERLINK(""http://x"",""y"")"`);
    expect(csvCell(-2)).toBe('-2');
    expect(csvCell('a=b')).toBe('a=b');
  });
});
