import { createHash } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { DEMO_CORPUS, DEMO_HEADER, DEMO_SEED, generateDemoCorpus, toCsv } from '../../corpora/generate-demo.js';
import { readRfc4180 } from './rfc4180.js';

const sha256 = (x: string | Buffer): string => createHash('sha256').update(x).digest('hex');
const committed = readFileSync(DEMO_CORPUS.file);
const [header, ...rows] = readRfc4180(committed.toString('utf8'));
const col = (name: (typeof DEMO_HEADER)[number]): number => header.indexOf(name);
const TEXT = col('text');
const THEME = col('intended_theme');

/**
 * Written by test/reference/demo-corpus.py from the committed file: Python's csv module read of it
 * and scikit-learn 1.2 (Debian python3-sklearn) figures on it.
 */
const reference = JSON.parse(readFileSync('test/fixtures/demo-corpus.json', 'utf8')) as {
  fileSha256: string;
  header: string[];
  rowCount: number;
  rowDigests: string[];
  themeCounts: Record<string, number>;
  naiveBayesCvAccuracy: number;
  kmeansAdjustedRand: number;
};

function countBy(values: readonly string[]): Map<string, number> {
  const m = new Map<string, number>();
  for (const v of values) m.set(v, (m.get(v) ?? 0) + 1);
  return m;
}

function shingles(text: string): Set<string> {
  const words = text.toLowerCase().split(/\s+/).filter(Boolean);
  const out = new Set<string>();
  for (let i = 0; i + 3 <= words.length; i++) out.add(words.slice(i, i + 3).join(' '));
  return out;
}

describe('the demo corpus generator', () => {
  it('rebuilds corpora/demo.csv byte for byte from its seed', () => {
    const csv = toCsv(generateDemoCorpus(DEMO_SEED));
    expect(sha256(csv)).toBe(sha256(committed));
  });

  it('gives the same table twice for one seed and a different one for another seed', () => {
    const a = toCsv(generateDemoCorpus(7));
    expect(toCsv(generateDemoCorpus(7))).toBe(a);
    expect(toCsv(generateDemoCorpus(8))).not.toBe(a);
  });

  it('refuses a seed that is not an integer', () => {
    expect(() => generateDemoCorpus(1.5)).toThrow(TypeError);
  });
});

