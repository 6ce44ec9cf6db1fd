import { api } from './client.js';
import type { DocumentItem } from './types.js';

/** Documents fetched per request (common practice: big enough to make hovering a region cheap). */
const PAGE = 200;

/**
 * Document texts of one corpus, fetched a page at a time on demand (hover, theme panel, list)
 * and kept, so a 50,000-document corpus never has to be downloaded whole. Position `i` is the
 * i-th document in corpus order, the order of the assignments.
 */
export class DocumentCache {
  private readonly byId = new Map<string, DocumentItem>();
  private readonly pending = new Map<number, Promise<void>>();
  private readonly corpusId: string;
  private readonly ids: readonly string[];

  /**
   * @param corpusId corpus to read
   * @param ids document id at each position, in corpus order
   */
  constructor(corpusId: string, ids: readonly string[]) {
    this.corpusId = corpusId;
    this.ids = ids;
  }

  /** The document at a position if already fetched. */
  peek(index: number): DocumentItem | undefined {
    const id = this.ids[index];
    return id === undefined ? undefined : this.byId.get(id);
  }

  /**
   * The document at a position, fetching its page when needed.
   * @param index position in corpus order
   * @param signal abandons the wait (the page still lands in the cache)
   */
  async get(index: number, signal?: AbortSignal): Promise<DocumentItem | undefined> {
    const have = this.peek(index);
    if (have) return have;
    await this.load(Math.floor(index / PAGE), signal);
    return this.peek(index);
  }

  /**
   * Documents at several positions (fetching only the missing pages, a few at a time).
   * @param indices positions in corpus order
   * @param signal abandons the wait
   */
  async getMany(indices: ArrayLike<number>, signal?: AbortSignal): Promise<(DocumentItem | undefined)[]> {
    const pages = new Set<number>();
    for (let k = 0; k < indices.length; k++) if (!this.peek(indices[k])) pages.add(Math.floor(indices[k] / PAGE));
    const list = [...pages];
    for (let k = 0; k < list.length; k += 4) {
      if (signal?.aborted) break;
      await Promise.all(list.slice(k, k + 4).map((p) => this.load(p, signal)));
    }
    return Array.from({ length: indices.length }, (_, k) => this.peek(indices[k]));
  }

  private load(page: number, signal?: AbortSignal): Promise<void> {
    let p = this.pending.get(page);
    if (!p) {
      p = api.documents(this.corpusId, { offset: page * PAGE, limit: PAGE }).then(
        (res) => {
          for (const item of res.items) this.byId.set(item.id, item);
        },
        (err) => {
          this.pending.delete(page);
          throw err;
        },
      );
      this.pending.set(page, p);
    }
    if (!signal) return p;
    return Promise.race([
      p,
      new Promise<void>((_, reject) => signal.addEventListener('abort', () => reject(new DOMException('stopped', 'AbortError')), { once: true })),
    ]);
  }
}

/**
 * Positions of every document the server's text search finds, read in pages (bounded: at most
 * `maxPages` requests).
 * @param corpusId corpus to search
 * @param q the words to look for
 * @param indexOf position of a document id
 * @param signal stops the search
 * @param maxPages most pages to request
 * @default maxPages 60 (60,000 matches at 1,000 per page)
 */
export async function searchPositions(
  corpusId: string,
  q: string,
  indexOf: (id: string) => number | undefined,
  signal?: AbortSignal,
  maxPages = 60,
): Promise<{ positions: Uint32Array; total: number }> {
  const out: number[] = [];
  let total = 0;
  let offset = 0;
  for (let page = 0; page < maxPages; page++) {
    const res = await api.documents(corpusId, { offset, limit: 1000, q }, signal);
    total = res.total;
    for (const item of res.items) {
      const i = indexOf(item.id);
      if (i !== undefined) out.push(i);
    }
    offset += res.items.length;
    if (res.items.length === 0 || offset >= res.total) break;
  }
  return { positions: Uint32Array.from(out).sort(), total };
}
