import { describe, expect, it } from 'vitest';
import { stageName } from '../../../client/lib/stage-names.js';

describe('stageName', () => {
  it('names the stages the server reports in words', () => {
    expect(stageName('sweep-k')).toBe('Trying different numbers of themes');
    expect(stageName('map')).toBe('Laying out the map (UMAP)');
    expect(stageName('cross-validate')).toBe('Cross-validating');
  });
  it('humanises stages it does not know instead of showing nothing', () => {
    expect(stageName('build_index')).toBe('Build index');
    expect(stageName('pruneTree')).toBe('Prune tree');
    expect(stageName('')).toBe('Working');
    expect(stageName(undefined)).toBe('Working');
  });
});
