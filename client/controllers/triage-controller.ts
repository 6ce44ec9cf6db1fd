import type { ReactiveController, ReactiveControllerHost } from 'lit';
import { api } from '../api/client.js';
import type { Analysis, Assignment } from '../api/types.js';

/** Where the latest triage edit stands. */
export enum TriageStatus {
  /** No edit in flight; the last one (if any) was saved. */
  Idle = 'idle',
  /** An edit is being saved. */
  Saving = 'saving',
  /** The last edit was refused or failed; nothing changed on the server. */
  Failed = 'failed',
}

/**
 * Saves the triage edits of one analysis (rename, merge, move) one at a time and hands back the
 * updated analysis, with fresh assignments when documents changed theme. Disconnecting the host
 * aborts an edit's follow-up reads; a refused edit leaves `error` for the page to show.
 */
export class TriageController implements ReactiveController {
  /** Current status. */
  status: TriageStatus = TriageStatus.Idle;
  /** Why the last edit failed. */
  error: unknown = null;
  private abort: AbortController | null = null;
  private readonly host: ReactiveControllerHost;
  private readonly onSaved: (analysis: Analysis, rows: Assignment[] | null) => void;

  /**
   * @param host component to re-render on status changes
   * @param onSaved receives the updated analysis, and the assignments when they changed
   */
  constructor(host: ReactiveControllerHost, onSaved: (analysis: Analysis, rows: Assignment[] | null) => void) {
    this.host = host;
    this.onSaved = onSaved;
    host.addController(this);
  }

  /** An edit is being saved. */
  get busy(): boolean {
    return this.status === TriageStatus.Saving;
  }

  /**
   * Names a theme.
   * @param aid analysis id
   * @param clusterId theme id
   * @param name new name
   */
  rename(aid: string, clusterId: string, name: string): Promise<Analysis | null> {
    return this.save(aid, (s) => api.renameCluster(aid, clusterId, name, s), false);
  }

  /**
   * Merges themes into one.
   * @param aid analysis id
   * @param clusterIds the themes (two or more)
   * @param name name of the merged theme; empty keeps the server's choice
   */
  merge(aid: string, clusterIds: string[], name: string): Promise<Analysis | null> {
    return this.save(aid, (s) => api.mergeClusters(aid, clusterIds, name || undefined, s), true);
  }

  /**
   * Moves documents to a theme.
   * @param aid analysis id
   * @param documentIds the documents
   * @param clusterId the theme they go to
   */
  move(aid: string, documentIds: string[], clusterId: string): Promise<Analysis | null> {
    return this.save(aid, (s) => api.moveDocuments(aid, documentIds, clusterId, s), true);
  }

  private async save(aid: string, work: (signal: AbortSignal) => Promise<Analysis>, refetchRows: boolean): Promise<Analysis | null> {
    if (this.busy) return null;
    const ctl = new AbortController();
    this.abort = ctl;
    this.status = TriageStatus.Saving;
    this.error = null;
    this.host.requestUpdate();
    try {
      const updated = await work(ctl.signal);
      const rows = refetchRows ? await api.assignments(aid, ctl.signal) : null;
      if (ctl.signal.aborted) return null;
      this.status = TriageStatus.Idle;
      this.onSaved(updated, rows);
      return updated;
    } catch (err) {
      if (ctl.signal.aborted) return null;
      this.status = TriageStatus.Failed;
      this.error = err;
      return null;
    } finally {
      if (this.abort === ctl) this.abort = null;
      this.host.requestUpdate();
    }
  }

  /** @internal */
  hostDisconnected(): void {
    this.abort?.abort();
    this.abort = null;
    this.status = TriageStatus.Idle;
  }
}
