/**
 * What the server needs to know to load the demo corpus on first start: where the file is, which
 * columns hold the id, the text and the labels, and how to name it. Kept apart from the generator
 * so that loading the demo never pulls the phrase banks in.
 */

/** The seed the committed corpora/demo.csv was written with. */
export const DEMO_SEED = 20260301;

/** Columns of corpora/demo.csv, in order. */
export const DEMO_HEADER = [
  'id', 'text', 'subject', 'channel', 'received', 'language', 'intended_theme', 'also_about', 'copy_of',
] as const;

/** How to import the demo corpus through the ordinary CSV path. */
export const DEMO_CORPUS = {
  /** Path relative to the repository root. */
  file: 'corpora/demo.csv',
  /** Corpus name shown in the UI; says plainly that the messages are invented. */
  name: 'Demo: Marrowgate Kiln & Tea shared inbox (invented)',
  textField: 'text',
  idField: 'id',
  /** Column a router can be trained from, and clustering measured against. */
  labelField: 'intended_theme',
} as const;
