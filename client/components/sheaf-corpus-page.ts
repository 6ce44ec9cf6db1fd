import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { api } from '../api/client.js';
import type { Analysis, Corpus, CorpusSummary } from '../api/types.js';
import { TaskController, TaskStatus } from '../controllers/task-controller.js';
import { JobPhase } from '../controllers/job-controller.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import { navigate } from './sheaf-app.js';
import type { JobEndedDetail } from './sheaf-job-progress.js';
import './sheaf-upload.js';
import './sheaf-analysis-form.js';
import './sheaf-job-progress.js';
import './sheaf-error-note.js';

const STATUS_WORDS: Record<string, string> = {
  queued: 'waiting',
  running: 'running',
  done: 'ready',
  failed: 'failed',
  cancelled: 'cancelled',
};

function when(iso: string | undefined): string {
  if (!iso) return '';
  const d = new Date(iso);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleString(undefined, { dateStyle: 'medium', timeStyle: 'short' });
}

/**
 * The corpora page: every corpus, an upload box, and for the selected corpus its analyses and
 * the form that starts a new one, with live progress until it finishes.
 */
export class SheafCorpusPage extends LitElement {
  static override properties = { corpusId: { type: String }, runningId: { state: true }, deleteError: { state: true }, jobNote: { state: true } };
  /** Selected corpus (from the URL). */
  corpusId: string | null = null;
  runningId: string | null = null;
  deleteError: unknown = null;
  jobNote = '';
  private list = new TaskController<CorpusSummary[]>(this);
  private detail = new TaskController<{ corpus: Corpus; analyses: Analysis[] | null }>(this);

  static override styles = [
    sharedStyles,
    css`
      .layout { display: grid; grid-template-columns: minmax(16rem, 22rem) 1fr; gap: 1.2rem; align-items: start; }
      @media (max-width: 900px) { .layout { grid-template-columns: 1fr; } }
      ul.corpora { list-style: none; margin: 0; padding: 0; }
      ul.corpora li + li { border-top: 1px solid var(--line); }
      ul.corpora a { display: block; padding: 0.55rem 0.4rem; text-decoration: none; color: var(--ink); border-radius: var(--radius); }
      ul.corpora a:hover { background: var(--paper); }
      ul.corpora a[aria-current='true'] { background: var(--accent-soft); }
      .name { font-weight: 600; overflow-wrap: anywhere; }
      .fields code { font-family: var(--mono); font-size: 0.82rem; background: var(--paper); padding: 0.05rem 0.3rem; border-radius: 4px; }
      .right > * + * { margin-top: 1.1rem; }
      .status { font-size: 0.8rem; padding: 0.1rem 0.45rem; border-radius: 999px; background: var(--paper); border: 1px solid var(--line); }
      .status.done { color: var(--ok-ink); }
      .status.failed { color: var(--bad-ink); }
    `,
  ];

