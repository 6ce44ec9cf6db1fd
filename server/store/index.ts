export * from './api.js';
export { newId, isIdShaped } from './new-id.js';
export { openSqliteStore, DuplicateIdError } from './sqlite/index.js';
