// Option handling: defaults documented on DEFAULT_PARSE_OPTIONS and actionable errors.
import { describe, expect, it } from 'vitest';
import { DEFAULT_PARSE_OPTIONS, resolveParseOptions } from '../../server/ingest/index.js';

describe('resolveParseOptions', () => {
  it('fills the documented defaults and keeps given values', () => {
    expect(resolveParseOptions()).toEqual(DEFAULT_PARSE_OPTIONS);
    expect(resolveParseOptions({ textField: 'body', idField: undefined, batchSize: 10 })).toMatchObject({ textField: 'body', batchSize: 10, format: 'auto' });
  });

  it('refuses bad options with TypeError or RangeError naming the option', () => {
    expect(() => resolveParseOptions({ format: 'xlsx' as never })).toThrow(RangeError);
    expect(() => resolveParseOptions({ format: 'xlsx' as never })).toThrow(/format must be one of/);
    expect(() => resolveParseOptions({ textField: '' })).toThrow(TypeError);
    expect(() => resolveParseOptions({ idField: 'text' })).toThrow(/different fields/);
    expect(() => resolveParseOptions({ maxDocumentChars: 0 })).toThrow(/maxDocumentChars/);
    expect(() => resolveParseOptions({ batchSize: 1.5 })).toThrow(/batchSize/);
    expect(() => resolveParseOptions({ maxReported: -1 })).toThrow(/maxReported/);
    expect(() => resolveParseOptions({ delimiter: '"' })).toThrow(/delimiter must be one character/);
    expect(() => resolveParseOptions({ delimiter: ',,' })).toThrow(RangeError);
  });
});
