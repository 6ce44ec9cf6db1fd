import type { Stepwise } from '../../common/step.js';
import { trainRouterSteps, type Evaluation, type RouterOptions } from '../../route/index.js';
import type { TaskDefinition } from '../api.js';

export interface TrainInput {
  texts: string[];
  labels: string[];
  params: Partial<RouterOptions>;
}

export interface TrainOutput {
  model: unknown;
  evaluation: Evaluation;
  labels: string[];
  abstainThreshold: number;
}

/** Trains and cross-validates a router in a worker. */
export const trainTask: TaskDefinition<TrainInput, TrainOutput> = {
  stages: [
    { name: 'vectorise', weight: 1 },
    { name: 'cross-validate', weight: 5 },
    { name: 'fit', weight: 1 },
  ],
  *run(input): Stepwise<TrainOutput> {
    const { model, evaluation } = yield* trainRouterSteps(input.texts, input.labels, input.params);
    return { model: model.toJSON(), evaluation, labels: model.labels, abstainThreshold: model.abstainThreshold };
  },
};
