import { LitElement, css, html, nothing } from 'lit';
import type { Cluster } from '../api/types.js';
import type { ThemeStyle } from '../lib/palette.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import { themeLabel } from '../lib/theme-label.js';
import './sheaf-swatch.js';

/**
 * The legend of the map and the list of themes: colour and marker, name, size and silhouette.
 * Choosing a row selects the theme (`theme-select` `{id|null}`); ticking two or more and
 * pressing merge sends `merge` `{clusterIds, name}`.
 */
export class SheafThemeList extends LitElement {
  static override properties = {
    clusters: { attribute: false },
    styles: { attribute: false },
    selectedId: { type: String },
    busy: { type: Boolean },
    checked: { state: true },
    mergeName: { state: true },
  };
  clusters: Cluster[] = [];
  styles: ThemeStyle[] = [];
  selectedId: string | null = null;
  busy = false;
  checked: Set<string> = new Set();
  mergeName = '';

  static override styles = [
    sharedStyles,
    css`
      ul { list-style: none; margin: 0; padding: 0; max-height: 46vh; overflow: auto; }
      li { display: flex; align-items: center; gap: 0.45rem; padding: 0.2rem 0.25rem; border-radius: var(--radius); }
      li.on { background: var(--accent-soft); }
      li button.pick { flex: 1; min-width: 0; text-align: left; border: none; background: transparent; padding: 0.25rem 0.2rem; display: flex; gap: 0.5rem; align-items: center; }
      .label { flex: 1; min-width: 0; overflow: hidden; text-overflow: ellipsis; white-space: nowrap; }
      .label.unnamed { color: var(--muted); font-style: italic; }
      .size { font-variant-numeric: tabular-nums; color: var(--muted); font-size: 0.82rem; }
      .merge { margin-top: 0.6rem; }
      .merge input { flex: 1; min-width: 8rem; }
    `,
  ];

  private toggle(id: string, on: boolean) {
    const next = new Set(this.checked);
    if (on) next.add(id);
    else next.delete(id);
    this.checked = next;
  }

  private select(id: string) {
    this.dispatchEvent(new CustomEvent('theme-select', { detail: { id: id === this.selectedId ? null : id }, bubbles: true, composed: true }));
  }

  private merge() {
    const ids = this.clusters.map((c) => c.id).filter((id) => this.checked.has(id));
    if (ids.length < 2) return;
    this.dispatchEvent(new CustomEvent('merge', { detail: { clusterIds: ids, name: this.mergeName.trim() }, bubbles: true, composed: true }));
  }

  /** Clears the ticks (after a merge went through). */
  clearChecks(): void {
    this.checked = new Set();
    this.mergeName = '';
  }

  override render() {
    const total = this.clusters.reduce((s, c) => s + c.size, 0) || 1;
    const n = [...this.checked].filter((id) => this.clusters.some((c) => c.id === id)).length;
    return html`
      <ul aria-label="Themes">
        ${this.clusters.map((c, i) => {
          const named = !!(c.name && c.name.trim());
          return html`<li class=${c.id === this.selectedId ? 'on' : ''} data-theme=${c.id}>
            <input type="checkbox" aria-label=${`Tick ${themeLabel(c, i)} for merging`} .checked=${this.checked.has(c.id)} @change=${(e: Event) => this.toggle(c.id, (e.target as HTMLInputElement).checked)} />
            <button class="pick" aria-pressed=${c.id === this.selectedId ? 'true' : 'false'} @click=${() => this.select(c.id)}>
              <sheaf-swatch .themeStyle=${this.styles[i]}></sheaf-swatch>
              <span class="label ${named ? '' : 'unnamed'}">${themeLabel(c, i)}</span>
              <span class="size" title=${`${c.size} documents, silhouette ${fmt(c.silhouette, 2)}`}>${c.size.toLocaleString()} · ${((c.size / total) * 100).toFixed(0)}%</span>
            </button>
          </li>`;
        })}
      </ul>
      ${n >= 2
        ? html`<div class="merge row">
            <input aria-label="Name of the merged theme (optional)" placeholder="name (optional)" .value=${this.mergeName} @input=${(e: Event) => (this.mergeName = (e.target as HTMLInputElement).value)} />
            <button class="primary" ?disabled=${this.busy} @click=${this.merge}>Merge ${n} themes</button>
          </div>`
        : n === 1
          ? html`<p class="small muted merge">Tick one more theme to merge.</p>`
          : nothing}
    `;
  }
}
customElements.define('sheaf-theme-list', SheafThemeList);
