/**
 * One CSV cell per RFC 4180, guarded against formula injection: a cell that a spreadsheet would
 * run as a formula (starting with = + - @, a tab or a carriage return) gets a leading apostrophe,
 * as OWASP's CSV-injection guidance advises. Numbers we write ourselves are passed as numbers and
 * never guarded.
 */
export function csvCell(value: string | number | null | undefined): string {
  if (value === null || value === undefined) return '';
  if (typeof value === 'number') return Number.isFinite(value) ? String(value) : '';
  let s = value;
  if (/^[=+\-@\t\r]/.test(s)) s = "'" + s;
  return /[",\r\n]/.test(s) ? `"${s.replace(/"/g, '""')}"` : s;
}

/** One CSV record (CRLF-terminated, as RFC 4180 says). */
export function csvRow(cells: (string | number | null | undefined)[]): string {
  return cells.map(csvCell).join(',') + '\r\n';
}
