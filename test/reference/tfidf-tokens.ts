/**
 * Writes test/fixtures/tfidf-tokens.json: a small corpus written for this test and our tokeniser's
 * terms for each text (plain, and with bigrams). test/reference/tfidf.py feeds those terms to
 * scikit-learn's TfidfVectorizer as a pre-tokenised analyzer; test/text/tfidf-reference.test.ts
 * checks that analyzeText still gives exactly these terms and that our weights equal sklearn's.
 *
 * Run from the repository root (Node 20 cannot run TypeScript directly, so bundle it first):
 *   node_modules/.bin/rolldown test/reference/tfidf-tokens.ts -p node -f esm -o /tmp/tfidf-tokens.mjs && node /tmp/tfidf-tokens.mjs
 *   /usr/bin/python3 test/reference/tfidf.py
 */
import { writeFileSync } from 'node:fs';
import { analyzeText } from '../../server/text/index.js';

/** Sentences written for this fixture: varied length, repeats (for sublinear tf), shared and rare words. */
export const CORPUS: readonly string[] = [
  'The parcel arrived late and the box was crushed; late deliveries keep happening.',
  'My parcel never arrived. Tracking says delivered, but nothing is at the door.',
  'Refund requested twice for order 4471 and still no refund after 14 days.',
  'How do I reset my password? The reset link in the e-mail expired.',
  'Password reset works now, thanks. The link from support@example.com was fine.',
  'The app crashes when I open the camera; crashes started after the update.',
  'After updating, the app is slow and the battery drains quickly.',
  'Delivery was quick and the courier was friendly. Great service!',
  'I was charged twice; please refund the duplicate charge of 19.99.',
  'Where can I download my invoices? The billing page shows an error.',
  'The billing page error persists: invoices will not download on https://shop.example.com/billing.',
  'Courier left the parcel with a neighbour, which is fine, but tell me next time.',
  'and the of to it was',
  'Camera permission dialog appears every time I open the app after the update.',
  'Résumé of the café order: 東京 delivery late, café closed.',
];

const tokens = CORPUS.map((t) => analyzeText(t).terms);
const tokensWithBigrams = CORPUS.map((t) => analyzeText(t, { bigrams: true }).terms);
writeFileSync('test/fixtures/tfidf-tokens.json', JSON.stringify({ note: 'Written by test/reference/tfidf-tokens.ts; corpus written for this test.', corpus: CORPUS, tokens, tokensWithBigrams }, null, 1) + '\n');
console.log(`wrote test/fixtures/tfidf-tokens.json (${CORPUS.length} texts)`);
