import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import type { DocumentCache } from '../api/document-cache.js';
import type { Cluster, DocumentItem } from '../api/types.js';
import { TaskController, TaskStatus } from '../controllers/task-controller.js';
import type { MapData } from '../lib/map-data.js';
import type { ThemeStyle } from '../lib/palette.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import { themeLabel } from '../lib/theme-label.js';
import './sheaf-swatch.js';
import './sheaf-error-note.js';

function oneLine(text: string): string {
  const t = text.replace(/\s+/g, ' ').trim();
  return t.length > 400 ? `${t.slice(0, 399)}…` : t;
}

/** Rows per page. */
export const DOCS_PER_PAGE = 25;

/**
 * A paged list of the documents that pass the current filters (theme, text search), with a tick
 * box per row for moving documents. Sends `page-change` `{page}`, `toggle-select`
 * `{index, on}` and `open-doc` `{index}`.
 */
export class SheafDocumentList extends LitElement {
  static override properties = {
    positions: { attribute: false },
    page: { type: Number },
    data: { attribute: false },
    cache: { attribute: false },
    clusters: { attribute: false },
    styles: { attribute: false },
    selected: { attribute: false },
    caption: { type: String },
  };
  positions = new Uint32Array(0);
  page = 0;
  data: MapData | null = null;
  cache: DocumentCache | null = null;
  clusters: Cluster[] = [];
  styles: ThemeStyle[] = [];
  selected: Uint8Array | null = null;
  caption = '';
  private rows = new TaskController<(DocumentItem | undefined)[]>(this);

  static override styles = [
    sharedStyles,
    css`
      td.text { width: 70%; }
      td.text button {
        border: none; background: transparent; padding: 0; text-align: left; font-size: 0.88rem; color: var(--ink); display: -webkit-box; width: 100%;
        -webkit-line-clamp: 3; -webkit-box-orient: vertical; overflow: hidden; overflow-wrap: anywhere;
      }
      td.text button:hover { color: var(--accent); }
      .theme { display: flex; gap: 0.35rem; align-items: center; font-size: 0.84rem; }
      .pager { justify-content: space-between; margin-top: 0.5rem; }
      tr.sel { background: #eaf3f9; }
    `,
  ];

  private get pageCount(): number {
    return Math.max(1, Math.ceil(this.positions.length / DOCS_PER_PAGE));
  }

  private get slice(): Uint32Array {
    const p = Math.min(this.page, this.pageCount - 1);
    return this.positions.subarray(p * DOCS_PER_PAGE, (p + 1) * DOCS_PER_PAGE);
  }

  protected override willUpdate(changed: PropertyValues<this>): void {
    if ((changed.has('positions') || changed.has('page') || changed.has('cache')) && this.cache) {
      const cache = this.cache;
      const slice = this.slice;
      void this.rows.run((signal) => cache.getMany(slice, signal));
    }
  }

  private emit(name: string, detail: unknown) {
    this.dispatchEvent(new CustomEvent(name, { detail, bubbles: true, composed: true }));
  }

  override render() {
    const slice = this.slice;
    const docs = this.rows.value;
    const page = Math.min(this.page, this.pageCount - 1);
    const d = this.data;
    return html`<section aria-label="Documents">
      <p class="small muted" aria-live="polite">${this.caption} ${this.positions.length.toLocaleString()} documents.</p>
      ${this.rows.status === TaskStatus.Error ? html`<sheaf-error-note .error=${this.rows.error} context="Could not load documents"></sheaf-error-note>` : nothing}
      <table>
        <thead><tr><th scope="col"><span class="visually-hidden">Select</span></th><th scope="col">Text</th><th scope="col">Theme</th><th scope="col" class="num">Silhouette</th></tr></thead>
        <tbody>
          ${Array.from(slice, (index, k) => {
            const doc = docs && docs.length === slice.length ? docs[k] : undefined;
            const t = d ? d.themeOf[index] : -1;
            const c = this.clusters[t];
            const on = !!this.selected?.[index];
            return html`<tr class=${on ? 'sel' : ''} data-doc=${d?.ids[index] ?? ''}>
              <td><input type="checkbox" aria-label="Select document ${d?.ids[index] ?? ''}" .checked=${on} @change=${(e: Event) => this.emit('toggle-select', { index, on: (e.target as HTMLInputElement).checked })} /></td>
              <td class="text"><button @click=${() => this.emit('open-doc', { index })}>${doc ? oneLine(doc.text) : '…'}</button></td>
              <td><span class="theme">${c ? html`<sheaf-swatch .themeStyle=${this.styles[t]}></sheaf-swatch>${themeLabel(c, t)}` : '—'}</span></td>
              <td class="num">${d ? fmt(Number.isNaN(d.silhouette[index]) ? null : d.silhouette[index], 2) : ''}</td>
            </tr>`;
          })}
        </tbody>
      </table>
      <div class="row pager">
        <button ?disabled=${page <= 0} @click=${() => this.emit('page-change', { page: page - 1 })}>← Previous</button>
        <span class="small muted">page ${page + 1} of ${this.pageCount}</span>
        <button ?disabled=${page >= this.pageCount - 1} @click=${() => this.emit('page-change', { page: page + 1 })}>Next →</button>
      </div>
    </section>`;
  }
}
customElements.define('sheaf-document-list', SheafDocumentList);
