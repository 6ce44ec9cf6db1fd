import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { styleMap } from 'lit/directives/style-map.js';
import type { ThemeStyle } from '../lib/palette.js';
import { bucketByStyle } from '../lib/point-buckets.js';
import { paintPoints, styleColours } from '../lib/paint-points.js';
import { PointGrid } from '../lib/point-grid.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { ViewTransform } from '../lib/view-transform.js';

/** What a drag on the map does. */
export type DragMode = 'pan' | 'box' | 'lasso';

/** Hover radius in CSS pixels (common practice: a fingertip is larger, a mouse pointer needs a few pixels). */
const HOVER_PX = 7;

/**
 * A canvas scatter plot of every document, smooth with 50,000 points: coordinates in typed
 * arrays, points bucketed by style so each style is one path per frame, a uniform grid for hover
 * hit-tests and area selection, and redraws only on animation frames after a change.
 *
 * Events: `point-hover` `{index}` (-1 when leaving), `point-open` `{index}` on click or Enter,
 * `points-select` `{indices: Uint32Array, add: boolean}` after a box or lasso.
 */
export class SheafScatterMap extends LitElement {
  static override properties = {
    xs: { attribute: false },
    ys: { attribute: false },
    styleOf: { attribute: false },
    styles: { attribute: false },
    matchMask: { attribute: false },
    selected: { attribute: false },
    focusStyle: { type: Number },
    hoverText: { type: String },
    mode: { state: true },
    hovered: { state: true },
  };
  /** x of each point (data space). */
  xs = new Float32Array(0);
  /** y of each point. */
  ys = new Float32Array(0);
  /** Style index of each point (into `styles`). */
  styleOf = new Int32Array(0);
  /** Draw styles. */
  styles: ThemeStyle[] = [];
  /** 1 for points matching the text search (null: no search). */
  matchMask: Uint8Array | null = null;
  /** 1 for selected points. */
  selected: Uint8Array | null = null;
  /** Style index to bring forward (others dim), or -1. */
  focusStyle = -1;
  /** Snippet of the hovered document, supplied by the page. */
  hoverText = '';
  mode: DragMode = 'pan';
  hovered = -1;

  private canvas: HTMLCanvasElement | null = null;
  private image: ImageData | null = null;
  private pixels = new Uint32Array(0);
  /** Packed pixel colour of each style, full and dimmed (when another theme is in focus). */
  private colours: { full: Uint32Array; dim: Uint32Array } | null = null;
  private readonly view = new ViewTransform();
  private grid: PointGrid | null = null;
  private buckets: { order: Uint32Array; start: Uint32Array } | null = null;
  private frame = 0;
  private drag: { x: number; y: number; moved: boolean; poly: number[] } | null = null;
  private pointer = { x: 0, y: 0 };
  private resize: ResizeObserver | null = null;
  private fitted = false;
  /** Frames drawn so far (read by tests and the bench to see that drawing happens). */
  framesDrawn = 0;
  /** Milliseconds the last frame's drawing took. */
  lastFrameMs = 0;

