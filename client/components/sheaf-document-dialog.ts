import { LitElement, css, html, nothing } from 'lit';
import type { Cluster, DocumentItem } from '../api/types.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import { themeLabel } from '../lib/theme-label.js';

/**
 * One document in full, in a modal dialog: its text (always as text), id, theme, silhouette and
 * other fields, and a control to move it to another theme (`move` `{documentIds, clusterId}`).
 */
export class SheafDocumentDialog extends LitElement {
  static override properties = {
    doc: { attribute: false },
    themePos: { type: Number },
    silhouette: { type: Number },
    clusters: { attribute: false },
    busy: { type: Boolean },
    target: { state: true },
  };
  doc: DocumentItem | null = null;
  themePos = -1;
  silhouette = NaN;
  clusters: Cluster[] = [];
  busy = false;
  target = '';

  static override styles = [
    sharedStyles,
    css`
      dialog { border: 1px solid var(--line); border-radius: 12px; padding: 1.1rem 1.3rem; width: min(46rem, 92vw); max-height: 86vh; color: var(--ink); }
      dialog::backdrop { background: rgba(31, 35, 38, 0.35); }
      .body { max-height: 46vh; overflow: auto; background: var(--paper); padding: 0.7rem 0.8rem; border-radius: var(--radius); }
      dl { display: grid; grid-template-columns: max-content 1fr; gap: 0.2rem 0.8rem; font-size: 0.86rem; margin: 0.6rem 0; }
      dt { color: var(--muted); }
      dd { margin: 0; overflow-wrap: anywhere; }
    `,
  ];

  /** Opens the dialog (after `doc` is set). */
  open(): void {
    this.target = '';
    void this.updateComplete.then(() => {
      const d = this.renderRoot.querySelector('dialog');
      if (d && !d.open) d.showModal();
    });
  }

  /** Closes the dialog. */
  close(): void {
    this.renderRoot.querySelector('dialog')?.close();
  }

  private move() {
    if (!this.doc || !this.target) return;
    this.dispatchEvent(new CustomEvent('move', { detail: { documentIds: [this.doc.id], clusterId: this.target }, bubbles: true, composed: true }));
  }

  override render() {
    const d = this.doc;
    const c = this.clusters[this.themePos];
    return html`<dialog aria-label="Document" @close=${() => this.dispatchEvent(new CustomEvent('dialog-closed'))}>
      ${d
        ? html`
            <div class="row spread"><h3>Document ${d.id}</h3><button class="quiet" @click=${this.close} aria-label="Close">Close ✕</button></div>
            <div class="body doc-text" data-role="document-text">${d.text}</div>
            <dl>
              <dt>Theme</dt><dd>${c ? themeLabel(c, this.themePos) : '—'}</dd>
              <dt>Silhouette</dt><dd>${fmt(Number.isNaN(this.silhouette) ? null : this.silhouette, 3)}</dd>
              ${Object.entries(d.meta ?? {}).map(([k, v]) => html`<dt>${k}</dt><dd>${typeof v === 'string' ? v : JSON.stringify(v)}</dd>`)}
            </dl>
            <div class="row">
              <label for="to">Move to</label>
              <select id="to" @change=${(e: Event) => (this.target = (e.target as HTMLSelectElement).value)}>
                <option value="" ?selected=${this.target === ''}>choose a theme…</option>
                ${this.clusters.map((k, i) => (i === this.themePos ? nothing : html`<option value=${k.id} ?selected=${this.target === k.id}>${themeLabel(k, i)}</option>`))}
              </select>
              <button class="primary" ?disabled=${!this.target || this.busy} @click=${this.move}>Move</button>
            </div>
          `
        : nothing}
    </dialog>`;
  }
}
customElements.define('sheaf-document-dialog', SheafDocumentDialog);
