export * from './merge-clusters.js';
