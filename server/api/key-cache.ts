import type { RouterKeyRecord, Store } from '../store/api.js';

/**
 * Router keys recently looked up, by hash, so a busy integration does not cost a database read per
 * request. Entries live `ttlMs`; a revocation through this server drops the key at once, and one
 * made by another replica takes effect within `ttlMs`.
 */
export class KeyCache {
  private readonly entries = new Map<string, { record: RouterKeyRecord | null; at: number }>();

  constructor(
    private readonly store: Store,
    private readonly ttlMs = 2000,
    private readonly maxEntries = 10_000,
  ) {}

  async find(hash: string): Promise<RouterKeyRecord | null> {
    const now = Date.now();
    const hit = this.entries.get(hash);
    if (hit && now - hit.at < this.ttlMs) return hit.record;
    const record = await this.store.findKeyByHash(hash);
    // Unknown keys are cached too, so guessing does not turn into database load.
    if (this.entries.size >= this.maxEntries) this.entries.clear();
    this.entries.set(hash, { record, at: now });
    return record;
  }

  /** Forgets a key (after it was revoked here). */
  forget(keyId: string): void {
    for (const [hash, e] of this.entries) if (e.record?.id === keyId) this.entries.delete(hash);
  }
}
