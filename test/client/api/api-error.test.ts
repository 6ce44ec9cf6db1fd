import { describe, expect, it } from 'vitest';
import { ApiError, detailPhrases, plainWords } from '../../../client/api/api-error.js';

describe('plain words for errors', () => {
  it('shows the server’s own sentence when there is one', () => {
    expect(plainWords(new ApiError(413, 'payload_too_large', 'The file is over the 200 MB limit.'))).toBe('The file is over the 200 MB limit.');
  });

  it('falls back to a sentence per contract code, never a bare status', () => {
    expect(plainWords(new ApiError(0, 'network', ''))).toMatch(/could not be reached/);
    expect(plainWords(new ApiError(404, 'not_found', ''))).toMatch(/no longer exists/);
    expect(plainWords(new ApiError(418, 'teapot', ''))).toBe('The server answered 418.');
  });

  it('says "Stopped." for an aborted request and uses the message of other errors', () => {
    expect(plainWords(new DOMException('x', 'AbortError'))).toBe('Stopped.');
    expect(plainWords(new RangeError('k must be at least 2'))).toBe('k must be at least 2');
    expect(plainWords(42)).toBe('Something went wrong.');
  });

  it('lists simple details and leaves out nested structures', () => {
    expect(detailPhrases({ field: 'text', limitMB: 200, lines: [3, 9], nested: { a: 1 }, none: null })).toEqual(['field: text', 'limitMB: 200', 'lines: 3, 9']);
  });
});
