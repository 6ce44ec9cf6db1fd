// The worked examples of M. F. Porter (1980), "An algorithm for suffix stripping", Program 14(3),
// 130–137: each step's examples as printed in the paper, checked against the step functions of
// the `natural` implementation we use, then whole-word stems through our cached porterStem.
import { createRequire } from 'node:module';
import { describe, expect, it } from 'vitest';
import { porterStem } from '../../server/text/index.js';

type Step = (w: string) => string;
const natural = createRequire(import.meta.url)('natural/lib/natural/stemmers/porter_stemmer.js') as Record<string, Step>;

/** Source: Porter (1980), the examples printed beside each step's rules. */
const PAPER_STEPS: Record<string, Record<string, string>> = {
  step1a: { caresses: 'caress', ponies: 'poni', ties: 'ti', caress: 'caress', cats: 'cat' },
  step1b: {
    feed: 'feed', agreed: 'agree', plastered: 'plaster', bled: 'bled', motoring: 'motor', sing: 'sing',
    conflated: 'conflate', troubled: 'trouble', sized: 'size', hopping: 'hop', tanned: 'tan', falling: 'fall',
    hissing: 'hiss', fizzed: 'fizz', failing: 'fail', filing: 'file',
  },
  step1c: { happy: 'happi', sky: 'sky' },
  step2: {
    relational: 'relate', conditional: 'condition', rational: 'rational', valenci: 'valence', hesitanci: 'hesitance',
    digitizer: 'digitize', conformabli: 'conformable', radicalli: 'radical', differentli: 'different', vileli: 'vile',
    analogousli: 'analogous', vietnamization: 'vietnamize', predication: 'predicate', operator: 'operate',
    feudalism: 'feudal', decisiveness: 'decisive', hopefulness: 'hopeful', callousness: 'callous', formaliti: 'formal',
    sensitiviti: 'sensitive', sensibiliti: 'sensible',
  },
  step3: { triplicate: 'triplic', formative: 'form', formalize: 'formal', electriciti: 'electric', electrical: 'electric', hopeful: 'hope', goodness: 'good' },
  step4: {
    revival: 'reviv', allowance: 'allow', inference: 'infer', airliner: 'airlin', gyroscopic: 'gyroscop', adjustable: 'adjust',
    defensible: 'defens', irritant: 'irrit', replacement: 'replac', adjustment: 'adjust', dependent: 'depend', adoption: 'adopt',
    homologou: 'homolog', communism: 'commun', activate: 'activ', angulariti: 'angular', homologous: 'homolog',
    effective: 'effect', bowdlerize: 'bowdler',
  },
  step5a: { probate: 'probat', rate: 'rate', cease: 'ceas' },
  step5b: { controll: 'control', roll: 'roll' },
};

describe('Porter (1980) step by step, as implemented by natural', () => {
  for (const [step, examples] of Object.entries(PAPER_STEPS)) {
    it(`${step} turns each of the paper's examples into the paper's result (source: Porter 1980)`, () => {
      const got = Object.fromEntries(Object.keys(examples).map((w) => [w, natural[step](w)]));
      expect(got).toEqual(examples);
    });
  }
});

describe('porterStem on whole words', () => {
  it('gives the final stems of the paper\'s step-1 examples (source: Porter 1980, steps 1–5 applied in turn)', () => {
    const words = {
      caresses: 'caress', ponies: 'poni', ties: 'ti', caress: 'caress', cats: 'cat', feed: 'feed', agreed: 'agre',
      plastered: 'plaster', bled: 'bled', motoring: 'motor', sing: 'sing', conflated: 'conflat', troubled: 'troubl',
      sized: 'size', hopping: 'hop', tanned: 'tan', falling: 'fall', hissing: 'hiss', fizzed: 'fizz', failing: 'fail',
      filing: 'file', happy: 'happi', sky: 'sky', relational: 'relat', conditional: 'condit', valenci: 'valenc',
    };
    expect(Object.fromEntries(Object.keys(words).map((w) => [w, porterStem(w)]))).toEqual(words);
  });

  it('stems "rational" to "ration": the paper\'s "rational → rational" is its step-2 example, and step 4 then removes -al (m > 1)', () => {
    // Not a difference between natural and the paper: step 2 leaves the word (m of "r" is 0), step 4's
    // (m>1) AL rule applies to "ration" + "al". Source: Porter (1980), steps 2 and 4.
    expect(natural.step2('rational')).toBe('rational');
    expect(natural.step4('rational')).toBe('ration');
    expect(porterStem('rational')).toBe('ration');
  });

  it('leaves words of one or two letters unchanged, as natural does (the paper\'s step 1a alone would make "as" → "a")', () => {
    // Where natural differs from the paper: it returns words shorter than three letters as they are
    // (Porter's own reference code has the same departure, from memory). Stop words cover most of them.
    expect(porterStem('as')).toBe('as');
    expect(porterStem('is')).toBe('is');
  });

  it('leaves words outside a–z alone, since the rules are for English spelling', () => {
    expect(porterStem('cafés')).toBe('cafés');
    expect(porterStem('россии')).toBe('россии');
    expect(porterStem('mp3s')).toBe('mp3s');
  });

  it('answers the same from its cache as on first sight', () => {
    const first = ['generalizations', 'oscillators', 'deliveries'].map(porterStem);
    expect(['generalizations', 'oscillators', 'deliveries'].map(porterStem)).toEqual(first);
    // generalizations → gener and oscillators → oscil are the usual over-stemming examples of
    // Porter's algorithm (from memory); deliveries → deliveri is step 1a's IES → I (Porter 1980).
    expect(first).toEqual(['gener', 'oscil', 'deliveri']);
  });
});
