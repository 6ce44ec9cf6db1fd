/**
 * An error answer from the sheaf API (or a failure to reach it), carrying the contract's
 * `{code, message, details}` so components can show it in plain words.
 */
export class ApiError extends Error {
  /** HTTP status, or 0 when the server could not be reached. */
  readonly status: number;
  /** The contract's snake_case code, e.g. `unprocessable`. */
  readonly code: string;
  /** Extra facts the server attached (field names, limits, lines). */
  readonly details: Record<string, unknown>;

  /**
   * @param status HTTP status (0: no answer)
   * @param code snake_case error code
   * @param message a sentence a person can act on
   * @param details extra facts from the server
   */
  constructor(status: number, code: string, message: string, details: Record<string, unknown> = {}) {
    super(message);
    this.name = 'ApiError';
    this.status = status;
    this.code = code;
    this.details = details;
  }
}

const FALLBACK_WORDS: Record<string, string> = {
  bad_request: 'The request was not understood.',
  unauthorized: 'A key is needed for this.',
  forbidden: 'This key does not belong to this router.',
  not_found: 'That item no longer exists. It may have been deleted.',
  conflict: 'That cannot be done in the current state. Wait for the running job or reload.',
  payload_too_large: 'The file is larger than the server accepts.',
  unsupported_media_type: 'That kind of file or request body is not accepted.',
  unprocessable: 'The data could not be used.',
  internal: 'The server ran into a problem. Nothing was changed; try again.',
  network: 'The server could not be reached. Check that sheaf is running, then try again.',
};

/**
 * Turns any thrown value into one plain sentence for the page. Server messages are already
 * written for people, so they win; the code-based wording only fills gaps.
 * @param err whatever was thrown
 */
export function plainWords(err: unknown): string {
  if (err instanceof ApiError) {
    const msg = err.message.trim();
    if (msg) return msg;
    return FALLBACK_WORDS[err.code] ?? `The server answered ${err.status}.`;
  }
  if (err instanceof DOMException && err.name === 'AbortError') return 'Stopped.';
  if (err instanceof Error && err.message) return err.message;
  return 'Something went wrong.';
}

/**
 * Lists `details` as short "name: value" phrases for display under the message,
 * leaving out nested structures that would only be noise to a person.
 * @param details the error's details object
 */
export function detailPhrases(details: Record<string, unknown>): string[] {
  const out: string[] = [];
  for (const [key, value] of Object.entries(details)) {
    if (value === null || value === undefined) continue;
    if (typeof value === 'string' || typeof value === 'number' || typeof value === 'boolean') {
      out.push(`${key}: ${String(value)}`);
    } else if (Array.isArray(value) && value.every((v) => typeof v === 'string' || typeof v === 'number')) {
      out.push(`${key}: ${value.slice(0, 12).join(', ')}${value.length > 12 ? ', …' : ''}`);
    }
  }
  return out;
}
