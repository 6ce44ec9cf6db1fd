import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { api } from '../api/client.js';
import type { Analysis, Corpus, CorpusSummary, RouterRequest } from '../api/types.js';
import { trainOptionsProblem } from '../lib/form-checks.js';
import { sharedStyles } from '../lib/shared-styles.js';
import './sheaf-error-note.js';

/**
 * Starts training a router, either from the named themes of an analysis or from a label field
 * already in a corpus. Fires `router-started` `{id}`.
 */
export class SheafTrainForm extends LitElement {
  static override properties = {
    analysisId: { type: String },
    source: { state: true },
    corpora: { state: true },
    corpusId: { state: true },
    corpus: { state: true },
    labelField: { state: true },
    analysis: { state: true },
    candidates: { state: true },
    picked: { state: true },
    folds: { state: true },
    alpha: { state: true },
    target: { state: true },
    problem: { state: true },
    error: { state: true },
    busy: { state: true },
  };
  analysisId: string | null = null;
  source: 'analysis' | 'labels' = 'analysis';
  corpora: CorpusSummary[] = [];
  corpusId = '';
  corpus: Corpus | null = null;
  labelField = '';
  analysis: Analysis | null = null;
  /** Finished analyses with at least two named themes, offered when no analysis is open. */
  candidates: { analysis: Analysis; corpusName: string; named: number }[] = [];
  /** Analysis chosen in the form (overrides the open one). */
  picked = '';
  folds = 5;
  alpha = 1;
  target = 0.9;
  problem: string | null = null;
  error: unknown = null;
  busy = false;

  static override styles = [
    sharedStyles,
    css`
      form { display: grid; gap: 0.7rem; grid-template-columns: minmax(0, 1fr); }
      select, input[type='number'] { width: 100%; min-width: 0; }
      label { display: flex; flex-direction: column; gap: 0.2rem; }
      .radio { flex-direction: row; gap: 0.35rem; align-items: center; color: var(--ink); }
      .opts { display: grid; grid-template-columns: repeat(3, minmax(0, 1fr)); gap: 0.6rem; align-items: end; }
      .opts.two { grid-template-columns: repeat(2, minmax(0, 1fr)); }
    `,
  ];

  override connectedCallback(): void {
    super.connectedCallback();
    void this.loadCandidates();
  }

  /** Lists the corpora, and the finished analyses that have two or more named themes. */
  private async loadCandidates(): Promise<void> {
    try {
      this.corpora = await api.listCorpora();
    } catch {
      return;
    }
    const found: { analysis: Analysis; corpusName: string; named: number }[] = [];
    // Bounded: the picker is a convenience; the open analysis is always offered.
    for (const c of this.corpora.slice(0, 50)) {
      const list = await api.listAnalyses(c.id).catch(() => [] as Analysis[]);
      for (const a of list) {
        const named = (a.clusters ?? []).filter((k) => k.name && k.name.trim()).length;
        if (a.status === 'done' && named >= 2) found.push({ analysis: a, corpusName: c.name, named });
      }
    }
    this.candidates = found;
  }

