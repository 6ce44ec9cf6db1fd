/**
 * Pan and zoom of the map: maps data coordinates to CSS pixels and back. y grows upward in data
 * space and downward on screen, so the map reads like a chart.
 */
export class ViewTransform {
  /** Data x at the centre of the view. */
  cx = 0;
  /** Data y at the centre of the view. */
  cy = 0;
  /** CSS pixels per data unit. */
  scale = 1;
  /** View width in CSS pixels. */
  width = 1;
  /** View height in CSS pixels. */
  height = 1;

  /**
   * Frames a data box in the view with a margin.
   * @param minX box left
   * @param minY box bottom
   * @param maxX box right
   * @param maxY box top
   * @param margin CSS pixels kept free on every side
   * @default margin 24 (common practice)
   */
  fit(minX: number, minY: number, maxX: number, maxY: number, margin = 24): void {
    const w = Math.max(maxX - minX, 1e-9);
    const h = Math.max(maxY - minY, 1e-9);
    this.cx = (minX + maxX) / 2;
    this.cy = (minY + maxY) / 2;
    this.scale = Math.max(1e-9, Math.min((this.width - 2 * margin) / w, (this.height - 2 * margin) / h));
  }

  /** Screen x of a data x. */
  sx(x: number): number {
    return (x - this.cx) * this.scale + this.width / 2;
  }

  /** Screen y of a data y. */
  sy(y: number): number {
    return this.height / 2 - (y - this.cy) * this.scale;
  }

  /** Data x of a screen x. */
  dx(px: number): number {
    return (px - this.width / 2) / this.scale + this.cx;
  }

  /** Data y of a screen y. */
  dy(py: number): number {
    return (this.height / 2 - py) / this.scale + this.cy;
  }

  /**
   * Moves the view by a screen distance (drag).
   * @param px pixels the content moved right
   * @param py pixels the content moved down
   */
  panBy(px: number, py: number): void {
    this.cx -= px / this.scale;
    this.cy += py / this.scale;
  }

  /**
   * Zooms by a factor while keeping the data point under (px, py) fixed on screen.
   * @param px anchor x in CSS pixels
   * @param py anchor y in CSS pixels
   * @param factor > 1 zooms in
   */
  zoomAt(px: number, py: number, factor: number): void {
    if (!(factor > 0)) throw new RangeError(`zoom factor must be > 0, got ${factor}`);
    const x = this.dx(px);
    const y = this.dy(py);
    this.scale *= factor;
    this.cx = x - (px - this.width / 2) / this.scale;
    this.cy = y + (py - this.height / 2) / this.scale;
  }
}
