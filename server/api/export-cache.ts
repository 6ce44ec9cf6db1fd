/**
 * Finished exports kept in memory, least recently used first out, within a byte budget. Keys carry
 * the analysis revision, so an edited analysis is never served stale. Concurrent requests for the
 * same export wait for one build instead of each building it.
 */
export class ExportCache {
  private readonly entries = new Map<string, Buffer>();
  private readonly building = new Map<string, Promise<Buffer>>();
  private bytes = 0;

  constructor(private readonly maxBytes = 128 * 1024 * 1024) {}

  async get(key: string, build: () => Promise<Buffer>): Promise<Buffer> {
    const hit = this.entries.get(key);
    if (hit) {
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit;
    }
    let pending = this.building.get(key);
    if (!pending) {
      pending = build().finally(() => this.building.delete(key));
      this.building.set(key, pending);
      void pending.then((buf) => this.keep(key, buf), () => {});
    }
    return pending;
  }

  private keep(key: string, buf: Buffer): void {
    if (buf.length > this.maxBytes / 4 || this.entries.has(key)) return;
    this.entries.set(key, buf);
    this.bytes += buf.length;
    for (const [k, b] of this.entries) {
      if (this.bytes <= this.maxBytes) break;
      this.entries.delete(k);
      this.bytes -= b.length;
    }
  }
}
