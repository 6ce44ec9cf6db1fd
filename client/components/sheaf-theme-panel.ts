import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import type { DocumentCache } from '../api/document-cache.js';
import type { Cluster, DocumentItem } from '../api/types.js';
import { TaskController, TaskStatus } from '../controllers/task-controller.js';
import { misfitsOf, type MapData } from '../lib/map-data.js';
import type { ThemeStyle } from '../lib/palette.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import { themeLabel } from '../lib/theme-label.js';
import './sheaf-swatch.js';
import './sheaf-error-note.js';

/** Misfits listed per theme. */
const MISFITS_SHOWN = 12;

interface Loaded {
  reps: { index: number; doc: DocumentItem | undefined }[];
  misfits: { index: number; doc: DocumentItem | undefined; silhouette: number }[];
}

function snippet(text: string, n = 220): string {
  const t = text.replace(/\s+/g, ' ').trim();
  return t.length > n ? `${t.slice(0, n - 1)}…` : t;
}

/**
 * Everything about one theme: its name (renamed in place), size, silhouette, distinctive terms,
 * representative documents and misfits (documents with a negative silhouette). Sends `rename`
 * `{clusterId, name}` and `open-doc` `{index}`.
 */
export class SheafThemePanel extends LitElement {
  static override properties = {
    cluster: { attribute: false },
    position: { type: Number },
    themeStyle: { attribute: false },
    data: { attribute: false },
    cache: { attribute: false },
    busy: { type: Boolean },
    draft: { state: true },
  };
  cluster: Cluster | null = null;
  position = 0;
  themeStyle: ThemeStyle | null = null;
  data: MapData | null = null;
  cache: DocumentCache | null = null;
  busy = false;
  draft: string | null = null;
  private docs = new TaskController<Loaded>(this);

