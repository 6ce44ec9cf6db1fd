// Tokeniser behaviour. Expected values are worked out by hand from the rules documented in
// server/text (NFKC per Unicode Standard Annex #15; letters, digits and marks per the Unicode
// general categories L, N, M; Porter 1980 for stems); stop words are our own list (common practice).
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { analyzeText, EMAIL_TERM, ENGLISH_STOP_WORDS, NUMBER_TERM, URL_TERM } from '../../server/text/index.js';

const plain = { stem: false, stopWords: false };
const terms = (text: string, opts = {}): string[] => analyzeText(text, opts).terms;

describe('analyzeText: Unicode', () => {
  it('keeps accented Latin letters inside words and lower-cases them', () => {
    expect(terms('Crème Brûlée à la CAFÉ', plain)).toEqual(['crème', 'brûlée', 'la', 'café']);
  });

  it('composes a letter and its combining accent into one character (NFKC, UAX #15)', () => {
    expect(terms('e\u0301cole', plain)).toEqual(['\u00e9cole']);
  });

  it('folds the ﬁ ligature and full-width letters and digits to plain ones (NFKC, UAX #15)', () => {
    expect(terms('ﬁle ＡＢＣ ｄｅｆ', plain)).toEqual(['file', 'abc', 'def']);
    expect(terms('ｏｒｄｅｒ １２３', plain)).toEqual(['order', NUMBER_TERM]);
  });

  it('tokenises Cyrillic, Greek and Arabic words whole, without stemming them', () => {
    expect(terms('Москва — столица России.')).toEqual(['москва', 'столица', 'россии']);
    expect(terms('Η ΑΘΗΝΑ είναι πόλη')).toEqual(['αθηνα', 'είναι', 'πόλη']);
    expect(terms('مرحبا بالعالم')).toEqual(['مرحبا', 'بالعالم']);
  });

  it('keeps combining marks that do not compose (Devanagari vowel signs, Arabic vowel marks) inside the word', () => {
    expect(terms('हिन्दी भाषा')).toEqual(['हिन्दी', 'भाषा']);
    expect(terms('كَتَبَ')).toEqual(['كَتَبَ']);
  });

  it('drops an Arabic tatweel and a soft hyphen from inside a word', () => {
    expect(terms('عـربي')).toEqual(['عربي']);
    expect(terms('infor\u00admation', plain)).toEqual(['information']);
  });

  it('splits Han, Hiragana and Katakana runs into overlapping character bigrams', () => {
    expect(terms('東京都')).toEqual(['東京', '京都']);
    expect(terms('日本語のテキスト')).toEqual(['日本', '本語', '語の', 'のテ', 'テキ', 'キス', 'スト']);
  });

  it('keeps a lone CJK character even though it is shorter than minTokenLength', () => {
    expect(terms('猫 cat', plain)).toEqual(['猫', 'cat']);
  });

  it('splits Thai, Lao, Khmer and Myanmar runs into dictionary words (ICU, via Intl.Segmenter)', () => {
    // Expected words: ภาษา "language", ไทย "Thai", ง่าย "easy", นิด เดียว "a little" (from memory).
    expect(terms('ภาษาไทยง่ายนิดเดียว')).toEqual(['ภาษา', 'ไทย', 'ง่าย', 'นิด', 'เดียว']);
    expect(terms('ภาษาไทย and English')).toEqual(['ภาษา', 'ไทย', 'english']);
    expect(terms('ສະບາຍດີ ភាសាខ្មែរ')).toEqual(['ສະບາຍດີ', 'ភាសាខ្មែរ']);
  });

  it('separates CJK from Latin letters written against it', () => {
    expect(terms('東京tower', plain)).toEqual(['東京', 'tower']);
  });

  it('drops emoji, skin-tone modifiers, variation selectors and joiners between emoji', () => {
    expect(terms('great 👍🏽 service ❤️ 👨‍👩‍👧', plain)).toEqual(['great', 'service']);
  });
});