describe('corpora/demo.csv', () => {
  it('is RFC 4180 CSV with the documented header and rows as wide as it', () => {
    expect(header).toEqual([...DEMO_HEADER]);
    for (const r of rows) expect(r).toHaveLength(header.length);
    expect(committed.byteLength).toBeLessThan(1024 * 1024);
  });

  it("is read field for field the same by Python's csv module (test/reference/demo-corpus.py)", () => {
    // Outside reader: CPython's csv module, strict mode, via the committed fixture.
    expect(reference.fileSha256).toBe(sha256(committed));
    expect(reference.header).toEqual(header);
    expect(reference.rowCount).toBe(rows.length);
    const ours = rows.map((r) => sha256(Buffer.from(r.join('\x1f'), 'utf8')).slice(0, 16));
    expect(ours).toEqual(reference.rowDigests);
  });

  it('has about 2,000 messages over 8–12 unbalanced themes of at least 40 each', () => {
    expect(rows.length).toBeGreaterThanOrEqual(1900);
    expect(rows.length).toBeLessThanOrEqual(2100);
    const sizes = countBy(rows.map((r) => r[THEME]));
    expect(sizes.size).toBeGreaterThanOrEqual(8);
    expect(sizes.size).toBeLessThanOrEqual(12);
    for (const [theme, n] of sizes) expect(n, theme).toBeGreaterThanOrEqual(40);
    const counts = [...sizes.values()];
    expect(Math.max(...counts)).toBeGreaterThanOrEqual(4 * Math.min(...counts));
    expect(Object.fromEntries(sizes)).toEqual(reference.themeCounts);
  });

  it('has no empty text and unique ids, in order of arrival with ISO 8601 UTC times', () => {
    for (const r of rows) expect(r[TEXT].trim(), r[0]).not.toBe('');
    expect(new Set(rows.map((r) => r[col('id')])).size).toBe(rows.length);
    const times = rows.map((r) => r[col('received')]);
    for (const t of times) expect(t).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\dZ$/);
    for (let i = 1; i < times.length; i++) expect(times[i] >= times[i - 1]).toBe(true);
  });

  it('mixes one-liners with messages of several paragraphs', () => {
    const lengths = rows.map((r) => r[TEXT].length).sort((a, b) => a - b);
    expect(lengths[0]).toBeLessThan(40);
    expect(lengths[lengths.length - 1]).toBeGreaterThan(600);
    const oneLiners = rows.filter((r) => !r[TEXT].includes('\n')).length;
    const manyParagraphs = rows.filter((r) => r[TEXT].split('\n\n').length >= 4).length;
    expect(oneLiners).toBeGreaterThan(200);
    expect(manyParagraphs).toBeGreaterThan(100);
    expect(new Set(rows.map((r) => r[col('channel')]))).toEqual(new Set(['email', 'web form', 'chat', 'phone note']));
  });

  it('has non-ASCII text and messages in German, Spanish and French', () => {
    const nonAscii = rows.filter((r) => /[^\x00-\x7f]/.test(r[TEXT])).length;
    expect(nonAscii).toBeGreaterThan(50);
    const languages = countBy(rows.map((r) => r[col('language')]));
    for (const lang of ['de', 'es', 'fr']) expect(languages.get(lang) ?? 0, lang).toBeGreaterThanOrEqual(5);
    expect(languages.get('en')).toBeGreaterThan(rows.length * 0.9);
    const german = rows.filter((r) => r[col('language')] === 'de').map((r) => r[TEXT]).join(' ');
    expect(german).toMatch(/\b(Bestellung|Artikel|bitte)\b/i);
  });

  it('marks messages that touch a second theme with a different, known theme', () => {
    const themes = new Set(rows.map((r) => r[THEME]));
    const mixed = rows.filter((r) => r[col('also_about')] !== '');
    expect(mixed.length).toBeGreaterThan(rows.length * 0.03);
    for (const r of mixed) {
      expect(themes.has(r[col('also_about')])).toBe(true);
      expect(r[col('also_about')]).not.toBe(r[THEME]);
    }
  });

  it('marks re-sent and forwarded copies with an earlier message of the same theme and nearly the same words', () => {
    const position = new Map(rows.map((r, i) => [r[col('id')], i]));
    const copies = rows.filter((r) => r[col('copy_of')] !== '');
    expect(copies.length).toBeGreaterThanOrEqual(10);
    let exact = 0;
    for (const c of copies) {
      const at = position.get(c[col('copy_of')]);
      expect(at, c[0]).toBeDefined();
      expect(at!).toBeLessThan(position.get(c[0])!);
      const original = rows[at!];
      expect(c[THEME]).toBe(original[THEME]);
      if (c[TEXT] === original[TEXT]) exact++;
      // Near-duplicate: most of the original's word triples survive in the copy.
      const a = shingles(original[TEXT]);
      const b = shingles(c[TEXT]);
      const kept = [...a].filter((s) => b.has(s)).length;
      expect(kept / Math.max(1, a.size), c[0]).toBeGreaterThan(0.6);
    }
    expect(exact).toBeGreaterThan(0);
    expect(exact).toBeLessThan(copies.length);
  });

  it('has typos: long words that differ by one letter from a word used elsewhere', () => {
    // Typo-free vocabulary: every long word appears in many messages; typos are rare one-offs of a common word.
    const words = countBy(rows.flatMap((r) => r[TEXT].match(/\b[a-z]{6,}\b/g) ?? []));
    const common = [...words].filter(([, n]) => n >= 20).map(([w]) => w);
    let typos = 0;
    for (const [w, n] of words) {
      if (n > 2) continue;
      if (common.some((c) => c.length === w.length + 1 && [...c].some((_, i) => c.slice(0, i) + c.slice(i + 1) === w))) typos++;
    }
    expect(typos).toBeGreaterThan(20);
  });
});

describe('the demo is fit to show clustering and routing (scikit-learn 1.2 reference, test/reference/demo-corpus.py)', () => {
  it('can be learnt from its labels but not perfectly: naive Bayes 5-fold accuracy between 0.80 and 0.995', () => {
    // Bounds are our target for a demo (common practice): a router should look useful and still make mistakes.
    expect(reference.naiveBayesCvAccuracy).toBeGreaterThan(0.8);
    expect(reference.naiveBayesCvAccuracy).toBeLessThan(0.995);
  });

  it('has themes that k-means on TF-IDF partly recovers: adjusted Rand index (Hubert & Arabie 1985) above 0.3', () => {
    // 0 is chance level by the definition of the index; 0.3 is our floor for a demo worth looking at (common practice).
    expect(reference.kmeansAdjustedRand).toBeGreaterThan(0.3);
    expect(reference.kmeansAdjustedRand).toBeLessThan(1);
  });

  it('says it is invented, in the corpus name and in corpora/README.md with the seed', () => {
    expect(DEMO_CORPUS.name).toMatch(/invented/i);
    const readme = readFileSync('corpora/README.md', 'utf8');
    expect(readme).toMatch(/invented/i);
    expect(readme).toContain(String(DEMO_SEED));
    expect(readme).toContain('node dist/corpora/generate-demo.js');
  });
});
