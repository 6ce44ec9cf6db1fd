/**
 * Token buckets keyed by a string (a router key id): `rate` requests per second on average, bursts
 * of up to `burst`. Buckets unused for a minute are forgotten, so memory stays bounded by the keys
 * in active use.
 */
export class RateLimiter {
  private readonly buckets = new Map<string, { tokens: number; at: number }>();
  private lastSweep = Date.now();

  constructor(
    private readonly rate: number,
    private readonly burst = rate * 2,
  ) {}

  /** Takes one token; returns 0 when allowed, else the seconds to wait before trying again. */
  take(key: string, now = Date.now()): number {
    if (this.rate <= 0) return 0;
    if (now - this.lastSweep > 60_000) this.sweep(now);
    const b = this.buckets.get(key) ?? { tokens: this.burst, at: now };
    b.tokens = Math.min(this.burst, b.tokens + ((now - b.at) / 1000) * this.rate);
    b.at = now;
    this.buckets.set(key, b);
    if (b.tokens >= 1) {
      b.tokens -= 1;
      return 0;
    }
    return Math.max(1, Math.ceil((1 - b.tokens) / this.rate));
  }

  private sweep(now: number): void {
    this.lastSweep = now;
    for (const [k, b] of this.buckets) if (now - b.at > 60_000) this.buckets.delete(k);
  }
}