  override connectedCallback(): void {
    super.connectedCallback();
    void this.loadList();
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('corpusId')) {
      this.runningId = null;
      this.jobNote = '';
      if (this.corpusId) void this.loadDetail(this.corpusId);
    }
  }

  private loadList() {
    return this.list.run((signal) => api.listCorpora(signal));
  }

  private loadDetail(cid: string) {
    return this.detail.run(async (signal) => {
      const corpus = await api.getCorpus(cid, signal);
      let analyses: Analysis[] | null = null;
      try {
        analyses = await api.listAnalyses(cid, signal);
      } catch {
        // Older servers have no per-corpus listing; the page still works without it.
      }
      const running = analyses?.find((a) => a.status === 'queued' || a.status === 'running');
      if (running && !this.runningId) this.runningId = running.id;
      return { corpus, analyses };
    });
  }

  private select(id: string) {
    navigate(this, { corpus: id });
  }

  private async removeCorpus(c: Corpus) {
    if (!confirm(`Delete “${c.name}” with its ${c.documentCount} documents and all its analyses? Routers trained from it keep working.`)) return;
    this.deleteError = null;
    try {
      await api.deleteCorpus(c.id);
      navigate(this, { corpus: null });
      await this.loadList();
    } catch (err) {
      this.deleteError = err;
    }
  }

  private onCreated(e: CustomEvent<{ id: string }>) {
    void this.loadList();
    this.select(e.detail.id);
  }

  private onJobEnded(e: CustomEvent<JobEndedDetail>) {
    const { id, phase } = e.detail;
    if (phase === JobPhase.Done) {
      navigate(this, { view: 'analysis', corpus: this.corpusId, analysis: id });
      return;
    }
    this.jobNote = phase === JobPhase.Cancelled ? 'The analysis was cancelled.' : '';
    this.runningId = null;
    if (this.corpusId) void this.loadDetail(this.corpusId);
  }

  private renderList() {
    const l = this.list;
    if (l.status === TaskStatus.Error) return html`<sheaf-error-note .error=${l.error} context="Could not load the corpora"></sheaf-error-note>`;
    const items = l.value ?? [];
    if (l.status === TaskStatus.Pending && !l.value) return html`<p class="muted">Loading…</p>`;
    if (items.length === 0) return html`<p class="muted">No corpora yet. Import a file to begin.</p>`;
    return html`<ul class="corpora">
      ${items.map(
        (c) => html`<li>
          <a href="?corpus=${encodeURIComponent(c.id)}" aria-current=${c.id === this.corpusId ? 'true' : 'false'} @click=${(e: MouseEvent) => {
            e.preventDefault();
            this.select(c.id);
          }}>
            <div class="name">${c.name}</div>
            <div class="small muted">${c.documentCount.toLocaleString()} documents · ${when(c.createdAt)}</div>
          </a>
        </li>`,
      )}
    </ul>`;
  }

  private renderAnalyses(analyses: Analysis[] | null) {
    if (!analyses) return nothing;
    if (analyses.length === 0) return html`<p class="muted small">No analyses of this corpus yet.</p>`;
    return html`<table aria-label="Analyses of this corpus">
      <thead><tr><th scope="col">Started</th><th scope="col">Method</th><th scope="col" class="num">Themes</th><th scope="col" class="num">Silhouette</th><th scope="col">Status</th><th></th></tr></thead>
      <tbody>
        ${analyses.map(
          (a) => html`<tr>
            <td>${when(a.createdAt)}</td>
            <td>${a.params?.method ?? ''}${a.params?.method === 'agglomerative' && a.params.linkage ? ` (${a.params.linkage})` : ''}</td>
            <td class="num">${a.k ?? '—'}</td>
            <td class="num">${fmt(a.silhouette ?? null, 3)}</td>
            <td><span class="status ${a.status}">${STATUS_WORDS[a.status] ?? a.status}</span></td>
            <td>${a.status === 'done'
              ? html`<button class="quiet" @click=${() => navigate(this, { view: 'analysis', corpus: a.corpusId, analysis: a.id })}>Open</button>`
              : nothing}</td>
          </tr>`,
        )}
      </tbody>
    </table>`;
  }

  private renderDetail() {
    const d = this.detail;
    if (!this.corpusId) return html`<div class="panel muted">Pick a corpus on the left to see its analyses, or import a new one.</div>`;
    if (d.status === TaskStatus.Error) return html`<sheaf-error-note .error=${d.error} context="Could not load the corpus"></sheaf-error-note>`;
    const v = d.value;
    if (!v || v.corpus.id !== this.corpusId) return html`<div class="panel muted">Loading…</div>`;
    const c = v.corpus;
    return html`<section class="panel stack" aria-labelledby="c-h">
      <div class="row spread">
        <h2 id="c-h">${c.name}</h2>
        <button class="danger quiet" @click=${() => this.removeCorpus(c)}>Delete corpus</button>
      </div>
      <p class="small muted">${c.documentCount.toLocaleString()} documents · added ${when(c.createdAt)}</p>
      ${c.fields?.length ? html`<p class="fields small">Other fields: ${c.fields.map((f) => html`<code>${f}</code> `)}</p>` : nothing}
      <sheaf-error-note .error=${this.deleteError} context="Could not delete"></sheaf-error-note>
      <h3>Find themes</h3>
      ${this.runningId ? html`<sheaf-job-progress kind="analyses" .jobId=${this.runningId} @job-ended=${this.onJobEnded}></sheaf-job-progress>` : nothing}
      <sheaf-analysis-form
        ?hidden=${!!this.runningId}
        .corpusId=${c.id}
        .documentCount=${c.documentCount}
        @analysis-started=${(e: CustomEvent<{ id: string }>) => {
          this.jobNote = '';
          this.runningId = e.detail.id;
        }}
      ></sheaf-analysis-form>
      ${this.jobNote ? html`<div class="note warn" role="status">${this.jobNote}</div>` : nothing}
      <h3>Analyses</h3>
      ${this.renderAnalyses(v.analyses)}
    </section>`;
  }

  override render() {
    return html`<div class="layout">
      <section class="panel" aria-labelledby="list-h">
        <h2 id="list-h">Corpora</h2>
        ${this.renderList()}
      </section>
      <div class="right">
        ${this.renderDetail()}
        <sheaf-upload @corpus-created=${this.onCreated}></sheaf-upload>
      </div>
    </div>`;
  }
}
customElements.define('sheaf-corpus-page', SheafCorpusPage);
