import { LitElement, css, html, nothing, svg } from 'lit';
import { sharedStyles } from '../lib/shared-styles.js';
import { fmt, niceTicks } from '../lib/ticks.js';

const W = 420, H = 200, L = 46, R = 14, T = 14, B = 34;

/**
 * Mean silhouette for each number of themes tried, with the chosen number marked, so people can
 * see whether the choice was clear-cut or a near tie.
 */
export class SheafSilhouetteChart extends LitElement {
  static override properties = { byK: { attribute: false }, reference: { attribute: false }, chosen: { type: Number } };
  /** Mean silhouette per k (keys are k as text, as in the API). */
  byK: Record<string, number> | null = null;
  /** The same on a shuffled copy of the documents: what k-means finds where there is nothing to find. */
  reference: Record<string, number> | null = null;
  /** The k the analysis used. */
  chosen = 0;
  static override styles = [
    sharedStyles,
    css`
      svg { width: 100%; max-width: 520px; height: auto; display: block; font: 11px var(--sans); }
      .axis { stroke: var(--line-strong); }
      .grid { stroke: var(--line); stroke-dasharray: 2 3; }
      .line { fill: none; stroke: var(--accent); stroke-width: 2; }
      .ref { fill: none; stroke: var(--muted); stroke-width: 1.5; stroke-dasharray: 5 4; }
      .pt { fill: var(--surface); stroke: var(--accent); stroke-width: 1.5; }
      .chosen { fill: #D55E00; stroke: #D55E00; }
      text { fill: var(--muted); }
      .lbl { fill: var(--ink); font-weight: 600; }
    `,
  ];

  override render() {
    const pts = Object.entries(this.byK ?? {})
      .map(([k, s]) => [Number(k), s] as const)
      .filter(([k, s]) => Number.isFinite(k) && Number.isFinite(s))
      .sort((a, b) => a[0] - b[0]);
    if (pts.length < 2) return html`<p class="muted small">Only one number of themes was tried, so there is no curve to show.</p>`;
    const ref = Object.entries(this.reference ?? {})
      .map(([k, s]) => [Number(k), s] as const)
      .filter(([k, s]) => Number.isFinite(k) && Number.isFinite(s))
      .sort((a, b) => a[0] - b[0]);
    const kMin = pts[0][0], kMax = pts[pts.length - 1][0];
    const all = [...pts, ...ref].map((p) => p[1]);
    const ys = niceTicks(Math.min(0, ...all), Math.max(...all), 4);
    const yLo = ys[0], yHi = ys[ys.length - 1];
    const px = (k: number) => L + (kMax === kMin ? (W - L - R) / 2 : ((k - kMin) / (kMax - kMin)) * (W - L - R));
    const py = (s: number) => T + (1 - (s - yLo) / (yHi - yLo || 1)) * (H - T - B);
    const xt = niceTicks(kMin, kMax, Math.min(8, pts.length)).filter((k) => Number.isInteger(k) && k >= kMin && k <= kMax);
    const best = pts.find((p) => p[0] === this.chosen);
    const summary = pts.map(([k, s]) => `k ${k}: ${fmt(s, 3)}`).join(', ');
    return html`<figure>
      <svg viewBox="0 0 ${W} ${H}" role="img" aria-label=${`Mean silhouette by number of themes. ${summary}. Chosen: ${this.chosen}.`}>
        ${ys.map((y) => svg`<line class="grid" x1=${L} x2=${W - R} y1=${py(y)} y2=${py(y)} /><text x=${L - 6} y=${py(y) + 3.5} text-anchor="end">${y.toFixed(2)}</text>`)}
        <line class="axis" x1=${L} x2=${W - R} y1=${H - B} y2=${H - B} />
        ${xt.map((k) => svg`<text x=${px(k)} y=${H - B + 14} text-anchor="middle">${k}</text>`)}
        <text x=${(L + W - R) / 2} y=${H - 4} text-anchor="middle">number of themes (k)</text>
        <text x="11" y=${(T + H - B) / 2} text-anchor="middle" transform=${`rotate(-90 11 ${(T + H - B) / 2})`}>mean silhouette</text>
        ${ref.length ? svg`<polyline class="ref" points=${ref.map(([k, s]) => `${px(k)},${py(s)}`).join(' ')} />` : nothing}
        <polyline class="line" points=${pts.map(([k, s]) => `${px(k)},${py(s)}`).join(' ')} />
        ${pts.map(([k, s]) => svg`<circle class=${k === this.chosen ? 'pt chosen' : 'pt'} cx=${px(k)} cy=${py(s)} r=${k === this.chosen ? 5 : 3}><title>k = ${k}: ${fmt(s, 3)}</title></circle>`)}
        ${best ? svg`<text class="lbl" x=${px(best[0])} y=${py(best[1]) - 9} text-anchor="middle">k = ${best[0]}</text>` : nothing}
      </svg>
      ${ref.length ? html`<figcaption class="small muted">Solid: your documents. Dashed: a shuffled copy of them with no themes in it, the yardstick for choosing k.</figcaption>` : nothing}
    </figure>`;
  }
}
customElements.define('sheaf-silhouette-chart', SheafSilhouetteChart);
