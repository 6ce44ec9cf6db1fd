import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { api } from '../api/client.js';
import type { Router } from '../api/types.js';
import { TaskController, TaskStatus } from '../controllers/task-controller.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt, pct } from '../lib/ticks.js';
import { navigate } from './sheaf-app.js';
import './sheaf-train-form.js';
import './sheaf-job-progress.js';
import './sheaf-label-table.js';
import './sheaf-confusion-heatmap.js';
import './sheaf-roc-chart.js';
import './sheaf-threshold-chart.js';
import './sheaf-key-manager.js';
import './sheaf-route-try.js';
import './sheaf-error-note.js';

/** A router's display name: its own name, or its first labels. */
function routerTitle(r: Router): string {
  if (r.name) return r.name;
  const labels = r.labels ?? [];
  if (labels.length === 0) return r.status === 'done' ? r.id : 'training…';
  return labels.length > 3 ? `${labels.slice(0, 3).join(', ')} +${labels.length - 3}` : labels.join(', ');
}

/**
 * Routers: train one from named themes or a label field, read its cross-validated evaluation
 * (measures per label, confusion heat map, ROC curves, abstain trade-off), try a text, and
 * manage its API keys. A key created here lives in this page's memory only.
 */
export class SheafRouterPage extends LitElement {
  static override properties = {
    routerId: { type: String },
    analysisId: { type: String },
    corpusId: { type: String },
    apiKey: { state: true },
    deleteError: { state: true },
  };
  routerId: string | null = null;
  analysisId: string | null = null;
  corpusId: string | null = null;
  apiKey = '';
  deleteError: unknown = null;
  private list = new TaskController<Router[] | null>(this);
  private router = new TaskController<Router>(this);

  static override styles = [
    sharedStyles,
    css`
      .layout { display: grid; grid-template-columns: minmax(17rem, 24rem) 1fr; gap: 1.1rem; align-items: start; }
      @media (max-width: 1000px) { .layout { grid-template-columns: 1fr; } }
      .right > * + * { margin-top: 1rem; }
      .left > * + * { margin-top: 1rem; }
      .stats { display: flex; gap: 1.5rem; flex-wrap: wrap; }
      .stat b { display: block; font-size: 1.35rem; font-variant-numeric: tabular-nums; }
      .stat span { font-size: 0.82rem; color: var(--muted); }
      .two { display: grid; grid-template-columns: repeat(auto-fit, minmax(22rem, 1fr)); gap: 1rem; }
      ul.routers { list-style: none; padding: 0; margin: 0; }
      ul.routers a { display: block; padding: 0.4rem; border-radius: var(--radius); color: var(--ink); text-decoration: none; }
      ul.routers a[aria-current='true'] { background: var(--accent-soft); }
    `,
  ];

