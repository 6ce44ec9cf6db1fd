/** Writes a table as CSV following RFC 4180 (Shafranovich, 2005). */

/**
 * Writes a header and rows as RFC 4180 CSV: records end in CRLF (the last one too), a field is
 * quoted when it holds a comma, a double quote, CR or LF, or starts or ends with a space, and a
 * double quote inside a quoted field is doubled. Line breaks inside fields are kept as they are.
 * @param table header and rows; every row must be as wide as the header
 * @throws RangeError when a row has the wrong number of fields
 */
export function toCsv(table: { header: readonly string[]; rows: readonly (readonly string[])[] }): string {
  const width = table.header.length;
  const lines: string[] = [table.header.map(quoteField).join(',')];
  table.rows.forEach((row, i) => {
    if (row.length !== width) {
      throw new RangeError(`row ${i + 1} has ${row.length} fields but the header has ${width}; every row needs one per column`);
    }
    lines.push(row.map(quoteField).join(','));
  });
  return lines.join('\r\n') + '\r\n';
}

function quoteField(field: string): string {
  return /[",\r\n]|^ | $/.test(field) ? `"${field.replace(/"/g, '""')}"` : field;
}
