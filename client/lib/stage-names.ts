/**
 * Readable names for the machine stage names that jobs report (`{"stage":"sweep-k"}`), shown
 * under the progress bar. Unknown stages are still shown, humanised, so a new server stage
 * never shows as blank.
 */
const NAMES: Record<string, string> = {
  queued: 'Waiting for a free worker',
  start: 'Starting',
  load: 'Reading documents',
  loading: 'Reading documents',
  tokenize: 'Splitting text into words',
  tokenise: 'Splitting text into words',
  analyze: 'Splitting text into words',
  stem: 'Reducing words to stems',
  vocabulary: 'Building the vocabulary',
  tfidf: 'Weighing words (TF-IDF)',
  vectorize: 'Weighing words (TF-IDF)',
  vectorise: 'Weighing words (TF-IDF)',
  weigh: 'Weighing words (TF-IDF)',
  cluster: 'Grouping documents into themes',
  describe: 'Picking distinctive words and examples',
  map: 'Laying out the map (UMAP)',
  graph: 'Connecting neighbouring documents',
  merge: 'Joining nearest groups',
  'micro-clusters': 'Forming small groups first',
  fit: 'Training the final router',
  reduce: 'Compressing word vectors',
  svd: 'Compressing word vectors',
  kmeans: 'Grouping documents (k-means)',
  'sweep-k': 'Trying different numbers of themes',
  sweep: 'Trying different numbers of themes',
  agglomerative: 'Grouping documents (agglomerative)',
  linkage: 'Joining nearest groups',
  distances: 'Measuring distances',
  silhouette: 'Scoring how well themes separate (silhouette)',
  knn: 'Finding each document’s neighbours',
  umap: 'Laying out the map (UMAP)',
  layout: 'Laying out the map (UMAP)',
  sketch: 'Laying out a sample of the map first',
  terms: 'Picking distinctive words',
  representatives: 'Picking representative documents',
  save: 'Saving results',
  store: 'Saving results',
  counts: 'Counting words per label',
  train: 'Training the router',
  cv: 'Cross-validating',
  'cross-validate': 'Cross-validating',
  fold: 'Cross-validating',
  evaluate: 'Measuring accuracy',
  roc: 'Computing ROC curves',
  threshold: 'Choosing the abstain threshold',
  done: 'Finished',
};

/**
 * A person-readable name for a job stage.
 * @param stage machine stage name from the server
 */
export function stageName(stage: string | null | undefined): string {
  if (!stage) return 'Working';
  const known = NAMES[stage.toLowerCase()];
  if (known) return known;
  const words = stage.replace(/[-_.]+/g, ' ').replace(/([a-z])([A-Z])/g, '$1 $2').trim().toLowerCase();
  return words ? words[0].toUpperCase() + words.slice(1) : 'Working';
}
