import type { Store } from '../../store/api.js';

/** Where a router's training examples come from (the `POST /routers` body). */
export type TrainingSource = { analysisId: string } | { corpusId: string; labelField: string };

/** Texts and their labels, ready for training. */
export interface TrainingSet {
  texts: string[];
  labels: string[];
  /** How many documents were left out (unnamed or no-content themes, missing labels). */
  leftOut: number;
}

/** Thrown when the source does not exist (404 at the API). */
export class SourceNotFoundError extends Error {
  constructor(
    readonly kind: 'analysis' | 'corpus',
    readonly id: string,
  ) {
    super(`No ${kind} with id "${id}".`);
    this.name = 'SourceNotFoundError';
  }
}

function checkLabels(labels: string[], what: string): void {
  const counts = new Map<string, number>();
  for (const l of labels) counts.set(l, (counts.get(l) ?? 0) + 1);
  if (counts.size < 2) {
    throw new RangeError(`A router needs at least 2 labels to choose between; ${what} gives ${counts.size === 0 ? 'none' : `only "${[...counts.keys()][0]}"`}.`);
  }
  for (const [label, n] of counts) {
    if (n < 2) throw new RangeError(`The label "${label}" has only ${n} document; every label needs at least 2 (more is better) to be learnt and measured.`);
  }
}

/**
 * Collects the training examples of a source: the documents of the named themes of an analysis
 * (unnamed and no-content themes left out), or the documents of a corpus with a non-empty value in
 * its label field.
 * @throws SourceNotFoundError when the analysis or corpus is gone; RangeError when the examples cannot make a router.
 */
export async function collectTrainingSet(store: Store, source: TrainingSource): Promise<TrainingSet> {
  if ('analysisId' in source) {
    const analysis = await store.getAnalysis(source.analysisId);
    if (!analysis) throw new SourceNotFoundError('analysis', source.analysisId);
    if (!analysis.summary) throw new RangeError('The analysis has not finished; train from it once it is done.');
    const named = analysis.clusters.map((c) => (!c.noContent && c.name && c.name.trim() ? c.name.trim() : null));
    if (named.every((n) => n === null)) {
      throw new RangeError('None of the themes of this analysis has a name. Name the themes you want to route to; unnamed ones are left out.');
    }
    const { labels } = await store.loadArrays(analysis.id, ['labels']);
    const docs = await store.loadDocuments(analysis.corpusId);
    const texts: string[] = [];
    const out: string[] = [];
    for (let i = 0; i < docs.length; i++) {
      const name = named[labels[i]];
      if (name !== null && name !== undefined) {
        texts.push(docs[i].text);
        out.push(name);
      }
    }
    checkLabels(out, 'the named themes of this analysis');
    return { texts, labels: out, leftOut: docs.length - texts.length };
  }
  const corpus = await store.getCorpus(source.corpusId);
  if (!corpus) throw new SourceNotFoundError('corpus', source.corpusId);
  if (!corpus.fields.includes(source.labelField)) {
    throw new RangeError(`The corpus has no field "${source.labelField}". Its fields are: ${corpus.fields.join(', ') || '(none)'}.`);
  }
  const docs = await store.loadDocuments(corpus.id);
  const texts: string[] = [];
  const labels: string[] = [];
  for (const d of docs) {
    const v = d.meta[source.labelField];
    const label = v === null || v === undefined ? '' : typeof v === 'string' ? v.trim() : JSON.stringify(v);
    if (label) {
      texts.push(d.text);
      labels.push(label);
    }
  }
  checkLabels(labels, `the field "${source.labelField}"`);
  return { texts, labels, leftOut: docs.length - texts.length };
}