describe('analyzeText: words, numbers and addresses', () => {
  it('cuts English clitics and removes the apostrophe of "n\'t" (straight or curly)', () => {
    expect(terms("customer's order", plain)).toEqual(['customer', 'order']);
    expect(terms('we’ll check; don’t worry', plain)).toEqual(['we', 'check', 'dont', 'worry']);
    expect(terms("o'brien rock'n'roll", plain)).toEqual(['obrien', 'rocknroll']);
  });

  it('treats apostrophes that do not join two letters as separators', () => {
    expect(terms("'quoted' customers' 90's", plain)).toEqual(['quoted', 'customers', NUMBER_TERM]);
  });

  it('splits on hyphens and other punctuation', () => {
    expect(terms('follow-up, wi-fi/ethernet', plain)).toEqual(['follow', 'up', 'wi', 'fi', 'ethernet']);
  });

  it('replaces numbers, with their decimal, thousands or time separators, by one placeholder each', () => {
    expect(terms('3.14 1,000 12:30 42', plain)).toEqual([NUMBER_TERM, NUMBER_TERM, NUMBER_TERM, NUMBER_TERM]);
    expect(terms('version 2.0.1.', plain)).toEqual(['version', NUMBER_TERM]);
  });

  it('keeps words that mix letters and digits', () => {
    expect(terms('covid19 mp3 4g', plain)).toEqual(['covid19', 'mp3', '4g']);
  });

  it('replaces web addresses by one placeholder, without the trailing punctuation', () => {
    const r = analyzeText('see https://shop.example.com/a?b=1&c=2, or www.example.org.', plain);
    expect(r.terms).toEqual(['see', URL_TERM, 'or', URL_TERM]);
    expect(r.surfaces).toEqual(['see', 'https://shop.example.com/a?b=1&c=2', 'or', 'www.example.org']);
  });

  it('replaces e-mail addresses by one placeholder, keeping the address as the surface', () => {
    const r = analyzeText('mail Jane.Doe+tickets@Mail.Example.co.uk today', plain);
    expect(r.terms).toEqual(['mail', EMAIL_TERM, 'today']);
    expect(r.surfaces[1]).toBe('jane.doe+tickets@mail.example.co.uk');
  });

  it('keeps text order when an e-mail address comes before a web address', () => {
    const r = analyzeText('write to help@example.com or visit https://example.com/help today', plain);
    expect(r.terms).toEqual(['write', 'to', EMAIL_TERM, 'or', 'visit', URL_TERM, 'today']);
  });

  it('reads an address with a user name inside a web address as one web address', () => {
    expect(terms('ftp://user@files.example.com/x', plain)).toEqual([URL_TERM]);
  });

  it('can never turn user text into a placeholder, since words hold no underscore', () => {
    expect(terms('__url__ __number__', plain)).toEqual(['url', 'number']);
  });
});

