/** A growable `Uint32Array`: append-only storage for term ids and offsets without per-item objects. */
export class IdBuffer {
  /** Backing storage; valid entries are `data[0 .. length)`. Replaced when it grows. */
  data: Uint32Array;
  /** Number of valid entries. */
  length = 0;

  /** @param capacity initial number of slots. @default 1024 */
  constructor(capacity = 1024) {
    this.data = new Uint32Array(Math.max(16, capacity));
  }

  /** Appends one value. */
  push(x: number): void {
    if (this.length === this.data.length) this.reserve(1);
    this.data[this.length++] = x;
  }

  /** Makes room for at least `extra` more values. */
  reserve(extra: number): void {
    const need = this.length + extra;
    if (need <= this.data.length) return;
    const next = new Uint32Array(Math.max(need, this.data.length * 2));
    next.set(this.data.subarray(0, this.length));
    this.data = next;
  }

  /** Forgets the contents, keeping the storage. */
  clear(): void {
    this.length = 0;
  }
}

/** Returns `a` if it already has `n` slots, else a larger copy (new slots zero). */
export function growInt32(a: Int32Array<ArrayBuffer>, n: number, fill = 0): Int32Array<ArrayBuffer> {
  if (a.length >= n) return a;
  const next = new Int32Array(Math.max(n, a.length * 2));
  next.set(a);
  if (fill !== 0) next.fill(fill, a.length);
  return next;
}

/** Returns `a` if it already has `n` slots, else a larger copy (new slots zero). */
export function growUint32(a: Uint32Array<ArrayBuffer>, n: number): Uint32Array<ArrayBuffer> {
  if (a.length >= n) return a;
  const next = new Uint32Array(Math.max(n, a.length * 2));
  next.set(a);
  return next;
}
