export * from './api.js';
export { DEFAULT_MAP_OPTIONS, autoEpochs, project, projectSteps } from './project.js';
export { DEFAULT_KNN_OPTIONS, nearestNeighbors, nearestNeighborsSteps } from './nearest-neighbors.js';
export { exactNeighbors, exactNeighborsSteps } from './exact-neighbors.js';
export { fuzzyGraph, fuzzyGraphSteps } from './fuzzy-graph.js';
export { DEFAULT_TRUSTWORTHINESS_OPTIONS, trustworthiness } from './trustworthiness.js';
