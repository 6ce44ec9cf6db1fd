/** The CSV delimiters sheaf recognises. */
export type CsvDelimiter = ',' | ';' | '\t';

/** Candidates in the order that wins ties: comma first, as RFC 4180 defines it. */
const CANDIDATES: readonly CsvDelimiter[] = [',', '\t', ';'];

/**
 * Picks the delimiter of a CSV file from its header row: the candidate (comma, tab, semicolon)
 * under which the header names `textField` (ignoring case and surrounding spaces) wins; failing
 * that, the one that splits the header into the most fields; ties, and headers with none of them,
 * go to the comma. Semicolons are what spreadsheets write where the comma is the decimal mark.
 * @param head - the start of the file (at least its first line)
 * @param textField - the column the caller wants as text
 */
export function sniffDelimiter(head: string, textField: string): CsvDelimiter {
  const header = headerFields(head);
  const wanted = textField.trim().toLowerCase();
  let best: CsvDelimiter = ',';
  let bestScore = -1;
  for (const d of CANDIDATES) {
    const fields = header(d);
    const names = fields.some((f) => f.trim().toLowerCase() === wanted) ? 1_000_000 : 0;
    const score = names + fields.length;
    if (score > bestScore) {
      best = d;
      bestScore = score;
    }
  }
  return best;
}

/** Returns a function splitting the first row of `head` by a delimiter, quotes respected. */
function headerFields(head: string): (d: string) => string[] {
  return (d) => {
    const fields: string[] = [];
    let field = '';
    let quoted = false;
    for (let i = 0; i < head.length; i++) {
      const c = head[i]!;
      if (quoted) {
        if (c === '"') {
          if (head[i + 1] === '"') {
            field += '"';
            i++;
          } else quoted = false;
        } else field += c;
      } else if (c === '"') quoted = true;
      else if (c === d) {
        fields.push(field);
        field = '';
      } else if (c === '\n' || c === '\r') break;
      else field += c;
    }
    fields.push(field);
    return fields;
  };
}