  private get sourceAnalysisId(): string | null {
    return this.picked || this.analysisId;
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('analysisId') || changed.has('picked')) {
      this.analysis = null;
      const aid = this.sourceAnalysisId;
      if (aid) api.getAnalysis(aid).then((a) => (this.analysis = a), () => undefined);
    }
    if (changed.has('corpusId')) {
      this.corpus = null;
      this.labelField = '';
      if (this.corpusId) {
        api.getCorpus(this.corpusId).then(
          (c) => {
            this.corpus = c;
            this.labelField = c.fields?.[0] ?? '';
          },
          (err) => (this.error = err),
        );
      }
    }
  }

  private async submit(e: Event) {
    e.preventDefault();
    this.problem = trainOptionsProblem(this.folds, this.alpha, this.target);
    if (!this.problem && this.source === 'analysis' && !this.sourceAnalysisId) this.problem = 'Choose an analysis with named themes, or use a label field.';
    if (!this.problem && this.source === 'labels' && (!this.corpusId || !this.labelField)) this.problem = 'Choose a corpus and the field that holds the labels.';
    if (this.problem) return;
    const opts = { folds: this.folds, alpha: this.alpha, targetPrecision: this.target };
    const body: RouterRequest = this.source === 'analysis' ? { analysisId: this.sourceAnalysisId!, ...opts } : { corpusId: this.corpusId, labelField: this.labelField, ...opts };
    this.busy = true;
    this.error = null;
    try {
      const r = await api.startRouter(body);
      this.dispatchEvent(new CustomEvent('router-started', { detail: { id: r.id }, bubbles: true, composed: true }));
    } catch (err) {
      this.error = err;
    } finally {
      this.busy = false;
    }
  }

  override render() {
    const named = (this.analysis?.clusters ?? []).filter((c) => c.name && c.name.trim());
    const num = (e: Event) => Number((e.target as HTMLInputElement).value);
    return html`<form @submit=${this.submit} aria-label="Train a router">
      <label class="radio"><input type="radio" name="src" .checked=${this.source === 'analysis'} @change=${() => (this.source = 'analysis')} /> from the named themes of an analysis</label>
      ${this.source === 'analysis'
        ? html`<label
            >Analysis
            <select @change=${(e: Event) => (this.picked = (e.target as HTMLSelectElement).value)}>
              ${this.analysisId ? html`<option value="" ?selected=${!this.picked}>the open analysis</option>` : html`<option value="" ?selected=${!this.picked}>choose…</option>`}
              ${this.candidates
                .filter((c) => c.analysis.id !== this.analysisId)
                .map(
                  (c) => html`<option value=${c.analysis.id} ?selected=${c.analysis.id === this.picked}>
                    ${c.corpusName} · ${c.named} named · ${c.analysis.createdAt ? new Date(c.analysis.createdAt).toLocaleString() : c.analysis.id}
                  </option>`,
                )}
            </select>
          </label>`
        : nothing}
      ${this.source === 'analysis' && this.analysis
        ? html`<p class="small muted">${named.length} named theme${named.length === 1 ? '' : 's'}${named.length ? `: ${named.map((c) => c.name).join(', ')}` : ''}. Unnamed themes are left out.</p>`
        : nothing}
      <label class="radio"><input type="radio" name="src" .checked=${this.source === 'labels'} @change=${() => (this.source = 'labels')} /> from a label field of a corpus</label>
      ${this.source === 'labels'
        ? html`<div class="opts two">
            <label>Corpus
              <select @change=${(e: Event) => (this.corpusId = (e.target as HTMLSelectElement).value)}>
                <option value="" ?selected=${!this.corpusId}>choose…</option>
                ${this.corpora.map((c) => html`<option value=${c.id} ?selected=${c.id === this.corpusId}>${c.name}</option>`)}
              </select>
            </label>
            <label>Label field
              <select ?disabled=${!this.corpus} @change=${(e: Event) => (this.labelField = (e.target as HTMLSelectElement).value)}>
                ${(this.corpus?.fields ?? []).map((f) => html`<option value=${f} ?selected=${f === this.labelField}>${f}</option>`)}
              </select>
            </label>
          </div>`
        : nothing}
      <div class="opts">
        <label>Folds<input type="number" min="2" max="20" step="1" .value=${String(this.folds)} @input=${(e: Event) => (this.folds = num(e))} /></label>
        <label>Smoothing (alpha)<input type="number" min="0.001" step="any" .value=${String(this.alpha)} @input=${(e: Event) => (this.alpha = num(e))} /></label>
        <label>Target precision<input type="number" min="0.05" max="1" step="any" .value=${String(this.target)} @input=${(e: Event) => (this.target = num(e))} /></label>
      </div>
      ${this.problem ? html`<div class="note warn" role="alert">${this.problem}</div>` : nothing}
      <sheaf-error-note .error=${this.error} context="Could not start training"></sheaf-error-note>
      <div><button class="primary" type="submit" ?disabled=${this.busy}>${this.busy ? 'Starting…' : 'Train router'}</button></div>
    </form>`;
  }
}
customElements.define('sheaf-train-form', SheafTrainForm);
