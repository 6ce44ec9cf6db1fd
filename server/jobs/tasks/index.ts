import type { TaskDefinition } from '../api.js';
import { analyseTask } from './analyse-task.js';
import { describeTask } from './describe-task.js';
import { trainTask } from './train-task.js';

export type { AnalyseInput, AnalyseOutput } from './analyse-task.js';
export type { DescribeInput, DescribeOutput } from './describe-task.js';
export type { TrainInput, TrainOutput } from './train-task.js';

/** The tasks a worker can run, by name. */
export const TASKS: Record<string, TaskDefinition<any, any>> = {
  analyse: analyseTask,
  describe: describeTask,
  train: trainTask,
};