  static override styles = [
    sharedStyles,
    css`
      .head { display: flex; gap: 0.5rem; align-items: center; }
      .name { flex: 1; font-size: 1.05rem; font-weight: 620; border: 1px solid transparent; background: transparent; padding: 0.2rem 0.35rem; }
      .name:hover, .name:focus { border-color: var(--line-strong); background: var(--surface); }
      .facts { display: flex; gap: 1.2rem; font-size: 0.88rem; color: var(--muted); }
      .facts b { color: var(--ink); font-variant-numeric: tabular-nums; }
      .terms { display: flex; flex-wrap: wrap; gap: 0.3rem; margin: 0; padding: 0; list-style: none; }
      .terms li { background: var(--paper); border: 1px solid var(--line); border-radius: 999px; padding: 0.05rem 0.55rem; font-size: 0.84rem; }
      ol.docs { margin: 0; padding: 0; list-style: none; }
      ol.docs li + li { border-top: 1px solid var(--line); }
      ol.docs button { display: block; width: 100%; text-align: left; border: none; background: transparent; padding: 0.4rem 0.2rem; font-size: 0.86rem; border-radius: 0; }
      ol.docs button:hover { background: var(--paper); }
      .sil { float: right; margin-left: 0.5rem; color: var(--bad-ink); font-variant-numeric: tabular-nums; }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('cluster') && (changed.get('cluster') as Cluster | null | undefined)?.id !== this.cluster?.id) this.draft = null;
    if ((changed.has('cluster') || changed.has('data') || changed.has('cache')) && this.cluster && this.data && this.cache) {
      const c = this.cluster, data = this.data, cache = this.cache, pos = this.position;
      void this.docs.run(async (signal) => {
        const repIdx = c.representativeIds.map((id) => data.indexOf.get(id)).filter((i): i is number => i !== undefined);
        const mis = misfitsOf(data, pos, MISFITS_SHOWN);
        const all = await cache.getMany([...repIdx, ...mis], signal);
        return {
          reps: repIdx.map((index, k) => ({ index, doc: all[k] })),
          misfits: Array.from(mis, (index, k) => ({ index, doc: all[repIdx.length + k], silhouette: data.silhouette[index] })),
        };
      });
    }
  }

  private save() {
    const c = this.cluster;
    if (!c || this.draft === null) return;
    const name = this.draft.trim();
    if (name === (c.name ?? '')) {
      this.draft = null;
      return;
    }
    if (!name) return;
    this.dispatchEvent(new CustomEvent('rename', { detail: { clusterId: c.id, name }, bubbles: true, composed: true }));
    this.draft = null;
  }

  private open(index: number) {
    this.dispatchEvent(new CustomEvent('open-doc', { detail: { index }, bubbles: true, composed: true }));
  }

  private docList(items: { index: number; doc: DocumentItem | undefined; silhouette?: number }[], label: string) {
    return html`<ol class="docs" aria-label=${label}>
      ${items.map(
        (r) => html`<li>
          <button @click=${() => this.open(r.index)}>
            ${r.silhouette !== undefined ? html`<span class="sil" title="silhouette">${fmt(r.silhouette, 3)}</span>` : nothing}
            <span class="doc-text">${r.doc ? snippet(r.doc.text) : '…'}</span>
          </button>
        </li>`,
      )}
    </ol>`;
  }

  override render() {
    const c = this.cluster;
    if (!c) return html`<p class="muted small">Choose a theme in the list or on the map to see its words and documents.</p>`;
    const loaded = this.docs.value;
    const misfitTotal = this.data ? misfitsOf(this.data, this.position, Number.MAX_SAFE_INTEGER).length : 0;
    return html`<section class="stack" aria-label="Selected theme">
      <div class="head">
        <sheaf-swatch .themeStyle=${this.themeStyle}></sheaf-swatch>
        <input
          class="name"
          aria-label="Theme name (Enter saves)"
          placeholder=${themeLabel(c, this.position)}
          .value=${this.draft ?? c.name ?? ''}
          ?disabled=${this.busy}
          @input=${(e: Event) => (this.draft = (e.target as HTMLInputElement).value)}
          @keydown=${(e: KeyboardEvent) => {
            if (e.key === 'Enter') this.save();
            if (e.key === 'Escape') this.draft = null;
          }}
        />
        ${this.draft !== null ? html`<button class="primary" ?disabled=${this.busy || !this.draft.trim()} @click=${this.save}>Save name</button>` : nothing}
      </div>
      <div class="facts">
        <span><b>${c.size.toLocaleString()}</b> documents</span>
        <span>silhouette <b>${fmt(c.silhouette, 3)}</b></span>
        <span><b>${misfitTotal}</b> misfits</span>
      </div>
      ${c.noContent ? html`<div class="note info small">These documents had no usable words after stop words were removed, so they could not be placed by content.</div>` : nothing}
      <div>
        <h4>Distinctive words</h4>
        <ul class="terms">${c.terms.map((t) => html`<li>${t}</li>`)}</ul>
      </div>
      <div>
        <h4>Representative documents</h4>
        ${this.docs.status === TaskStatus.Error ? html`<sheaf-error-note .error=${this.docs.error}></sheaf-error-note>` : nothing}
        ${loaded ? this.docList(loaded.reps, 'Representative documents') : html`<p class="muted small">Loading…</p>`}
      </div>
      <div>
        <h4>Misfits <span class="small">(closer to another theme than to this one)</span></h4>
        ${loaded && loaded.misfits.length === 0 ? html`<p class="muted small">None: every document sits closer to this theme than to any other.</p>` : nothing}
        ${loaded && loaded.misfits.length ? this.docList(loaded.misfits, 'Misfits') : nothing}
        ${misfitTotal > MISFITS_SHOWN ? html`<p class="small muted">Showing the ${MISFITS_SHOWN} worst of ${misfitTotal}.</p>` : nothing}
      </div>
    </section>`;
  }
}
customElements.define('sheaf-theme-panel', SheafThemePanel);
