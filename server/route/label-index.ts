/**
 * Label strings at the edge → label indices inside the engine, with the checks a person can act on.
 */

/** Labels as indices. */
export interface LabelIndex {
  /** Distinct labels, sorted by code unit (the order of every per-label output). */
  names: string[];
  /** Index into `names` of each document's label. */
  y: Int32Array;
  /** Documents per label, in `names` order. */
  sizes: Uint32Array;
}

/**
 * Checks texts and labels and numbers the labels.
 * @param texts training texts (strings).
 * @param labels one non-empty label per text.
 * @throws TypeError for a non-string text or label; RangeError for mismatched lengths, fewer than two
 *   labels, or a label with fewer than two documents (named in the message).
 */
export function labelIndex(texts: readonly string[], labels: readonly string[]): LabelIndex {
  if (!Array.isArray(texts) || !Array.isArray(labels)) throw new TypeError('texts and labels must be arrays');
  if (texts.length !== labels.length) throw new RangeError(`Got ${texts.length} texts but ${labels.length} labels; give one label per text`);
  const counts = new Map<string, number>();
  for (let i = 0; i < labels.length; i++) {
    if (typeof texts[i] !== 'string') throw new TypeError(`Text ${i} is ${typeof texts[i]}; every text must be a string`);
    const l = labels[i];
    if (typeof l !== 'string' || l.trim() === '') throw new TypeError(`Label of document ${i} is empty or not a string; every document needs a label`);
    counts.set(l, (counts.get(l) ?? 0) + 1);
  }
  const names = [...counts.keys()].sort((a, b) => (a < b ? -1 : a > b ? 1 : 0));
  if (names.length < 2) {
    throw new RangeError(names.length === 0
      ? 'No labelled documents: a router needs at least 2 labels with at least 2 documents each'
      : `Only one label ("${names[0]}"): a router needs at least 2 labels to choose between`);
  }
  const small = names.filter((n) => (counts.get(n) as number) < 2);
  if (small.length > 0) {
    throw new RangeError(`Label "${small[0]}" has only 1 document; every label needs at least 2 (${small.length} label(s) affected: ${small.slice(0, 5).map((s) => `"${s}"`).join(', ')})`);
  }
  const index = new Map<string, number>();
  names.forEach((n, i) => index.set(n, i));
  const y = new Int32Array(labels.length);
  const sizes = new Uint32Array(names.length);
  for (let i = 0; i < labels.length; i++) {
    y[i] = index.get(labels[i]) as number;
    sizes[y[i]]++;
  }
  return { names, y, sizes };
}
