import type { Step } from '../common/step.js';
import type { Progress, TaskDefinition } from './api.js';

/**
 * Turns engine steps into a whole-job fraction. Steps carry either a task stage name or an inner
 * engine stage (e.g. `knn`); an inner stage counts toward the task stage in force. Within a stage
 * the fraction only grows, so a bar never jumps back when an engine starts a new sub-phase.
 */
export class ProgressMeter {
  private readonly offsets = new Map<string, { start: number; width: number }>();
  /** Inner phases of a stage: their start and width as fractions of that stage. */
  private readonly parts = new Map<string, Map<string, { start: number; width: number }>>();
  private current: string;
  private fraction = 0;

  constructor(stages: TaskDefinition['stages']) {
    const total = stages.reduce((s, x) => s + x.weight, 0) || 1;
    let acc = 0;
    for (const s of stages) {
      this.offsets.set(s.name, { start: acc / total, width: s.weight / total });
      acc += s.weight;
      if (s.parts?.length) {
        const sum = s.parts.reduce((x, p) => x + p.weight, 0) || 1;
        let inner = 0;
        const m = new Map<string, { start: number; width: number }>();
        for (const p of s.parts) {
          m.set(p.name, { start: inner / sum, width: p.weight / sum });
          inner += p.weight;
        }
        this.parts.set(s.name, m);
      }
    }
    this.current = stages[0]?.name ?? 'running';
  }

  /** Feeds one step; returns the progress to show. */
  update(step: Step): Progress {
    if (this.offsets.has(step.stage) && step.stage !== this.current) this.current = step.stage;
    const span = this.offsets.get(this.current);
    if (span) {
      let within = step.total > 0 ? Math.min(1, step.done / step.total) : 0;
      const part = step.stage !== this.current ? this.parts.get(this.current)?.get(step.stage) : undefined;
      if (part) within = part.start + part.width * within;
      else if (step.stage !== this.current && this.parts.has(this.current)) within = 0;
      this.fraction = Math.max(this.fraction, span.start + span.width * within);
    }
    const detail = step.stage !== this.current ? step.stage : undefined;
    return { stage: this.current, fraction: Math.min(1, this.fraction), ...(detail ? { detail } : {}) };
  }
}
