import { LitElement, css, html } from 'lit';
import type { LabelMeasures } from '../api/types.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';

/**
 * Per-label measures from cross-validation: precision, recall (sensitivity), specificity, F1,
 * support and AUC, with the weakest F1 values flagged so problem labels stand out.
 */
export class SheafLabelTable extends LitElement {
  static override properties = { rows: { attribute: false } };
  rows: LabelMeasures[] = [];
  static override styles = [
    sharedStyles,
    css`
      .weak { color: var(--bad-ink); font-weight: 600; }
      .wrap { overflow: auto; }
    `,
  ];

  override render() {
    return html`<div class="wrap"><table aria-label="Measures per label">
      <thead>
        <tr>
          <th scope="col">Label</th>
          <th scope="col" class="num" title="Of the messages routed here, the share that belonged here">Precision</th>
          <th scope="col" class="num" title="Of the messages that belong here, the share routed here (sensitivity)">Recall</th>
          <th scope="col" class="num" title="Of the messages that do not belong here, the share kept away">Specificity</th>
          <th scope="col" class="num" title="Harmonic mean of precision and recall">F1</th>
          <th scope="col" class="num" title="Messages with this label">Support</th>
          <th scope="col" class="num" title="Area under the ROC curve">AUC</th>
        </tr>
      </thead>
      <tbody>
        ${this.rows.map(
          (r) => html`<tr>
            <td>${r.label}</td>
            <td class="num">${fmt(r.precision, 3)}</td>
            <td class="num">${fmt(r.recall, 3)}</td>
            <td class="num">${fmt(r.specificity ?? null, 3)}</td>
            <td class="num ${r.f1 < 0.6 ? 'weak' : ''}">${fmt(r.f1, 3)}</td>
            <td class="num">${r.support.toLocaleString()}</td>
            <td class="num">${fmt(r.auc, 3)}</td>
          </tr>`,
        )}
      </tbody>
    </table></div>`;
  }
}
customElements.define('sheaf-label-table', SheafLabelTable);
