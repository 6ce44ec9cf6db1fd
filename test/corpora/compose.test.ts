import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../server/common/random.js';
import { addTypos } from '../../corpora/compose.js';
import { ALL_THEMES, ASIDES, ENGLISH_COURTESIES, FOREIGN_BANKS, PHONE_NOTE_HEADS, PHONE_NOTE_TAILS } from '../../corpora/themes/index.js';
import { fillSlots, inventPersona } from '../../corpora/vocabulary.js';

/**
 * Optimal string alignment distance: insertions, deletions, substitutions and swaps of adjacent
 * letters each cost 1 (Damerau 1964, "A technique for computer detection and correction of
 * spelling errors", the four error kinds; restricted form).
 */
function osaDistance(a: string, b: string): number {
  const d = Array.from({ length: a.length + 1 }, (_, i) => Array.from({ length: b.length + 1 }, (_, j) => (i === 0 ? j : j === 0 ? i : 0)));
  for (let i = 1; i <= a.length; i++) {
    for (let j = 1; j <= b.length; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      d[i][j] = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
    }
  }
  return d[a.length][b.length];
}

describe('addTypos', () => {
  const text = 'Please check order MK-12345 for jo.pryce@example.net, tracking SB123456789GB, before Saturday.';

  it('leaves the text alone at rate 0', () => {
    expect(addTypos(seededRandom(1), text, 0)).toBe(text);
  });

  it('makes one single-letter error in every long plain word at rate 1, and touches nothing else', () => {
    const out = addTypos(seededRandom(7), text, 1);
    const before = text.split(' ');
    const after = out.split(' ');
    expect(after).toHaveLength(before.length);
    let changed = 0;
    before.forEach((w, i) => {
      if (/^[A-Za-z]{4,}[,.!?]?$/.test(w)) {
        // Swapping two equal neighbours ("letter") changes nothing, so 0 is allowed.
        expect(osaDistance(w, after[i])).toBeLessThanOrEqual(1);
        if (w !== after[i]) changed++;
      } else {
        expect(after[i]).toBe(w);
      }
    });
    expect(changed).toBeGreaterThanOrEqual(4);
  });

  it('gives the same typos for the same seed', () => {
    expect(addTypos(seededRandom(3), text, 0.5)).toBe(addTypos(seededRandom(3), text, 0.5));
  });
});

describe('fillSlots', () => {
  it('draws each slot once per message so repeated mentions agree', () => {
    const random = seededRandom(11);
    const out = fillSlots('{order} and again {order}', random, inventPersona(random), new Map());
    const [first, , , second] = out.split(' ');
    expect(first).toBe(second);
    expect(first).toMatch(/^(MK-?|#)\d{5}$/);
  });

  it('throws on a slot it does not know, so a typo in a phrase bank cannot reach the file', () => {
    const random = seededRandom(1);
    expect(() => fillSlots('{oder}', random, inventPersona(random), new Map())).toThrow(/unknown slot \{oder\}/);
  });

  it('knows every slot used in every phrase bank', () => {
    const phrases = [
      ...ALL_THEMES.flatMap((t) => [...t.subjects, ...t.leads, ...t.details, ...t.asks, ...t.oneLiners]),
      ...FOREIGN_BANKS.flatMap((b) => [...b.leads, ...b.details, ...b.asks]),
      ...ENGLISH_COURTESIES.openers, ...ASIDES, ...PHONE_NOTE_HEADS, ...PHONE_NOTE_TAILS,
    ];
    const random = seededRandom(5);
    for (const p of phrases) {
      const out = fillSlots(p, random, inventPersona(random), new Map());
      expect(out, p).not.toMatch(/[{}]/);
    }
    expect(phrases.length).toBeGreaterThan(400);
  });

  it('labels every foreign bank with one of the English themes', () => {
    const labels = new Set(ALL_THEMES.map((t) => t.label));
    for (const b of FOREIGN_BANKS) expect(labels.has(b.label), b.label).toBe(true);
  });
});
