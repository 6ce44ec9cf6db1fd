import { LitElement, css, html, svg } from 'lit';
import { themeStyle } from '../lib/palette.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt } from '../lib/ticks.js';
import './sheaf-swatch.js';

const S = 300, P = 46;

/**
 * One-versus-rest ROC curves, one per label (false-positive rate on x, true-positive rate on y),
 * with the chance diagonal and each label's AUC in the legend.
 */
export class SheafRocChart extends LitElement {
  static override properties = { curves: { attribute: false }, auc: { attribute: false } };
  curves: { label: string; points: [number, number][] }[] = [];
  /** AUC per label, shown in the legend. */
  auc: Record<string, number | null> = {};
  static override styles = [
    sharedStyles,
    css`
      .wrap { display: flex; gap: 1rem; flex-wrap: wrap; align-items: flex-start; }
      svg { width: 320px; max-width: 100%; height: auto; font: 10.5px var(--sans); }
      text { fill: var(--muted); }
      .frame { fill: none; stroke: var(--line-strong); }
      .chance { stroke: var(--line-strong); stroke-dasharray: 4 4; }
      ul { list-style: none; padding: 0; margin: 0; font-size: 0.84rem; max-height: 300px; overflow: auto; }
      li { display: flex; gap: 0.4rem; align-items: center; }
    `,
  ];

  override render() {
    const x = (v: number) => P + v * (S - P - 8);
    const y = (v: number) => S - P - v * (S - P - 8) + 8;
    const ticks = [0, 0.25, 0.5, 0.75, 1];
    return html`<div class="wrap">
      <svg viewBox="0 0 ${S} ${S}" role="img" aria-label="ROC curves, one per label">
        <rect class="frame" x=${x(0)} y=${y(1)} width=${x(1) - x(0)} height=${y(0) - y(1)} />
        <line class="chance" x1=${x(0)} y1=${y(0)} x2=${x(1)} y2=${y(1)} />
        ${ticks.map((t) => svg`<text x=${x(t)} y=${y(0) + 13} text-anchor="middle">${t}</text><text x=${x(0) - 5} y=${y(t) + 3.5} text-anchor="end">${t}</text>`)}
        <text x=${(x(0) + x(1)) / 2} y=${S - 4} text-anchor="middle">false-positive rate (1 − specificity)</text>
        <text x="10" y=${(y(0) + y(1)) / 2} text-anchor="middle" transform=${`rotate(-90 10 ${(y(0) + y(1)) / 2})`}>true-positive rate (recall)</text>
        ${this.curves.map((c, i) => {
          const st = themeStyle(i);
          const pts = [...c.points].sort((a, b) => a[0] - b[0] || a[1] - b[1]);
          return svg`<polyline fill="none" stroke=${st.color} stroke-width="1.8" stroke-dasharray=${i >= 8 ? '5 3' : ''} points=${pts.map(([f, t]) => `${x(f)},${y(t)}`).join(' ')}><title>${c.label}</title></polyline>`;
        })}
      </svg>
      <ul aria-label="ROC legend">
        ${this.curves.map((c, i) => html`<li><sheaf-swatch .themeStyle=${themeStyle(i)}></sheaf-swatch>${c.label} <span class="muted">AUC ${fmt(this.auc[c.label] ?? null, 3)}</span></li>`)}
      </ul>
    </div>`;
  }
}
customElements.define('sheaf-roc-chart', SheafRocChart);
