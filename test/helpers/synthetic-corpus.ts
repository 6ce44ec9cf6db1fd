import { seededRandom } from '../../server/common/random.js';

/**
 * Seeded synthetic documents with planted themes, for load and job tests only (never for quality
 * claims): each theme draws most words from its own small vocabulary, the rest from a shared one.
 */
export function syntheticDocuments(n: number, themes = 8, wordsPerDoc = 60, seed = 7): { text: string; theme: string }[] {
  const random = seededRandom(seed);
  const syllables = ['ka', 'lo', 'mi', 'ren', 'tu', 'sa', 'vo', 'del', 'pri', 'no', 'ga', 'zen', 'ur', 'bal', 'fi'];
  const word = () => syllables[Math.floor(random() * 15)] + syllables[Math.floor(random() * 15)] + syllables[Math.floor(random() * 15)];
  const shared = Array.from({ length: 400 }, word);
  const own = Array.from({ length: themes }, () => Array.from({ length: 60 }, word));
  return Array.from({ length: n }, (_, i) => {
    const t = i % themes;
    const words: string[] = [];
    for (let w = 0; w < wordsPerDoc; w++) {
      words.push(random() < 0.45 ? own[t][Math.floor(random() * 60)] : shared[Math.floor(random() * 400)]);
    }
    return { text: words.join(' '), theme: `theme ${t + 1}` };
  });
}
