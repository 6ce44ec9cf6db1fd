import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { sharedStyles } from '../lib/shared-styles.js';
import { navigate } from './sheaf-app.js';

/**
 * The text search over an analysis's documents. The words go into the URL (`q`), so a search
 * can be shared; the page outlines the matches on the map and filters the list.
 */
export class SheafSearchBar extends LitElement {
  static override properties = { query: { type: String }, total: { type: Number }, searching: { type: Boolean }, draft: { state: true } };
  /** The search in force. */
  query = '';
  /** How many documents match it (-1 while unknown). */
  total = -1;
  searching = false;
  draft = '';

  static override styles = [
    sharedStyles,
    css`
      form { display: flex; gap: 0.6rem; align-items: center; flex-wrap: wrap; }
      input[type='search'] { min-width: 16rem; }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('query')) this.draft = this.query;
  }

  override render() {
    return html`<form
      role="search"
      @submit=${(e: Event) => {
        e.preventDefault();
        navigate(this, { q: this.draft.trim() });
      }}
    >
      <input type="search" aria-label="Search document text" placeholder="Find words in the documents" .value=${this.draft} @input=${(e: Event) => (this.draft = (e.target as HTMLInputElement).value)} />
      <button type="submit">Search</button>
      ${this.query ? html`<button type="button" class="quiet" @click=${() => navigate(this, { q: '' })}>Clear search</button>` : nothing}
      ${this.query && this.searching ? html`<span class="small muted">searching…</span>` : nothing}
      ${this.query && !this.searching && this.total >= 0
        ? html`<span class="small muted" aria-live="polite">${this.total.toLocaleString()} matching documents outlined on the map</span>`
        : nothing}
    </form>`;
  }
}
customElements.define('sheaf-search-bar', SheafSearchBar);
