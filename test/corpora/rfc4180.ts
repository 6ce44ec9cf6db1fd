/**
 * A deliberately strict CSV reader for tests, written from the grammar in RFC 4180 §2
 * (Shafranovich, 2005): records end in CRLF, a field is either plain TEXTDATA (no comma, quote, CR
 * or LF) or enclosed in double quotes with inner quotes doubled, and nothing may follow a closing
 * quote but a comma or a line break. Anything else throws, with the 1-based record number.
 * It is kept independent of corpora/to-csv.ts on purpose: a writer checked by its own reader
 * proves nothing.
 */
export function readRfc4180(text: string): string[][] {
  const records: string[][] = [];
  let record: string[] = [];
  let i = 0;
  const n = text.length;
  const fail = (why: string): never => {
    throw new SyntaxError(`record ${records.length + 1}: ${why} at offset ${i}`);
  };
  for (;;) {
    let field = '';
    const quoted = text[i] === '"';
    if (quoted) {
      i++;
      for (;;) {
        if (i >= n) fail('quoted field never closed');
        if (text[i] === '"') {
          if (text[i + 1] === '"') { field += '"'; i += 2; continue; }
          i++;
          break;
        }
        field += text[i++];
      }
    } else {
      while (i < n && text[i] !== ',' && text[i] !== '\r' && text[i] !== '\n') {
        if (text[i] === '"') fail('double quote inside an unquoted field');
        field += text[i++];
      }
    }
    record.push(field);
    if (i >= n) break;
    if (text[i] === ',') { i++; continue; }
    if (text[i] === '\r' && text[i + 1] === '\n') {
      i += 2;
      records.push(record);
      record = [];
      if (i >= n) return records; // a CRLF after the last record is allowed (§2 rule 2)
      continue;
    }
    fail(quoted ? 'text after a closing quote' : 'line break that is not CRLF');
  }
  records.push(record);
  return records;
}
