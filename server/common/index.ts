export * from './step.js';
export * from './random.js';
export * from './matrix.js';
