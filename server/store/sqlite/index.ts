export { openSqliteStore } from './sqlite-store.js';
export { DuplicateIdError } from './corpora.js';
