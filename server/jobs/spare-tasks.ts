import type { SpareTasks } from '../common/spare.js';
import { CLUSTER_SPARE_TASKS } from '../cluster/spare-tasks.js';
import { MAP_SPARE_TASKS } from '../map/spare-tasks.js';

/** Every engine's spare tasks, by name: what a spare thread can run. */
export const SPARE_TASKS: SpareTasks = { ...CLUSTER_SPARE_TASKS, ...MAP_SPARE_TASKS };
