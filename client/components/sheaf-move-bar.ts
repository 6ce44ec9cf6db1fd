import { LitElement, css, html } from 'lit';
import type { Cluster } from '../api/types.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { themeLabel } from '../lib/theme-label.js';

/**
 * Shown while documents are selected (on the map or in the list): how many, and a control that
 * moves them all to one theme. Sends `move-selected` `{clusterId}` and `clear-selection`.
 */
export class SheafMoveBar extends LitElement {
  static override properties = { count: { type: Number }, clusters: { attribute: false }, busy: { type: Boolean }, target: { state: true } };
  count = 0;
  clusters: Cluster[] = [];
  busy = false;
  target = '';

  static override styles = [
    sharedStyles,
    css`
      .movebar { background: #eaf3f9; border: 1px solid #b8d5e8; border-radius: var(--radius); padding: 0.45rem 0.7rem; }
    `,
  ];

  override render() {
    return html`<div class="movebar row" role="group" aria-label="Selected documents">
      <span><b>${this.count.toLocaleString()}</b> selected</span>
      <label for="mv">move to</label>
      <select id="mv" @change=${(e: Event) => (this.target = (e.target as HTMLSelectElement).value)}>
        <option value="" ?selected=${!this.target}>choose a theme…</option>
        ${this.clusters.map((c, i) => html`<option value=${c.id} ?selected=${this.target === c.id}>${themeLabel(c, i)}</option>`)}
      </select>
      <button class="primary" ?disabled=${!this.target || this.busy} @click=${() => this.dispatchEvent(new CustomEvent('move-selected', { detail: { clusterId: this.target } }))}>Move</button>
      <button class="quiet" @click=${() => this.dispatchEvent(new CustomEvent('clear-selection'))}>Clear selection</button>
    </div>`;
  }
}
customElements.define('sheaf-move-bar', SheafMoveBar);
