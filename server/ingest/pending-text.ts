/**
 * Text a streaming splitter has received but not yet split into whole records. Pieces are joined
 * only when a pass is due: after an incomplete record, the next pass waits until twice the
 * leftover is pending, so a long record costs linear time rather than a rescan per piece.
 */
export class PendingText {
  private parts: string[] = [];
  private length = 0;
  private needed = 0;

  /**
   * Adds a piece of text.
   * @param final - true for the last piece: a pass is then always due
   * @returns all pending text when a split pass is due, else null
   */
  add(text: string, final: boolean): string | null {
    if (text.length > 0) {
      this.parts.push(text);
      this.length += text.length;
    }
    if (!final && this.length < this.needed) return null;
    return this.parts.length === 1 ? this.parts[0]! : this.parts.join('');
  }

  /**
   * Keeps what a pass over `s` left unconsumed for the next one.
   * @returns the length of that leftover
   */
  keep(s: string, consumed: number): number {
    const rest = consumed === s.length ? '' : s.slice(consumed);
    this.parts = rest.length > 0 ? [rest] : [];
    this.length = rest.length;
    this.needed = rest.length * 2;
    return rest.length;
  }
}
