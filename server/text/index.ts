export * from './api.js';
export * from './analyze-text.js';
export * from './fit-tfidf.js';
export * from './tfidf-vectorizer.js';
export * from './tfidf-options.js';
export * from './token-options.js';
export { ENGLISH_STOP_WORDS } from './stop-words.js';
export { porterStem } from './porter-stem.js';
export { URL_TERM, EMAIL_TERM, NUMBER_TERM, BIGRAM_JOINER, PLACEHOLDER_LABELS } from './term-encoder.js';
