/**
 * The map engine's tasks a spare thread can run (see server/common/spare.ts).
 */
import type { Dense } from '../common/matrix.js';
import { seededRandom } from '../common/random.js';
import { inlineSpare, type Spare, type SpareTasks } from '../common/spare.js';
import { smoothRows } from './fuzzy-graph.js';
import { pcaLayout } from './initial-layout.js';
import { sgdHalf, type HalfInput } from './optimize-layout.js';
import { joinShare } from './local-join.js';
import { randomProjectionTree } from './random-projection-tree.js';
import { sampleOwn, settleOwn, type SampleInput } from './sample-candidates.js';

export const MAP_SPARE_TASKS: SpareTasks = {
  'knn.join-share': joinShare,
  'knn.tree': randomProjectionTree,
  'knn.sample-own': (i: SampleInput) => sampleOwn(i.state, i.half),
  'knn.settle-own': (i: SampleInput) => settleOwn(i.state, i.half),
  'layout.half': (i: HalfInput) => sgdHalf(i.state, i.part),
  'graph.smooth': smoothRows,
  'map.pca': (i: { rows: Dense; seed: number }) => pcaLayout(i.rows, seededRandom(i.seed)),
};

/** The map engine's tasks run in the calling thread: the default wherever a spare is optional. */
export const MAP_INLINE: Spare = inlineSpare(MAP_SPARE_TASKS);
