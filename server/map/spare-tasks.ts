/**
 * The map engine's tasks a spare thread can run (see server/common/spare.ts).
 */
import { inlineSpare, type Spare, type SpareTasks } from '../common/spare.js';
import { pairDistances } from './row-kernel.js';
import { sgdHalf, type HalfInput } from './optimize-layout.js';
import { randomProjectionTree } from './random-projection-tree.js';
import { sampleOwn, settleOwn, type SampleInput } from './sample-candidates.js';

export const MAP_SPARE_TASKS: SpareTasks = {
  'knn.distances': pairDistances,
  'knn.tree': randomProjectionTree,
  'knn.sample-own': (i: SampleInput) => sampleOwn(i.state, i.half),
  'knn.settle-own': (i: SampleInput) => settleOwn(i.state, i.half),
  'layout.half': (i: HalfInput) => sgdHalf(i.state, i.part),
};

/** The map engine's tasks run in the calling thread: the default wherever a spare is optional. */
export const MAP_INLINE: Spare = inlineSpare(MAP_SPARE_TASKS);
