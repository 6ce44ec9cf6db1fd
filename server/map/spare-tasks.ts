/**
 * The map engine's tasks a spare thread can run (see server/common/spare.ts).
 */
import { inlineSpare, type Spare, type SpareTasks } from '../common/spare.js';
import { pairDistances } from './local-join.js';

export const MAP_SPARE_TASKS: SpareTasks = {
  'knn.distances': pairDistances,
};

/** The map engine's tasks run in the calling thread: the default wherever a spare is optional. */
export const MAP_INLINE: Spare = inlineSpare(MAP_SPARE_TASKS);
