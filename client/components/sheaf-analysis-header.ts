import { LitElement, css, html, nothing } from 'lit';
import { api } from '../api/client.js';
import type { Analysis, Corpus } from '../api/types.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import { navigate } from './sheaf-app.js';

const METHOD_WORDS: Record<string, string> = { kmeans: 'k-means', agglomerative: 'agglomerative' };

/**
 * The top of an analysis: which corpus, how many themes, mean silhouette, method, how k was
 * chosen, the export links and the way on to training a router.
 */
/** How the map was laid out, when not the quick default. */
function mapWords(epochs: 'auto' | 'fine' | number | undefined): string {
  if (epochs === 'fine') return ', fine map';
  return typeof epochs === 'number' ? `, map of ${epochs} passes` : '';
}

export class SheafAnalysisHeader extends LitElement {
  static override properties = { analysis: { attribute: false }, corpus: { attribute: false } };
  analysis: Analysis | null = null;
  corpus: Corpus | null = null;

  static override styles = [
    sharedStyles,
    css`
      .top { display: flex; justify-content: space-between; gap: 1rem; align-items: flex-start; flex-wrap: wrap; }
      .facts { display: flex; gap: 1.1rem; flex-wrap: wrap; font-size: 0.9rem; color: var(--muted); }
      .facts b { color: var(--ink); }
      a.button { color: var(--ink); }
    `,
  ];

  override render() {
    const a = this.analysis;
    if (!a) return nothing;
    const named = (a.clusters ?? []).filter((c) => c.name && c.name.trim()).length;
    const method = a.params?.method ?? '';
    const seconds = Object.values(a.timings ?? {}).reduce((sum, t) => sum + (Number.isFinite(t) ? t : 0), 0);
    return html`<div class="top">
      <div>
        <h2>Themes${this.corpus ? html` in ${this.corpus.name}` : nothing}</h2>
        <div class="facts">
          <span><b>${a.k ?? (a.clusters ?? []).length}</b> themes</span>
          <span>mean silhouette <b>${fmt(a.silhouette ?? null, 3)}</b></span>
          <span>${METHOD_WORDS[method] ?? method}${method === 'agglomerative' && a.params?.linkage ? `, ${a.params.linkage} linkage` : ''}${mapWords(a.params?.mapEpochs)}</span>
          <span><b>${named}</b> named</span>
          ${seconds > 0 ? html`<span>computed in <b>${seconds < 10 ? seconds.toFixed(1) : Math.round(seconds)}</b> s</span>` : nothing}
        </div>
        ${a.kRule ? html`<p class="small muted">${a.kRule}</p>` : nothing}
      </div>
      <div class="row">
        <a class="button" href=${api.exportUrl(a.id, 'csv')} download="themes-${a.id}.csv">Export CSV</a>
        <a class="button" href=${api.exportUrl(a.id, 'ndjson')} download="themes-${a.id}.ndjson">Export NDJSON</a>
        <button ?disabled=${named < 2} title=${named < 2 ? 'Name at least two themes first' : ''} @click=${() => navigate(this, { view: 'routers', analysis: a.id, router: null })}>
          Train a router…
        </button>
      </div>
    </div>`;
  }
}
customElements.define('sheaf-analysis-header', SheafAnalysisHeader);
