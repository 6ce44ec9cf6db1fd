import { LitElement, css, html } from 'lit';
import { styleMap } from 'lit/directives/style-map.js';
import { heatColour } from '../lib/chart-helpers.js';
import { inkOn } from '../lib/palette.js';
import { sharedStyles } from '../lib/shared-styles.js';

/**
 * The confusion matrix as a heat map: rows are the true labels, columns the routed labels; each
 * cell shows its count and is shaded by its share of the row, with the diagonal outlined.
 */
export class SheafConfusionHeatmap extends LitElement {
  static override properties = { labels: { attribute: false }, matrix: { attribute: false } };
  labels: string[] = [];
  matrix: number[][] = [];
  static override styles = [
    sharedStyles,
    css`
      .wrap { overflow: auto; max-height: 520px; }
      table { width: auto; border-collapse: separate; border-spacing: 2px; font-size: 0.8rem; }
      th, td { border: none; padding: 0.25rem 0.4rem; }
      th.col { writing-mode: vertical-rl; transform: rotate(180deg); text-align: left; max-height: 9rem; white-space: nowrap; overflow: hidden; text-overflow: ellipsis; }
      th.rowh { text-align: right; white-space: nowrap; max-width: 12rem; overflow: hidden; text-overflow: ellipsis; }
      td { min-width: 2.6rem; text-align: center; font-variant-numeric: tabular-nums; border-radius: 3px; }
      td.diag { outline: 2px solid #1f2326; outline-offset: -2px; }
      .axis { font-size: 0.78rem; color: var(--muted); }
    `,
  ];

  override render() {
    const m = this.matrix;
    return html`<div class="wrap">
      <table aria-label="Confusion matrix: rows are the true labels, columns the labels the router chose">
        <thead>
          <tr><th class="axis">true ↓ / routed →</th>${this.labels.map((l) => html`<th class="col" scope="col" title=${l}>${l}</th>`)}</tr>
        </thead>
        <tbody>
          ${this.labels.map((l, r) => {
            const row = m[r] ?? [];
            const total = row.reduce((s, v) => s + v, 0) || 1;
            return html`<tr>
              <th class="rowh" scope="row" title=${l}>${l}</th>
              ${this.labels.map((_, c) => {
                const v = row[c] ?? 0;
                const bg = heatColour(v / total);
                return html`<td
                  class=${r === c ? 'diag' : ''}
                  title=${`${v} of ${total} “${l}” documents routed to “${this.labels[c]}”`}
                  style=${styleMap({ background: `rgb(${bg.join(',')})`, color: inkOn(bg) })}
                >${v}</td>`;
              })}
            </tr>`;
          })}
        </tbody>
      </table>
    </div>`;
  }
}
customElements.define('sheaf-confusion-heatmap', SheafConfusionHeatmap);
