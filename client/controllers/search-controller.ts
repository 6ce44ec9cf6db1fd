import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { searchPositions } from '../api/document-cache.js';
import type { MapData } from '../lib/map-data.js';

/** Where the text search stands. */
export enum SearchStatus {
  /** No search words. */
  Off = 'off',
  /** Asking the server. */
  Searching = 'searching',
  /** `mask` holds the matches. */
  Ready = 'ready',
  /** The server refused or failed; `error` says why. */
  Failed = 'failed',
}

/**
 * Finds the documents matching a text search through the server and keeps them as a mask over
 * the map's positions. A new search aborts the one in flight.
 */
export class SearchController implements ReactiveController {
  status: SearchStatus = SearchStatus.Off;
  /** 1 for each matching position, or null. */
  mask: Uint8Array | null = null;
  /** Matches the server counted (may exceed what was read when it is huge). */
  total = 0;
  error: unknown = null;
  private abort: AbortController | null = null;
  private readonly host: ReactiveControllerHost;

  /** @param host component to re-render */
  constructor(host: ReactiveControllerHost) {
    this.host = host;
    host.addController(this);
  }

  /**
   * Searches, or clears the search when `q` is blank.
   * @param corpusId corpus of the analysis
   * @param q the words
   * @param data the map's positions
   */
  async run(corpusId: string, q: string, data: MapData): Promise<void> {
    this.abort?.abort();
    this.error = null;
    const words = q.trim();
    if (!words) {
      this.status = SearchStatus.Off;
      this.mask = null;
      this.host.requestUpdate();
      return;
    }
    const ctl = new AbortController();
    this.abort = ctl;
    this.status = SearchStatus.Searching;
    this.host.requestUpdate();
    try {
      const { positions, total } = await searchPositions(corpusId, words, (id) => data.indexOf.get(id), ctl.signal);
      if (ctl.signal.aborted) return;
      const mask = new Uint8Array(data.ids.length);
      for (const i of positions) mask[i] = 1;
      this.mask = mask;
      this.total = total;
      this.status = SearchStatus.Ready;
    } catch (err) {
      if (ctl.signal.aborted) return;
      this.error = err;
      this.status = SearchStatus.Failed;
    } finally {
      if (this.abort === ctl) this.abort = null;
      this.host.requestUpdate();
    }
  }

  /** Drops the search and its matches (another analysis was opened). */
  clear(): void {
    this.abort?.abort();
    this.abort = null;
    this.status = SearchStatus.Off;
    this.mask = null;
    this.error = null;
    this.host.requestUpdate();
  }

  /** @internal */
  hostDisconnected(): void {
    this.abort?.abort();
    this.abort = null;
  }
}