describe('analyzeText: stop words, stems, length, bigrams', () => {
  it('drops stop words and keeps the rest in text order, stemmed (Porter 1980)', () => {
    const r = analyzeText('The deliveries were delayed because of the storms');
    expect(r.terms).toEqual(['deliveri', 'delai', 'storm']);
    expect(r.surfaces).toEqual(['deliveries', 'delayed', 'storms']);
  });

  it('drops contractions that are stop words however they are spelt', () => {
    expect(terms("I don't think it's working, isn’t it?")).toEqual(['think', 'work']);
  });

  it('has a stop list of a reasonable size, all lower case without apostrophes', () => {
    expect(ENGLISH_STOP_WORDS.size).toBeGreaterThanOrEqual(150);
    expect(ENGLISH_STOP_WORDS.size).toBeLessThanOrEqual(300);
    for (const w of ENGLISH_STOP_WORDS) expect(w).toMatch(/^[a-z]+$/);
  });

  it('keeps stop words and spellings when asked', () => {
    expect(terms('The boxes', { stopWords: false, stem: false })).toEqual(['the', 'boxes']);
    expect(terms('The boxes', { stopWords: false })).toEqual(['the', 'box']);
  });

  it('drops tokens shorter than minTokenLength, placeholders excepted', () => {
    expect(terms('x y zz 7', plain)).toEqual(['zz', NUMBER_TERM]);
    expect(terms('ab abc abcd 7', { ...plain, minTokenLength: 4 })).toEqual(['abcd', NUMBER_TERM]);
  });

  it('adds the bigram of each pair of adjacent kept terms after the unigrams', () => {
    const r = analyzeText('Late delivery, again a late delivery', { bigrams: true });
    expect(r.terms).toEqual(['late', 'deliveri', 'late', 'deliveri', 'late_deliveri', 'deliveri_late', 'late_deliveri']);
    expect(r.surfaces.slice(4)).toEqual(['late delivery', 'delivery late', 'late delivery']);
  });

  it('gives nothing for empty, blank or all-stop-word text', () => {
    expect(terms('')).toEqual([]);
    expect(terms('  \n\t ')).toEqual([]);
    expect(terms('and the of it was')).toEqual([]);
  });

  it('rejects a non-string text and a misspelt or invalid option with a message naming it', () => {
    expect(() => analyzeText(42 as unknown as string)).toThrow(/must be a string/);
    expect(() => analyzeText('x', { stemming: true } as never)).toThrow(/Unknown text option "stemming"/);
    expect(() => analyzeText('x', { minTokenLength: 0 })).toThrow(RangeError);
    expect(() => analyzeText('x', { bigrams: 'yes' } as never)).toThrow(/bigrams must be true or false/);
  });
});

describe('analyzeText: junk', () => {
  it('skips a "word" longer than 64 characters (a hash or encoded blob) but keeps its neighbours', () => {
    expect(terms(`token ${'a1b2'.repeat(40)} expired`, plain)).toEqual(['token', 'expired']);
    expect(terms(`${'x'.repeat(64)}`, plain)).toEqual(['x'.repeat(64)]);
  });

  it('survives a very long text without spaces in any script', () => {
    expect(terms('漢'.repeat(100_000)).length).toBe(99_999);
    expect(terms('é'.repeat(200_000))).toEqual([]);
  });
});

describe('analyzeText: pasted blobs', () => {
  it('reads a long base64-like blob followed by an e-mail address in one pass (the blob is dropped)', () => {
    const blob = 'QUJD+ZGVm/'.repeat(30_000);
    expect(terms(`attached ${blob} from ops@example.com`, plain)).toEqual(expect.arrayContaining(['attached', EMAIL_TERM]));
    expect(terms(`${'a'.repeat(300_000)} x@example.com`, plain)).toEqual([EMAIL_TERM]);
  });
});

describe('analyzeText: any input', () => {
  it('never throws, and every term is non-empty, space-free, and comes from a span of the normalised text (property)', () => {
    const piece = fc.oneof(
      fc.string({ unit: 'binary', maxLength: 8 }),
      fc.constantFrom('a@b.co', 'https://x.example/p', 'www.y.example', '3.5', "don't", '東京', 'é', '\u0301', ' ', '.', '@', '://', '👍'),
    );
    fc.assert(fc.property(fc.array(piece, { maxLength: 12 }), fc.boolean(), (parts, bigrams) => {
      const text = parts.join('');
      const lower = text.normalize('NFKC').toLowerCase();
      const r = analyzeText(text, { bigrams });
      expect(r.surfaces.length).toBe(r.terms.length);
      for (const t of r.terms) expect(t).toMatch(/^\S+$/u);
      for (let k = 0; k < r.terms.length; k++) if (!r.terms[k].includes('_')) expect(lower.includes(r.surfaces[k])).toBe(true);
    }), { numRuns: 500, seed: 11 });
  });
});
