import { LitElement, css, html, nothing, svg } from 'lit';
import { nearestThresholdPoint, type ThresholdPoint } from '../lib/chart-helpers.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { pct } from '../lib/ticks.js';

const W = 420, H = 220, L = 40, R = 12, T = 12, B = 36;

/**
 * The abstain threshold's trade-off from cross-validation: as the threshold rises, the router
 * answers fewer messages (coverage falls) and is right more often on those it answers (precision
 * rises). The router's threshold is marked; a slider reads off other points.
 */
export class SheafThresholdChart extends LitElement {
  static override properties = { curve: { attribute: false }, current: { type: Number }, target: { type: Number }, probe: { state: true } };
  curve: ThresholdPoint[] = [];
  /** The router's abstain threshold. */
  current = NaN;
  /** The precision it was chosen for. */
  target = NaN;
  probe = NaN;
  static override styles = [
    sharedStyles,
    css`
      svg { width: 100%; max-width: 520px; height: auto; display: block; font: 10.5px var(--sans); }
      text { fill: var(--muted); }
      .grid { stroke: var(--line); stroke-dasharray: 2 3; }
      .prec { fill: none; stroke: #0072B2; stroke-width: 2; }
      .cov { fill: none; stroke: #E69F00; stroke-width: 2; stroke-dasharray: 6 3; }
      .cur { stroke: #1f2326; stroke-width: 1.5; }
      .tgt { stroke: #0072B2; stroke-width: 1; stroke-dasharray: 2 2; }
      .probe { stroke: #D55E00; stroke-width: 1.2; }
      .key { display: flex; gap: 1rem; font-size: 0.84rem; flex-wrap: wrap; }
      .key i { display: inline-block; width: 18px; height: 0; border-top: 2px solid; vertical-align: middle; margin-right: 0.3rem; }
      .kp { border-color: #0072B2; }
      .kc { border-color: #E69F00; border-top-style: dashed !important; }
      text.curl { fill: #1f2326; }
      input[type='range'] { width: 100%; max-width: 520px; accent-color: var(--accent); }
    `,
  ];

  override render() {
    const pts = [...this.curve].filter((p) => Number.isFinite(p.threshold)).sort((a, b) => a.threshold - b.threshold);
    if (pts.length === 0) return html`<p class="muted small">No trade-off curve was reported for this router.</p>`;
    const x = (t: number) => L + t * (W - L - R);
    const y = (v: number) => T + (1 - v) * (H - T - B);
    const probeT = Number.isFinite(this.probe) ? this.probe : this.current;
    const at = Number.isFinite(probeT) ? nearestThresholdPoint(pts, probeT) : null;
    return html`
      <div class="key"><span><i class="kp"></i>precision of answered messages</span><span><i class="kc"></i>coverage (share answered)</span></div>
      <svg viewBox="0 0 ${W} ${H}" role="img" aria-label="Precision and coverage by abstain threshold">
        ${[0, 0.25, 0.5, 0.75, 1].map((v) => svg`<line class="grid" x1=${L} x2=${W - R} y1=${y(v)} y2=${y(v)} /><text x=${L - 5} y=${y(v) + 3.5} text-anchor="end">${v}</text><text x=${x(v)} y=${H - B + 13} text-anchor="middle">${v}</text>`)}
        <text x=${(L + W - R) / 2} y=${H - 4} text-anchor="middle">abstain threshold (confidence needed to answer)</text>
        ${Number.isFinite(this.target) ? svg`<line class="tgt" x1=${L} x2=${W - R} y1=${y(this.target)} y2=${y(this.target)}><title>target precision ${pct(this.target)}</title></line>` : nothing}
        <polyline class="prec" points=${pts.map((p) => `${x(p.threshold)},${y(p.precision)}`).join(' ')} />
        <polyline class="cov" points=${pts.map((p) => `${x(p.threshold)},${y(p.coverage)}`).join(' ')} />
        ${Number.isFinite(this.current) ? svg`<line class="cur" x1=${x(this.current)} x2=${x(this.current)} y1=${T} y2=${H - B}><title>router threshold</title></line><text class="curl" x=${x(this.current) + 4} y=${T + 10}>router</text>` : nothing}
        ${Number.isFinite(this.probe) ? svg`<line class="probe" x1=${x(this.probe)} x2=${x(this.probe)} y1=${T} y2=${H - B} />` : nothing}
      </svg>
      <label for="probe">Explore another threshold</label>
      <input id="probe" type="range" min="0" max="1" step="0.01" .value=${String(Number.isFinite(probeT) ? probeT : 0.5)} @input=${(e: Event) => (this.probe = Number((e.target as HTMLInputElement).value))} />
      ${at
        ? html`<p class="small" aria-live="polite">At a threshold of ${at.threshold.toFixed(2)} the router answers <b>${pct(at.coverage)}</b> of messages and is right on <b>${pct(at.precision)}</b> of those; the rest go to a person.</p>`
        : nothing}
    `;
  }
}
customElements.define('sheaf-threshold-chart', SheafThresholdChart);
