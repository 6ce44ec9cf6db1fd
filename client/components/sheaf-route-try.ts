import { LitElement, css, html, nothing } from 'lit';
import { api } from '../api/client.js';
import type { RouteResult } from '../api/types.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { pct } from '../lib/ticks.js';
import './sheaf-error-note.js';

/**
 * A box to route one text by hand, through the same authenticated endpoint programs use, showing
 * the chosen label, confidence, whether a person should check it, the top scores and the words
 * that weighed most.
 */
export class SheafRouteTry extends LitElement {
  static override properties = { routerId: { type: String }, apiKey: { type: String }, text: { state: true }, result: { state: true }, error: { state: true }, busy: { state: true } };
  routerId = '';
  /** A key of this router, held in memory only. */
  apiKey = '';
  text = '';
  result: RouteResult | null = null;
  error: unknown = null;
  busy = false;

  static override styles = [
    sharedStyles,
    css`
      .verdict { font-size: 1.05rem; }
      .bars { display: grid; grid-template-columns: minmax(6rem, max-content) 1fr 3.5rem; gap: 0.25rem 0.5rem; align-items: center; font-size: 0.84rem; }
      meter { width: 100%; height: 0.7rem; }
      meter::-webkit-meter-bar { background: var(--accent-soft); border: none; border-radius: 999px; }
      meter::-webkit-meter-optimum-value, meter::-webkit-meter-suboptimum-value, meter::-webkit-meter-even-less-good-value { background: var(--accent); border-radius: 999px; }
      meter::-moz-meter-bar { background: var(--accent); }
      .ev { display: flex; gap: 0.3rem; flex-wrap: wrap; }
      .ev span { background: var(--paper); border: 1px solid var(--line); border-radius: 999px; padding: 0 0.5rem; font-size: 0.82rem; }
    `,
  ];

  private async send(e: Event) {
    e.preventDefault();
    if (!this.text.trim() || !this.apiKey) return;
    this.busy = true;
    this.error = null;
    try {
      const res = await api.route(this.routerId, this.apiKey, this.text);
      this.result = res.results[0] ?? null;
    } catch (err) {
      this.error = err;
      this.result = null;
    } finally {
      this.busy = false;
    }
  }

  override render() {
    const r = this.result;
    const scores = r ? Object.entries(r.scores).sort((a, b) => b[1] - a[1]).slice(0, 5) : [];
    return html`<form class="stack" @submit=${this.send}>
      <textarea rows="4" aria-label="Text to route" placeholder="Paste a message to see where it would go" .value=${this.text} @input=${(e: Event) => (this.text = (e.target as HTMLTextAreaElement).value)}></textarea>
      <div class="row">
        <button class="primary" type="submit" ?disabled=${this.busy || !this.apiKey || !this.text.trim()}>Route it</button>
        ${this.apiKey ? nothing : html`<span class="small muted">Create a key below first; it is kept in this page only.</span>`}
      </div>
      <sheaf-error-note .error=${this.error} context="Routing failed"></sheaf-error-note>
      ${r
        ? html`<div class="stack" aria-live="polite" data-role="route-result">
            <div class="verdict">
              → <b>${r.label}</b> (${pct(r.confidence)} confident)
              ${r.abstained ? html`<div class="note warn small">Below the abstain threshold: a person should check this one.</div>` : nothing}
            </div>
            <div class="bars">${scores.map(([l, p]) => html`<span>${l}</span><meter min="0" max="1" .value=${p}></meter><span class="num">${pct(p)}</span>`)}</div>
            ${r.evidence.length ? html`<div class="ev"><span class="muted small">Words that weighed most:</span>${r.evidence.map((w) => html`<span>${w}</span>`)}</div>` : nothing}
          </div>`
        : nothing}
    </form>`;
  }
}
customElements.define('sheaf-route-try', SheafRouteTry);
