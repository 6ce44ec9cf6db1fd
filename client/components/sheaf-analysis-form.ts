import { LitElement, css, html, nothing } from 'lit';
import { api } from '../api/client.js';
import type { AnalysisRequest, ClusterMethod, Linkage } from '../api/types.js';
import { DEFAULT_ANALYSIS_REQUEST, analysisRequestProblem } from '../lib/form-checks.js';
import { sharedStyles } from '../lib/shared-styles.js';
import './sheaf-error-note.js';

/**
 * The settings of a new analysis: method, number of themes (fixed, or chosen by silhouette
 * within a range), linkage for agglomerative grouping, how finely the map is laid out, and the
 * seed. Fires `analysis-started`
 * with `{id}` once the server has queued it.
 */
export class SheafAnalysisForm extends LitElement {
  static override properties = {
    corpusId: { type: String },
    documentCount: { type: Number },
    req: { state: true },
    problem: { state: true },
    error: { state: true },
    sending: { state: true },
  };
  corpusId = '';
  documentCount = 0;
  req: AnalysisRequest = { ...DEFAULT_ANALYSIS_REQUEST };
  problem: string | null = null;
  error: unknown = null;
  sending = false;

  static override styles = [
    sharedStyles,
    css`
      form { display: grid; grid-template-columns: repeat(auto-fill, minmax(10rem, 13rem)); gap: 0.7rem 0.9rem; align-items: end; }
      label { display: flex; flex-direction: column; gap: 0.2rem; }
      fieldset { border: 1px solid var(--line); border-radius: var(--radius); padding: 0.4rem 0.7rem 0.6rem; grid-column: 1 / -1; display: flex; gap: 1.5rem; flex-wrap: wrap; margin: 0; }
      legend { font-size: 0.88rem; color: var(--muted); padding: 0 0.25rem; }
      .kline { display: flex; gap: 0.6rem; align-items: center; flex-wrap: wrap; }
      .kline input[type='number'] { width: 4.6rem; }
      .radio { flex-direction: row; align-items: center; gap: 0.3rem; color: var(--ink); }
      .actions { grid-column: 1 / -1; }
    `,
  ];

  private set<K extends keyof AnalysisRequest>(key: K, value: AnalysisRequest[K]) {
    this.req = { ...this.req, [key]: value };
    this.problem = null;
  }

  private num(e: Event): number {
    return Number((e.target as HTMLInputElement).value);
  }

  private async submit(e: Event) {
    e.preventDefault();
    this.problem = analysisRequestProblem(this.req, this.documentCount);
    if (this.problem) return;
    const r = this.req;
    const body: Partial<AnalysisRequest> =
      r.k === 'auto'
        ? { method: r.method, k: 'auto', kMin: r.kMin, kMax: r.kMax, seed: r.seed }
        : { method: r.method, k: r.k, seed: r.seed };
    if (r.method === 'agglomerative') body.linkage = r.linkage;
    if (r.mapEpochs !== 'auto') body.mapEpochs = r.mapEpochs;
    this.sending = true;
    this.error = null;
    try {
      const started = await api.startAnalysis(this.corpusId, body);
      this.dispatchEvent(new CustomEvent('analysis-started', { detail: { id: started.id }, bubbles: true, composed: true }));
    } catch (err) {
      this.error = err;
    } finally {
      this.sending = false;
    }
  }

  override render() {
    const r = this.req;
    const auto = r.k === 'auto';
    return html`
      <form @submit=${this.submit} aria-label="New analysis">
        <label
          >Method
          <select name="method" @change=${(e: Event) => this.set('method', (e.target as HTMLSelectElement).value as ClusterMethod)}>
            <option value="kmeans" ?selected=${r.method === 'kmeans'}>k-means</option>
            <option value="agglomerative" ?selected=${r.method === 'agglomerative'}>agglomerative</option>
          </select>
        </label>
        ${r.method === 'agglomerative'
          ? html`<label
              >Linkage
              <select name="linkage" @change=${(e: Event) => this.set('linkage', (e.target as HTMLSelectElement).value as Linkage)}>
                <option value="ward" ?selected=${r.linkage === 'ward'}>Ward (most even themes)</option>
                <option value="average" ?selected=${r.linkage === 'average'}>average</option>
                <option value="complete" ?selected=${r.linkage === 'complete'}>complete</option>
              </select>
            </label>`
          : nothing}
        <label
          >Map
          <select name="mapEpochs" @change=${(e: Event) => this.set('mapEpochs', (e.target as HTMLSelectElement).value === 'fine' ? 'fine' : 'auto')}>
            <option value="auto" ?selected=${r.mapEpochs !== 'fine'}>quick</option>
            <option value="fine" ?selected=${r.mapEpochs === 'fine'}>fine (slower on large corpora)</option>
          </select>
        </label>
        <label>Seed<input name="seed" type="number" step="1" .value=${String(r.seed)} @input=${(e: Event) => this.set('seed', this.num(e))} /></label>
        <fieldset>
          <legend>Number of themes</legend>
          <div class="kline">
            <label class="radio"><input type="radio" name="kmode" value="auto" .checked=${auto} @change=${() => this.set('k', 'auto')} /> chosen by silhouette, from</label>
            <input name="kMin" type="number" min="2" step="1" aria-label="Fewest themes to try" .value=${String(r.kMin)} ?disabled=${!auto} @input=${(e: Event) => this.set('kMin', this.num(e))} />
            <span>to</span>
            <input name="kMax" type="number" min="2" step="1" aria-label="Most themes to try" .value=${String(r.kMax)} ?disabled=${!auto} @input=${(e: Event) => this.set('kMax', this.num(e))} />
          </div>
          <div class="kline">
            <label class="radio"><input type="radio" name="kmode" value="fixed" .checked=${!auto} @change=${() => this.set('k', 8)} /> exactly</label>
            <input name="k" type="number" min="2" step="1" aria-label="Number of themes" .value=${auto ? '8' : String(r.k)} ?disabled=${auto} @input=${(e: Event) => this.set('k', this.num(e))} />
          </div>
        </fieldset>
        <div class="actions stack">
          ${this.problem ? html`<div class="note warn" role="alert">${this.problem}</div>` : nothing}
          <sheaf-error-note .error=${this.error} context="Could not start"></sheaf-error-note>
          <button class="primary" type="submit" ?disabled=${this.sending || !this.corpusId}>${this.sending ? 'Starting…' : 'Find themes'}</button>
        </div>
      </form>
    `;
  }
}
customElements.define('sheaf-analysis-form', SheafAnalysisForm);
