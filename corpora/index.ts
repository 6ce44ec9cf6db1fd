export * from './api.js';
export * from './demo-corpus.js';
export * from './demo-info.js';
export * from './to-csv.js';
