/**
 * Parses the first rows of an upload in the browser, before anything is sent, so the person can
 * see what the server will read and pick the text and id fields. Mirrors the formats of
 * `POST /corpora`: CSV with a header row (RFC 4180 quoting), NDJSON, a JSON array, plain lines.
 */

/** Formats an upload can be read as. */
export type UploadFormat = 'csv' | 'ndjson' | 'json' | 'lines';

/** A problem found on one line of the preview. */
export interface PreviewProblem {
  /** 1-based line number in the file (for CSV and plain text, the physical line where the record starts). */
  line: number;
  reason: string;
}

/** What the preview found. */
export interface Preview {
  format: UploadFormat;
  /** Field names in first-seen order (`["text"]` for plain lines). */
  fields: string[];
  /** The first records, every value as display text. */
  rows: Record<string, string>[];
  /** Records read before stopping (at most `maxRows`). */
  problems: PreviewProblem[];
  /** The preview stopped before the end of the text (row limit or the sample ended). */
  partial: boolean;
  /** Best guess for the field holding the document text. */
  textField: string | null;
  /** Best guess for a field of unique ids, or null. */
  idField: string | null;
}

/** Options of {@link previewText}. */
export interface PreviewOptions {
  /**
   * Most records to return.
   * @default 20
   */
  maxRows: number;
  /**
   * The text is only the start of a longer file, so a last incomplete record is dropped, not reported.
   * @default false
   */
  truncated: boolean;
}

/** Defaults of {@link PreviewOptions}. */
export const DEFAULT_PREVIEW_OPTIONS: PreviewOptions = { maxRows: 20, truncated: false };

/**
 * Guesses the format from the file name first (people name files on purpose), then the content.
 * @param name file name, possibly empty
 * @param sample the first characters of the file
 */
export function detectFormat(name: string, sample: string): UploadFormat {
  const lower = name.toLowerCase();
  if (lower.endsWith('.csv')) return 'csv';
  if (lower.endsWith('.ndjson') || lower.endsWith('.jsonl')) return 'ndjson';
  if (lower.endsWith('.json')) return sample.trimStart().startsWith('[') ? 'json' : 'ndjson';
  if (lower.endsWith('.txt')) return 'lines';
  const head = sample.replace(/^\uFEFF/, '').trimStart();
  if (head.startsWith('[')) return 'json';
  if (head.startsWith('{')) return 'ndjson';
  return 'lines';
}

/**
 * Splits CSV text into records of fields (RFC 4180: quoted fields may hold commas, doubled quotes
 * and line breaks; CRLF or LF ends a record).
 * @param text CSV text
 * @returns records with the 1-based line each starts on, and whether the text ended inside quotes
 */
export function splitCsv(text: string): { records: { line: number; fields: string[] }[]; openQuote: boolean } {
  const records: { line: number; fields: string[] }[] = [];
  let fields: string[] = [];
  let field = '';
  let inQuotes = false;
  let line = 1;
  let recordLine = 1;
  let sawAny = false;
  const src = text.replace(/^\uFEFF/, '');
  for (let i = 0; i < src.length; i++) {
    const c = src[i];
    if (inQuotes) {
      if (c === '"') {
        if (src[i + 1] === '"') {
          field += '"';
          i++;
        } else inQuotes = false;
      } else {
        if (c === '\n') line++;
        field += c;
      }
      continue;
    }
    if (c === '"' && field === '') {
      inQuotes = true;
      sawAny = true;
    } else if (c === ',') {
      fields.push(field);
      field = '';
      sawAny = true;
    } else if (c === '\n' || c === '\r') {
      if (c === '\r' && src[i + 1] === '\n') i++;
      fields.push(field);
      if (sawAny || fields.length > 1 || fields[0] !== '') records.push({ line: recordLine, fields });
      fields = [];
      field = '';
      sawAny = false;
      line++;
      recordLine = line;
    } else {
      field += c;
      sawAny = true;
    }
  }
  if (sawAny || field !== '' || fields.length > 0) {
    fields.push(field);
    records.push({ line: recordLine, fields });
  }
  return { records, openQuote: inQuotes };
}

function display(v: unknown): string {
  if (v === null || v === undefined) return '';
  if (typeof v === 'string') return v;
  if (typeof v === 'number' || typeof v === 'boolean') return String(v);
  return JSON.stringify(v);
}

/**
 * Cuts the top-level elements out of the start of a JSON array without parsing the rest, so a
 * preview of a 200 MB array only reads its first elements.
 * @param text text that starts with `[`
 * @returns complete element texts, and whether the array closed within the text
 */
export function splitJsonArray(text: string, maxElements: number): { elements: string[]; closed: boolean } {
  const elements: string[] = [];
  const src = text.replace(/^\uFEFF/, '');
  let i = src.indexOf('[');
  if (i < 0) return { elements, closed: false };
  i++;
  let depth = 0;
  let start = -1;
  let inString = false;
  for (; i < src.length; i++) {
    const c = src[i];
    if (inString) {
      if (c === '\\') i++;
      else if (c === '"') inString = false;
      continue;
    }
    if (c === '"') {
      inString = true;
      if (start < 0) start = i;
    } else if (c === '{' || c === '[') {
      if (start < 0) start = i;
      depth++;
    } else if (c === '}' || c === ']') {
      if (depth === 0 && c === ']') {
        if (start >= 0) elements.push(src.slice(start, i).trim());
        return { elements, closed: true };
      }
      depth--;
    } else if (c === ',' && depth === 0) {
      if (start >= 0) elements.push(src.slice(start, i).trim());
      start = -1;
      if (elements.length >= maxElements) return { elements, closed: false };
    } else if (start < 0 && !/\s/.test(c)) {
      start = i;
    }
  }
  return { elements, closed: false };
}

