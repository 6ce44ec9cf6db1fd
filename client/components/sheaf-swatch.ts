import { LitElement, css, svg } from 'lit';
import type { ThemeStyle } from '../lib/palette.js';

/** A theme's colour and marker shape as drawn on the map, for legends and lists. */
export class SheafSwatch extends LitElement {
  static override properties = { themeStyle: { attribute: false } };
  /** The style to show. */
  themeStyle: ThemeStyle | null = null;
  static override styles = css`
    :host { display: inline-block; width: 14px; height: 14px; flex: none; vertical-align: middle; }
    svg { width: 100%; height: 100%; display: block; }
  `;

  override render() {
    const s = this.themeStyle;
    if (!s) return svg``;
    const c = s.color;
    let shape;
    switch (s.marker) {
      case 'dot':
        shape = svg`<rect x="2" y="2" width="10" height="10" rx="1.5" fill=${c} />`;
        break;
      case 'ring':
        shape = svg`<rect x="2.5" y="2.5" width="9" height="9" fill="none" stroke=${c} stroke-width="2" />`;
        break;
      case 'cross':
        shape = svg`<path d="M1 7 H13 M7 1 V13" stroke=${c} stroke-width="2.4" />`;
        break;
      case 'diamond':
        shape = svg`<path d="M7 0.5 L13.5 7 L7 13.5 L0.5 7 Z" fill=${c} />`;
        break;
    }
    return svg`<svg viewBox="0 0 14 14" aria-hidden="true">${shape}</svg>`;
  }
}
customElements.define('sheaf-swatch', SheafSwatch);
