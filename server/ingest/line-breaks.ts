/**
 * Counts line breaks in ranges of one string that only move forward, with native `indexOf`:
 * LF, CRLF and a lone CR each count once, so line numbers match what a text editor shows for
 * files from any platform. Each search resumes where the last one stopped, so counting a whole
 * buffer range by range costs one pass, however many ranges there are.
 */
export class LineBreakCounter {
  private s = '';
  private nextLf = -2; // -2: not searched yet, -1: none left
  private nextCr = -2;

  /** Starts on a new string. */
  reset(s: string): void {
    this.s = s;
    this.nextLf = -2;
    this.nextCr = -2;
  }

  /**
   * Line breaks in `[from, to)`. Ranges must not go backwards. A CR at `to - 1` counts as a
   * lone CR unless the character at `to` is LF.
   */
  count(from: number, to: number): number {
    const s = this.s;
    let n = 0;
    if (this.nextLf !== -1 && this.nextLf < from) this.nextLf = s.indexOf('\n', from);
    while (this.nextLf >= 0 && this.nextLf < to) {
      n++;
      this.nextLf = s.indexOf('\n', this.nextLf + 1);
    }
    if (this.nextCr !== -1 && this.nextCr < from) this.nextCr = s.indexOf('\r', from);
    while (this.nextCr >= 0 && this.nextCr < to) {
      if (s.charCodeAt(this.nextCr + 1) !== 0x0a) n++;
      this.nextCr = s.indexOf('\r', this.nextCr + 1);
    }
    return n;
  }
}