const TEXT_NAMES = ['text', 'body', 'message', 'content', 'description', 'comment', 'summary', 'title'];

function guessFields(fields: string[], rows: Record<string, string>[]): { textField: string | null; idField: string | null } {
  if (fields.length === 0) return { textField: null, idField: null };
  const lowered = fields.map((f) => f.toLowerCase());
  let textField: string | null = null;
  for (const name of TEXT_NAMES) {
    const at = lowered.indexOf(name);
    if (at >= 0) {
      textField = fields[at];
      break;
    }
  }
  if (!textField) {
    let best = -1;
    for (const f of fields) {
      let total = 0;
      for (const r of rows) total += (r[f] ?? '').length;
      if (total > best) {
        best = total;
        textField = f;
      }
    }
  }
  let idField: string | null = null;
  const idAt = lowered.findIndex((f) => f === 'id' || f === 'key' || f.endsWith('_id') || f.endsWith('id'));
  if (idAt >= 0 && fields[idAt] !== textField) {
    const values = rows.map((r) => r[fields[idAt]] ?? '');
    if (values.every((v) => v !== '') && new Set(values).size === values.length) idField = fields[idAt];
  }
  return { textField, idField };
}

function collectObjects(objects: { line: number; value: unknown }[], problems: PreviewProblem[]) {
  const fields: string[] = [];
  const seen = new Set<string>();
  const rows: Record<string, string>[] = [];
  for (const { line, value } of objects) {
    if (typeof value === 'string') {
      if (!seen.has('text')) {
        seen.add('text');
        fields.push('text');
      }
      rows.push({ text: value });
      continue;
    }
    if (!value || typeof value !== 'object' || Array.isArray(value)) {
      problems.push({ line, reason: 'not an object with fields' });
      continue;
    }
    const row: Record<string, string> = {};
    for (const [k, v] of Object.entries(value as Record<string, unknown>)) {
      if (!seen.has(k)) {
        seen.add(k);
        fields.push(k);
      }
      row[k] = display(v);
    }
    rows.push(row);
  }
  return { fields, rows };
}

/**
 * Reads the first records of an upload.
 * @param text the file's text, or its first part when `opts.truncated`
 * @param format how to read it (see {@link detectFormat})
 * @param opts see {@link PreviewOptions}
 */
export function previewText(text: string, format: UploadFormat, opts: Partial<PreviewOptions> = {}): Preview {
  const o: PreviewOptions = { ...DEFAULT_PREVIEW_OPTIONS, ...opts };
  if (!Number.isInteger(o.maxRows) || o.maxRows < 1) throw new RangeError(`maxRows must be a whole number ≥ 1, got ${o.maxRows}`);
  const problems: PreviewProblem[] = [];
  let fields: string[] = [];
  let rows: Record<string, string>[] = [];
  let partial = o.truncated;
  switch (format) {
    case 'csv': {
      const { records, openQuote } = splitCsv(text);
      if (o.truncated && records.length > 1) records.pop();
      if (!o.truncated && openQuote) {
        problems.push({ line: records.at(-1)?.line ?? 1, reason: 'a quoted field is never closed' });
      }
      const header = records.shift();
      if (!header) break;
      fields = header.fields.map((f) => f.trim());
      const body = records.slice(0, o.maxRows);
      if (records.length > o.maxRows) partial = true;
      for (const r of body) {
        if (r.fields.length !== fields.length) {
          problems.push({ line: r.line, reason: `has ${r.fields.length} fields, the header has ${fields.length}` });
        }
        const row: Record<string, string> = {};
        fields.forEach((f, j) => (row[f] = r.fields[j] ?? ''));
        rows.push(row);
      }
      break;
    }
    case 'ndjson': {
      const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
      if (o.truncated && lines.length > 1) lines.pop();
      const objects: { line: number; value: unknown }[] = [];
      for (let i = 0; i < lines.length && objects.length < o.maxRows; i++) {
        const s = lines[i].trim();
        if (!s) continue;
        try {
          objects.push({ line: i + 1, value: JSON.parse(s) });
        } catch {
          problems.push({ line: i + 1, reason: 'is not valid JSON' });
        }
        if (objects.length === o.maxRows && i < lines.length - 1) partial = true;
      }
      ({ fields, rows } = collectObjects(objects, problems));
      break;
    }
    case 'json': {
      const { elements, closed } = splitJsonArray(text, o.maxRows);
      if (!closed) partial = true;
      if (!closed && !o.truncated && elements.length < o.maxRows) problems.push({ line: 1, reason: 'the JSON array is never closed' });
      const objects: { line: number; value: unknown }[] = [];
      elements.slice(0, o.maxRows).forEach((e, i) => {
        try {
          objects.push({ line: i + 1, value: JSON.parse(e) });
        } catch {
          problems.push({ line: i + 1, reason: `element ${i + 1} is not valid JSON` });
        }
      });
      ({ fields, rows } = collectObjects(objects, problems));
      break;
    }
    case 'lines': {
      const lines = text.replace(/^\uFEFF/, '').split(/\r?\n/);
      if (o.truncated && lines.length > 1) lines.pop();
      fields = ['text'];
      for (let i = 0; i < lines.length && rows.length < o.maxRows; i++) {
        if (lines[i].trim() === '') problems.push({ line: i + 1, reason: 'is empty and will be skipped' });
        else rows.push({ text: lines[i] });
      }
      if (rows.length === o.maxRows) partial = true;
      break;
    }
  }
  return { format, fields, rows, problems, partial, ...guessFields(fields, rows) };
}