  override connectedCallback(): void {
    super.connectedCallback();
    void this.loadList();
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('routerId')) {
      this.apiKey = '';
      if (this.routerId) void this.load(this.routerId);
    }
  }

  private loadList() {
    return this.list.run(async (signal) => {
      try {
        return await api.listRouters(signal);
      } catch {
        return null;
      }
    });
  }

  private load(rid: string) {
    return this.router.run((signal) => api.getRouter(rid, signal));
  }

  private async deleteRouter(r: Router) {
    if (!confirm('Delete this router? Its keys stop working at once.')) return;
    this.deleteError = null;
    try {
      await api.deleteRouter(r.id);
      navigate(this, { router: null });
      await this.loadList();
    } catch (err) {
      this.deleteError = err;
    }
  }

  private renderEvaluation(r: Router) {
    const ev = r.evaluation;
    if (!ev) return html`<p class="muted">No evaluation was stored for this router.</p>`;
    const auc: Record<string, number | null> = {};
    for (const p of ev.perLabel) auc[p.label] = p.auc;
    const th = ev.threshold;
    return html`
      <section class="panel stack" aria-label="Summary">
        <div class="stats">
          <div class="stat"><b>${pct(ev.accuracy, 1)}</b><span>accuracy (${ev.folds}-fold cross-validation)</span></div>
          <div class="stat"><b>${pct(ev.errorRate ?? 1 - ev.accuracy, 1)}</b><span>error rate</span></div>
          <div class="stat"><b>${fmt(ev.macroF1, 3)}</b><span>macro F1</span></div>
          <div class="stat"><b>${(r.documentCount ?? 0).toLocaleString()}</b><span>training documents</span></div>
          <div class="stat"><b>${fmt(r.abstainThreshold ?? th?.value ?? null, 2)}</b><span>abstain threshold</span></div>
        </div>
        ${th
          ? html`<p class="small">
              Aimed at ${pct(th.targetPrecision)} precision: ${th.reached ? 'reached' : html`<b>not reached</b> (the best threshold was used)`}, with
              ${pct(th.precision, 1)} precision on the ${pct(th.coverage, 1)} of messages it answers.
            </p>`
          : nothing}
      </section>
      <section class="panel">
        <h3>Per label</h3>
        <sheaf-label-table .rows=${ev.perLabel}></sheaf-label-table>
      </section>
      <section class="panel"><h3>Confusion</h3><sheaf-confusion-heatmap .labels=${ev.confusion.labels} .matrix=${ev.confusion.matrix}></sheaf-confusion-heatmap></section>
      <div class="two">
        <section class="panel"><h3>ROC curves</h3>${ev.roc?.length ? html`<sheaf-roc-chart .curves=${ev.roc} .auc=${auc}></sheaf-roc-chart>` : html`<p class="muted small">Not reported.</p>`}</section>
        <section class="panel">
          <h3>Abstain threshold</h3>
          <sheaf-threshold-chart .curve=${ev.thresholdCurve ?? []} .current=${r.abstainThreshold ?? th?.value ?? NaN} .target=${th?.targetPrecision ?? NaN}></sheaf-threshold-chart>
        </section>
      </div>
    `;
  }

  private renderRouter() {
    const t = this.router;
    if (!this.routerId) return html`<div class="panel muted">Train a router, or pick one on the left.</div>`;
    if (t.status === TaskStatus.Error) return html`<sheaf-error-note .error=${t.error} context="Could not load the router"></sheaf-error-note>`;
    const r = t.value;
    if (!r || r.id !== this.routerId) return html`<p class="muted">Loading…</p>`;
    if (r.status === 'queued' || r.status === 'running') {
      return html`<section class="panel stack"><h2>Training…</h2><sheaf-job-progress kind="routers" .jobId=${r.id} @job-ended=${() => {
        void this.load(r.id);
        void this.loadList();
      }}></sheaf-job-progress></section>`;
    }
    if (r.status !== 'done') {
      return html`<section class="panel stack"><h2>Training ${r.status === 'cancelled' ? 'was cancelled' : 'failed'}</h2>${r.error ? html`<div class="note bad">${r.error.message}</div>` : nothing}</section>`;
    }
    return html`
      <section class="panel stack">
        <div class="row spread"><h2>Router: ${routerTitle(r)}</h2><button class="quiet danger" @click=${() => this.deleteRouter(r)}>Delete router</button></div>
        <sheaf-error-note .error=${this.deleteError} context="Could not delete"></sheaf-error-note>
        <p class="small muted">id <code>${r.id}</code>${r.version && r.version > 1 ? `, version ${r.version}` : ''}</p>
        <p class="small muted">
          ${(r.labels ?? []).length} labels: ${(r.labels ?? []).join(', ')}.
          ${r.source?.analysisId
            ? html`Trained on the named themes of <a href="?view=analysis&analysis=${encodeURIComponent(r.source.analysisId)}" @click=${(e: MouseEvent) => {
                e.preventDefault();
                navigate(this, { view: 'analysis', analysis: r.source!.analysisId! });
              }}>an analysis</a>.`
            : r.source?.labelField
              ? html`Trained on the field <code>${r.source.labelField}</code> of a corpus.`
              : nothing}
          ${r.createdAt ? html`Created ${new Date(r.createdAt).toLocaleString()}.` : nothing}
        </p>
        <div class="note warn" role="note">
          Automatic routing makes mistakes. Messages below the abstain threshold are flagged so a person checks them.
          Messages about safety, health or legal deadlines should never depend on this router alone.
        </div>
      </section>
      ${this.renderEvaluation(r)}
      <section class="panel stack">
        <h3>Try a text</h3>
        <sheaf-route-try .routerId=${r.id} .apiKey=${this.apiKey}></sheaf-route-try>
      </section>
      <section class="panel stack">
        <h3>API keys</h3>
        <sheaf-key-manager .routerId=${r.id} @key-created=${(e: CustomEvent<{ key: string }>) => (this.apiKey = e.detail.key)}></sheaf-key-manager>
      </section>
    `;
  }

  override render() {
    const routers = this.list.value;
    return html`<div class="layout">
      <div class="left">
        <section class="panel stack">
          <h2>Train a router</h2>
          <sheaf-train-form
            .analysisId=${this.analysisId}
            @router-started=${(e: CustomEvent<{ id: string }>) => {
              navigate(this, { router: e.detail.id });
              void this.loadList();
            }}
          ></sheaf-train-form>
        </section>
        ${routers && routers.length
          ? html`<section class="panel">
              <h3>Routers</h3>
              <ul class="routers">
                ${routers.map(
                  (r) => html`<li><a href="?view=routers&router=${encodeURIComponent(r.id)}" aria-current=${r.id === this.routerId ? 'true' : 'false'} @click=${(e: MouseEvent) => {
                    e.preventDefault();
                    navigate(this, { router: r.id });
                  }}>${routerTitle(r)}<br /><span class="small muted">${r.createdAt ? new Date(r.createdAt).toLocaleString() : r.id} · ${r.status}</span></a></li>`,
                )}
              </ul>
            </section>`
          : nothing}
      </div>
      <div class="right">${this.renderRouter()}</div>
    </div>`;
  }
}
customElements.define('sheaf-router-page', SheafRouterPage);
