/**
 * Generated corpus for the clustering bench: documents of about 60 words drawn from planted
 * themes. Every word is an invented pseudo-word; nothing here is real text. Seeded, in memory.
 */
import { seededRandom, type Random } from '../../server/common/random.js';

const SYLLABLES = ['ka', 'lo', 'mi', 'ten', 'sor', 'vu', 'dra', 'pel', 'quin', 'ro', 'sha', 'tiv', 'um', 'bel', 'cor', 'fen', 'gar', 'hul', 'jen', 'nox'];

function pseudoWord(random: Random): string {
  const parts = 2 + Math.floor(random() * 3);
  let w = '';
  for (let i = 0; i < parts; i++) w += SYLLABLES[Math.floor(random() * SYLLABLES.length)];
  return w;
}

/** A generated corpus: texts, the planted theme of each, and the number of themes. */
export interface PlantedCorpus {
  texts: string[];
  themes: Int32Array;
  themeCount: number;
}

/**
 * Makes `n` documents over `themeCount` themes. Each theme owns 120 words; 3,000 background
 * words are shared by all (Zipf-like frequencies). A document draws ~60 words, 30 % from its
 * theme's words and the rest from the background, so themes overlap the way real topics do.
 */
export function plantedCorpus(n: number, themeCount: number, seed = 7): PlantedCorpus {
  const random = seededRandom(seed);
  const seen = new Set<string>();
  const fresh = (): string => {
    for (;;) {
      const w = pseudoWord(random);
      if (!seen.has(w)) { seen.add(w); return w; }
    }
  };
  const background = Array.from({ length: 3000 }, fresh);
  const themeWords = Array.from({ length: themeCount }, () => Array.from({ length: 120 }, fresh));
  const zipf = (size: number): number => Math.min(size - 1, Math.floor(Math.pow(random(), 2.2) * size));
  const texts: string[] = [];
  const themes = new Int32Array(n);
  for (let i = 0; i < n; i++) {
    const t = Math.floor(random() * themeCount);
    themes[i] = t;
    const len = 45 + Math.floor(random() * 31);
    const words: string[] = [];
    for (let w = 0; w < len; w++) words.push(random() < 0.3 ? themeWords[t][zipf(120)] : background[zipf(3000)]);
    texts.push(words.join(' '));
  }
  return { texts, themes, themeCount };
}