  static override styles = [
    sharedStyles,
    css`
      :host { position: relative; display: block; min-height: 420px; }
      .wrap { position: relative; width: 100%; height: 100%; min-height: 420px; border-radius: 10px; overflow: hidden; background: #fcfcfa; border: 1px solid var(--line); }
      canvas { display: block; width: 100%; height: 100%; touch-action: none; cursor: grab; }
      canvas.box, canvas.lasso { cursor: crosshair; }
      .tools { position: absolute; top: 0.5rem; left: 0.5rem; display: flex; gap: 0.25rem; background: rgba(255, 255, 255, 0.92); padding: 0.25rem; border-radius: 8px; border: 1px solid var(--line); }
      .tools button { padding: 0.25rem 0.55rem; font-size: 0.82rem; }
      .tools button[aria-pressed='true'] { background: var(--accent); color: #fff; border-color: var(--accent); }
      .tip {
        position: absolute; pointer-events: none; max-width: 22rem; padding: 0.45rem 0.6rem; background: #1f2326; color: #f6f5f1;
        font-size: 0.82rem; border-radius: 6px; box-shadow: 0 4px 14px rgba(0, 0, 0, 0.18); white-space: pre-wrap; overflow-wrap: anywhere;
      }
      .hint { position: absolute; bottom: 0.4rem; right: 0.6rem; font-size: 0.78rem; color: var(--muted); background: rgba(255, 255, 255, 0.85); padding: 0.1rem 0.4rem; border-radius: 4px; }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('xs') || changed.has('ys')) {
      this.grid = this.xs.length === this.ys.length ? new PointGrid(this.xs, this.ys) : null;
      if (!changed.get('xs') || (changed.get('xs') as Float32Array | undefined)?.length !== this.xs.length) this.fitted = false;
    }
    if (changed.has('styleOf') || changed.has('styles')) {
      this.buckets = this.styles.length > 0 && this.styleOf.length === this.xs.length ? bucketByStyle(this.styleOf, this.styles.length) : null;
      this.colours = styleColours(this.styles);
    }
  }

  protected override updated(): void {
    this.schedule();
  }

  override firstUpdated(): void {
    this.canvas = this.renderRoot.querySelector('canvas');
    this.resize = new ResizeObserver(() => this.schedule());
    this.resize.observe(this.canvas!);
  }

  override disconnectedCallback(): void {
    this.resize?.disconnect();
    cancelAnimationFrame(this.frame);
    this.frame = 0;
    super.disconnectedCallback();
  }

  /** Frames all points in the view. */
  resetView(): void {
    this.fitted = false;
    this.schedule();
  }

  private fit(): void {
    const n = this.xs.length;
    if (n === 0) return;
    let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity;
    for (let i = 0; i < n; i++) {
      minX = Math.min(minX, this.xs[i]);
      maxX = Math.max(maxX, this.xs[i]);
      minY = Math.min(minY, this.ys[i]);
      maxY = Math.max(maxY, this.ys[i]);
    }
    this.view.fit(minX, minY, maxX, maxY);
    this.fitted = true;
  }

  private schedule(): void {
    if (this.frame || !this.isConnected) return;
    this.frame = requestAnimationFrame(() => {
      this.frame = 0;
      this.draw();
    });
  }

  private draw(): void {
    const c = this.canvas;
    if (!c) return;
    const t0 = performance.now();
    const dpr = window.devicePixelRatio || 1;
    const w = c.clientWidth, h = c.clientHeight;
    if (w === 0 || h === 0) return;
    const pw = Math.round(w * dpr), ph = Math.round(h * dpr);
    if (c.width !== pw || c.height !== ph) {
      c.width = pw;
      c.height = ph;
    }
    const v = this.view;
    v.width = w;
    v.height = h;
    if (!this.fitted) this.fit();
    const ctx = c.getContext('2d');
    if (!ctx) return;
    if (!this.image || this.image.width !== pw || this.image.height !== ph) {
      this.image = ctx.createImageData(pw, ph);
      this.pixels = new Uint32Array(this.image.data.buffer);
    }
    if (this.buckets && this.colours) {
      // Smaller dots when the map is crowded, so dense themes stay readable.
      const n = this.xs.length;
      const size = (n > 20000 ? 2.5 : n > 5000 ? 3.5 : 4.5) * dpr;
      const placement = { k: v.scale * dpr, ox: (v.width / 2 - v.cx * v.scale) * dpr, oy: (v.height / 2 + v.cy * v.scale) * dpr };
      const frame = { xs: this.xs, ys: this.ys, buckets: this.buckets, styles: this.styles, focus: this.focusStyle, matches: this.matchMask, selected: this.selected, hovered: this.hovered, size, dpr };
      paintPoints(this.pixels, pw, ph, frame, placement, this.colours);
    } else {
      this.pixels.fill(0);
    }
    ctx.putImageData(this.image, 0, 0);
    if (this.drag && this.mode !== 'pan' && this.drag.moved) this.drawSelectionShape(ctx, dpr);
    this.framesDrawn++;
    this.lastFrameMs = performance.now() - t0;
  }

  private drawSelectionShape(ctx: CanvasRenderingContext2D, dpr: number): void {
    const d = this.drag!;
    ctx.save();
    ctx.setTransform(dpr, 0, 0, dpr, 0, 0);
    ctx.strokeStyle = '#0072B2';
    ctx.fillStyle = 'rgba(0, 114, 178, 0.08)';
    ctx.setLineDash([5, 4]);
    ctx.lineWidth = 1.2;
    ctx.beginPath();
    if (this.mode === 'box') {
      ctx.rect(d.x, d.y, this.pointer.x - d.x, this.pointer.y - d.y);
    } else {
      ctx.moveTo(d.poly[0], d.poly[1]);
      for (let k = 2; k < d.poly.length; k += 2) ctx.lineTo(d.poly[k], d.poly[k + 1]);
      ctx.closePath();
    }
    ctx.fill();
    ctx.stroke();
    ctx.restore();
  }

  private local(e: PointerEvent | WheelEvent): { x: number; y: number } {
    const r = this.canvas!.getBoundingClientRect();
    return { x: e.clientX - r.left, y: e.clientY - r.top };
  }

  private hitTest(x: number, y: number): number {
    if (!this.grid) return -1;
    return this.grid.nearest(this.view.dx(x), this.view.dy(y), HOVER_PX / this.view.scale);
  }

  private setHovered(i: number): void {
    if (i === this.hovered) return;
    this.hovered = i;
    this.dispatchEvent(new CustomEvent('point-hover', { detail: { index: i } }));
  }

  private onDown(e: PointerEvent): void {
    if (e.button !== 0) return;
    const p = this.local(e);
    this.canvas!.setPointerCapture(e.pointerId);
    this.drag = { x: p.x, y: p.y, moved: false, poly: [p.x, p.y] };
  }

  private onMove(e: PointerEvent): void {
    const p = this.local(e);
    const last = this.pointer;
    this.pointer = p;
    const d = this.drag;
    if (!d) {
      this.setHovered(this.hitTest(p.x, p.y));
      return;
    }
    if (!d.moved && Math.hypot(p.x - d.x, p.y - d.y) < 3) return;
    d.moved = true;
    const mode = e.shiftKey && this.mode === 'pan' ? 'box' : this.mode;
    if (mode === 'pan') this.view.panBy(p.x - last.x, p.y - last.y);
    else if (mode === 'lasso') d.poly.push(p.x, p.y);
    this.setHovered(-1);
    this.schedule();
  }

  private onUp(e: PointerEvent): void {
    const d = this.drag;
    this.drag = null;
    if (!d) return;
    const p = this.local(e);
    if (!d.moved) {
      const i = this.hitTest(p.x, p.y);
      if (i >= 0) this.dispatchEvent(new CustomEvent('point-open', { detail: { index: i } }));
      return;
    }
    const mode = e.shiftKey && this.mode === 'pan' ? 'box' : this.mode;
    if (mode !== 'pan' && this.grid) {
      const v = this.view;
      let indices: Uint32Array;
      if (mode === 'box') indices = this.grid.inBox(v.dx(d.x), v.dy(d.y), v.dx(p.x), v.dy(p.y));
      else {
        const poly = new Float64Array(d.poly.length);
        for (let k = 0; k < d.poly.length; k += 2) {
          poly[k] = v.dx(d.poly[k]);
          poly[k + 1] = v.dy(d.poly[k + 1]);
        }
        indices = this.grid.inPolygon(poly);
      }
      this.dispatchEvent(new CustomEvent('points-select', { detail: { indices, add: e.ctrlKey || e.metaKey } }));
    }
    this.schedule();
  }

  private onWheel(e: WheelEvent): void {
    e.preventDefault();
    const p = this.local(e);
    this.view.zoomAt(p.x, p.y, Math.exp(-e.deltaY * (e.deltaMode === 1 ? 0.05 : 0.0015)));
    this.schedule();
  }

  private onKey(e: KeyboardEvent): void {
    const step = 40;
    const v = this.view;
    switch (e.key) {
      case 'ArrowLeft': v.panBy(step, 0); break;
      case 'ArrowRight': v.panBy(-step, 0); break;
      case 'ArrowUp': v.panBy(0, step); break;
      case 'ArrowDown': v.panBy(0, -step); break;
      case '+': case '=': v.zoomAt(v.width / 2, v.height / 2, 1.25); break;
      case '-': case '_': v.zoomAt(v.width / 2, v.height / 2, 0.8); break;
      case '0': this.fitted = false; break;
      default: return;
    }
    e.preventDefault();
    this.schedule();
  }

  private tool(mode: DragMode, label: string, title: string) {
    return html`<button type="button" aria-pressed=${this.mode === mode ? 'true' : 'false'} title=${title} @click=${() => (this.mode = mode)}>${label}</button>`;
  }

  override render() {
    const tipLeft = Math.min(this.pointer.x + 14, Math.max(0, this.view.width - 360));
    const tipTop = this.pointer.y + 14;
    return html`<div class="wrap">
      <canvas
        class=${this.mode}
        tabindex="0"
        role="img"
        aria-label=${`Map of ${this.xs.length.toLocaleString()} documents; similar documents lie close together. Arrow keys pan, plus and minus zoom, 0 frames everything.`}
        data-points=${this.xs.length}
        @pointerdown=${this.onDown}
        @pointermove=${this.onMove}
        @pointerup=${this.onUp}
        @pointerleave=${() => !this.drag && this.setHovered(-1)}
        @wheel=${this.onWheel}
        @keydown=${this.onKey}
      ></canvas>
      <div class="tools" role="toolbar" aria-label="Map tools">
        ${this.tool('pan', 'Pan', 'Drag to move the map (Shift-drag selects a box)')} ${this.tool('box', 'Box', 'Drag a box to select documents')}
        ${this.tool('lasso', 'Lasso', 'Draw around documents to select them')}
        <button type="button" title="Show every document" @click=${() => this.resetView()}>Fit</button>
      </div>
      ${this.hovered >= 0 && this.hoverText
        ? html`<div class="tip" role="tooltip" style=${styleMap({ left: `${tipLeft}px`, top: `${tipTop}px` })}>${this.hoverText}</div>`
        : nothing}
      <div class="hint">scroll to zoom · click a dot to read it</div>
    </div>`;
  }
}
customElements.define('sheaf-scatter-map', SheafScatterMap);
