import type { Store } from '../../store/api.js';
import type { JobHandler } from '../job-runner.js';
import type { TrainInput, TrainOutput } from '../tasks/index.js';
import { collectTrainingSet, type TrainingSource } from './training-set.js';

/**
 * Runs a router training job: collects the examples, trains and cross-validates in a worker, then
 * stores the new version, which starts serving at once. A failed or cancelled training leaves the
 * previous version serving.
 */
export function trainingJobHandler(store: Store): JobHandler {
  return {
    async run(job, ctx) {
      const router = await store.getRouter(job.targetId);
      if (!router) throw new Error(`Router ${job.targetId} no longer exists.`);
      ctx.report({ stage: 'vectorise', fraction: 0 });
      const set = await collectTrainingSet(store, router.source as TrainingSource);
      const out = await ctx.pool.run<TrainOutput>(
        'train',
        { texts: set.texts, labels: set.labels, params: router.params } satisfies TrainInput,
        ctx.report,
        ctx.signal,
      );
      await store.saveRouterVersion(
        router.id,
        out.model,
        out.labels,
        set.texts.length,
        { ...out.evaluation, leftOut: set.leftOut } as unknown as Record<string, unknown>,
        out.abstainThreshold,
      );
    },
  };
}
