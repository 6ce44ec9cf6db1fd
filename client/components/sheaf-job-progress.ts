import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { styleMap } from 'lit/directives/style-map.js';
import { JobController, JobPhase, type JobKind } from '../controllers/job-controller.js';
import { stageName } from '../lib/stage-names.js';
import { sharedStyles } from '../lib/shared-styles.js';
import './sheaf-error-note.js';

/** Detail of the `job-ended` event. */
export interface JobEndedDetail {
  id: string;
  phase: JobPhase;
}

/**
 * A live progress bar for one job (analysis or router training), fed by the job's event stream,
 * with the stage in words and a cancel button. Fires `job-ended` once the job is final.
 */
export class SheafJobProgress extends LitElement {
  static override properties = { kind: { type: String }, jobId: { type: String }, cancelError: { state: true }, cancelling: { state: true } };
  /** `analyses` or `routers`. */
  kind: JobKind = 'analyses';
  /** The job to follow. */
  jobId = '';
  cancelError: unknown = null;
  cancelling = false;
  private job: JobController | null = null;

  static override styles = [
    sharedStyles,
    css`
      .bar { height: 10px; border-radius: 999px; background: var(--accent-soft); overflow: hidden; }
      .fill { height: 100%; background: var(--accent); transition: width 0.25s ease-out; }
      .line { display: flex; justify-content: space-between; gap: 1rem; font-size: 0.9rem; margin-bottom: 0.35rem; }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if ((changed.has('jobId') || changed.has('kind')) && this.jobId) {
      if (this.job) {
        this.job.stop();
        this.removeController(this.job);
      }
      this.job = new JobController(this, this.kind, (id, phase) => {
        this.dispatchEvent(new CustomEvent<JobEndedDetail>('job-ended', { detail: { id, phase }, bubbles: true, composed: true }));
      });
      this.job.follow(this.jobId);
    }
  }

  private async cancel() {
    this.cancelling = true;
    this.cancelError = null;
    try {
      await this.job?.cancel();
    } catch (err) {
      this.cancelError = err;
    } finally {
      this.cancelling = false;
    }
  }

  override render() {
    const j = this.job;
    if (!j) return nothing;
    const running = j.phase === JobPhase.Running;
    const pct = Math.round(j.fraction * 100);
    const words =
      j.phase === JobPhase.Done ? 'Finished' : j.phase === JobPhase.Cancelled ? 'Cancelled' : j.phase === JobPhase.Failed ? 'Failed' : `${stageName(j.stage)}${j.detail && j.detail !== j.stage ? ` · ${stageName(j.detail).toLowerCase()}` : ''}`;
    return html`<div class="stack" role="group" aria-label="Job progress">
      <div class="line"><span aria-live="polite">${words}</span><span class="num">${pct}%</span></div>
      <div class="bar" role="progressbar" aria-valuemin="0" aria-valuemax="100" aria-valuenow=${pct} aria-valuetext=${`${words}, ${pct}%`}>
        <div class="fill" style=${styleMap({ width: `${pct}%` })}></div>
      </div>
      ${running
        ? html`<button type="button" class="danger" ?disabled=${this.cancelling} @click=${this.cancel}>${this.cancelling ? 'Cancelling…' : 'Cancel'}</button>`
        : nothing}
      <sheaf-error-note .error=${this.cancelError} context="Could not cancel"></sheaf-error-note>
    </div>`;
  }
}
customElements.define('sheaf-job-progress', SheafJobProgress);
