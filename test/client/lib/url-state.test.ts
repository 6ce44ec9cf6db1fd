import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { EMPTY_URL_STATE, readUrlState, writeUrlState, type UrlState } from '../../../client/lib/url-state.js';

const id = fc.option(fc.string({ minLength: 1, maxLength: 20 }), { nil: null });
const state: fc.Arbitrary<UrlState> = fc.record({
  view: fc.constantFrom('corpora' as const, 'analysis' as const, 'routers' as const),
  corpus: id,
  analysis: id,
  theme: id,
  router: id,
  q: fc.string({ maxLength: 30 }),
  page: fc.nat({ max: 10_000 }),
});

describe('url-state', () => {
  it('restores every state it writes, whatever characters the ids hold', () => {
    fc.assert(
      fc.property(state, (s) => {
        const back = readUrlState(writeUrlState(s));
        // An analysis or router link without a view opens that page; only the default view is left out.
        expect({ ...back, view: s.view }).toEqual(s);
        if (s.view !== 'corpora') expect(back.view).toBe(s.view);
      }),
      { numRuns: 300 },
    );
  });

  it('writes nothing for the default state, so plain links stay plain', () => {
    expect(writeUrlState(EMPTY_URL_STATE)).toBe('');
  });

  it('falls back to defaults for unknown views and bad page numbers', () => {
    expect(readUrlState('?view=nope&page=-3')).toEqual(EMPTY_URL_STATE);
    expect(readUrlState('?page=2.5').page).toBe(0);
  });

  it('opens the analysis page for a link that only names an analysis', () => {
    expect(readUrlState('?analysis=a1&theme=c2')).toMatchObject({ view: 'analysis', analysis: 'a1', theme: 'c2' });
  });
});
