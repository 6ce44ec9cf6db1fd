import { LitElement, css, html, nothing, type PropertyValues } from 'lit';
import { api } from '../api/client.js';
import { DocumentCache } from '../api/document-cache.js';
import type { Analysis, Assignment, Corpus, DocumentItem } from '../api/types.js';
import { JobPhase } from '../controllers/job-controller.js';
import { TaskController, TaskStatus } from '../controllers/task-controller.js';
import { TriageController } from '../controllers/triage-controller.js';
import { SearchController, SearchStatus } from '../controllers/search-controller.js';
import { buildMapData, filterPositions, themeStyles, type MapData } from '../lib/map-data.js';
import type { ThemeStyle } from '../lib/palette.js';
import { sharedStyles } from '../lib/shared-styles.js';
import { themeLabel } from '../lib/theme-label.js';
import { navigate } from './sheaf-app.js';
import type { SheafDocumentDialog } from './sheaf-document-dialog.js';
import type { JobEndedDetail } from './sheaf-job-progress.js';
import type { SheafThemeList } from './sheaf-theme-list.js';
import './sheaf-analysis-header.js';
import './sheaf-move-bar.js';
import './sheaf-search-bar.js';
import './sheaf-scatter-map.js';
import './sheaf-theme-list.js';
import './sheaf-theme-panel.js';
import './sheaf-silhouette-chart.js';
import './sheaf-document-list.js';
import './sheaf-document-dialog.js';
import './sheaf-job-progress.js';
import './sheaf-error-note.js';

interface Loaded {
  analysis: Analysis;
  corpus: Corpus | null;
  rows: Assignment[] | null;
}


/**
 * One analysis as a workspace: the map, the theme list and the selected theme's details, the
 * silhouette-by-k curve, the filtered document list, and the edits (rename, merge, move) and
 * exports. Theme, search and page live in the URL.
 */
export class SheafAnalysisPage extends LitElement {
  static override properties = {
    corpusId: { type: String },
    analysisId: { type: String },
    themeId: { type: String },
    query: { type: String },
    page: { type: Number },
    analysis: { state: true },
    data: { state: true },
    styles: { state: true },
    selected: { state: true },
    hoverText: { state: true },
    dialogDoc: { state: true },
    dialogIndex: { state: true },
  };
  corpusId: string | null = null;
  analysisId: string | null = null;
  themeId: string | null = null;
  query = '';
  page = 0;
  analysis: Analysis | null = null;
  data: MapData | null = null;
  styles: ThemeStyle[] = [];
  selected: Uint8Array | null = null;
  hoverText = '';
  dialogDoc: DocumentItem | null = null;
  dialogIndex = -1;
  private rows: Assignment[] = [];
  private cache: DocumentCache | null = null;
  private readonly colourMemory = new Map<string, number>();
  private readonly load = new TaskController<Loaded>(this);
  private readonly pick = new TaskController<Analysis[] | null>(this);
  private readonly search = new SearchController(this);
  private readonly triage = new TriageController(this, (analysis, rows) => this.apply(analysis, rows));
  /** Filtered positions, recomputed only when data, theme or search change (not on every hover). */
  private filtered: { data: MapData; theme: number; mask: Uint8Array | null; positions: Uint32Array } | null = null;
  private hoverSeq = 0;

  static override styles = [
    sharedStyles,
    css`
      sheaf-analysis-header { margin-bottom: 1rem; }
      .work { display: grid; grid-template-columns: minmax(0, 1.9fr) minmax(19rem, 1fr); gap: 1rem; align-items: start; }
      .lower { display: grid; grid-template-columns: minmax(0, 1.9fr) minmax(19rem, 1fr); gap: 1rem; align-items: start; margin-top: 1rem; }
      @media (max-width: 1000px) { .work, .lower { grid-template-columns: 1fr; } }
      sheaf-scatter-map { height: 62vh; min-height: 420px; }
      .side > * + * { margin-top: 1rem; }
      sheaf-search-bar { margin-bottom: 0.6rem; }
      sheaf-move-bar { margin-bottom: 0.6rem; }
    `,
  ];

  protected override willUpdate(changed: PropertyValues<this>): void {
    if (changed.has('analysisId')) {
      this.analysis = null;
      this.data = null;
      this.selected = null;
      this.search.clear();
      this.cache = null;
      this.colourMemory.clear();
      if (this.analysisId) void this.reload(true);
      else if (this.corpusId) void this.pickLatest(this.corpusId);
    }
    if (changed.has('query')) {
      if (this.data) this.runSearch();
    }
  }

  private async pickLatest(cid: string) {
    const list = await this.pick.run(async (signal) => {
      try {
        return await api.listAnalyses(cid, signal);
      } catch {
        return null;
      }
    });
    const done = list?.filter((a) => a.status === 'done') ?? [];
    if (done.length) navigate(this, { analysis: done[done.length - 1].id, replace: true });
  }

  private async reload(full: boolean) {
    const aid = this.analysisId;
    if (!aid) return;
    const res = await this.load.run(async (signal) => {
      const analysis = await api.getAnalysis(aid, signal);
      const corpus = full || !this.load.value ? await api.getCorpus(analysis.corpusId, signal).catch(() => null) : this.load.value.corpus;
      const rows = analysis.status === 'done' ? await api.assignments(aid, signal) : null;
      return { analysis, corpus, rows };
    });
    if (!res) return;
    this.apply(res.analysis, res.rows);
    if (res.analysis.corpusId && res.analysis.corpusId !== this.corpusId) navigate(this, { corpus: res.analysis.corpusId, replace: true });
  }

  private apply(analysis: Analysis, rows: Assignment[] | null) {
    this.analysis = analysis;
    if (rows) this.rows = rows;
    const clusters = analysis.clusters ?? [];
    this.styles = themeStyles(clusters, this.colourMemory);
    if (analysis.status !== 'done') return;
    const data = buildMapData(this.rows, clusters);
    if (!this.cache || !this.data || this.data.ids.length !== data.ids.length) this.cache = new DocumentCache(analysis.corpusId, data.ids);
    const prevSelected = this.selected;
    this.data = data;
    if (!prevSelected || prevSelected.length !== data.ids.length) this.selected = new Uint8Array(data.ids.length);
    if (this.query && (!this.search.mask || this.search.mask.length !== data.ids.length)) this.runSearch();
  }

  private runSearch() {
    if (this.data && this.analysis) void this.search.run(this.analysis.corpusId, this.query, this.data);
  }

  private get themePos(): number {
    const cs = this.analysis?.clusters ?? [];
    return this.themeId ? cs.findIndex((c) => c.id === this.themeId) : -1;
  }

  private onRename(e: CustomEvent<{ clusterId: string; name: string }>) {
    void this.triage.rename(this.analysisId!, e.detail.clusterId, e.detail.name);
  }

  private async onMerge(e: CustomEvent<{ clusterIds: string[]; name: string }>) {
    const before = new Set((this.analysis?.clusters ?? []).map((c) => c.id));
    const updated = await this.triage.merge(this.analysisId!, e.detail.clusterIds, e.detail.name);
    if (!updated) return;
    this.renderRoot.querySelector<SheafThemeList>('sheaf-theme-list')?.clearChecks();
    const cs = updated.clusters ?? [];
    const merged = cs.find((c) => !before.has(c.id)) ?? cs.find((c) => e.detail.clusterIds.includes(c.id));
    if (merged) navigate(this, { theme: merged.id });
  }

  private async moveTo(documentIds: string[], clusterId: string) {
    const ok = await this.triage.move(this.analysisId!, documentIds, clusterId);
    if (ok && this.data) this.selected = new Uint8Array(this.data.ids.length);
    return ok;
  }

  private async onDialogMove(e: CustomEvent<{ documentIds: string[]; clusterId: string }>) {
    const ok = await this.moveTo(e.detail.documentIds, e.detail.clusterId);
    if (ok && this.dialogIndex >= 0) this.renderRoot.querySelector<SheafDocumentDialog>('sheaf-document-dialog')?.close();
  }

  private moveSelected(clusterId: string) {
    const d = this.data, sel = this.selected;
    if (!d || !sel || !clusterId) return;
    const ids: string[] = [];
    for (let i = 0; i < sel.length; i++) if (sel[i]) ids.push(d.ids[i]);
    if (ids.length) void this.moveTo(ids, clusterId);
  }

  private onSelectPoints(e: CustomEvent<{ indices: Uint32Array; add: boolean }>) {
    if (!this.data) return;
    const next = e.detail.add && this.selected ? this.selected.slice() : new Uint8Array(this.data.ids.length);
    for (const i of e.detail.indices) next[i] = 1;
    this.selected = next;
  }

  private onToggle(e: CustomEvent<{ index: number; on: boolean }>) {
    if (!this.selected) return;
    const next = this.selected.slice();
    next[e.detail.index] = e.detail.on ? 1 : 0;
    this.selected = next;
  }

  private async onHover(e: CustomEvent<{ index: number }>) {
    const i = e.detail.index;
    const seq = ++this.hoverSeq;
    if (i < 0 || !this.cache) {
      this.hoverText = '';
      return;
    }
    const have = this.cache.peek(i);
    const label = this.themeLine(i);
    if (have) {
      this.hoverText = `${label}\n${snippet(have.text)}`;
      return;
    }
    this.hoverText = `${label}\n…`;
    const doc = await this.cache.get(i).catch(() => undefined);
    if (seq === this.hoverSeq && doc) this.hoverText = `${label}\n${snippet(doc.text)}`;
  }

  private themeLine(i: number): string {
    const t = this.data?.themeOf[i] ?? -1;
    const c = this.analysis?.clusters?.[t];
    return c ? themeLabel(c, t) : '';
  }

  private async openDoc(index: number) {
    if (!this.cache || !this.data) return;
    this.dialogIndex = index;
    this.dialogDoc = (await this.cache.get(index).catch(() => undefined)) ?? { id: this.data.ids[index], text: '(the text could not be loaded)', meta: {} };
    this.renderRoot.querySelector<SheafDocumentDialog>('sheaf-document-dialog')?.open();
  }

  private onJobEnded(e: CustomEvent<JobEndedDetail>) {
    if (e.detail.phase === JobPhase.Done || e.detail.phase === JobPhase.Failed || e.detail.phase === JobPhase.Cancelled) void this.reload(false);
  }

  private renderWork(a: Analysis, data: MapData) {
    const clusters = a.clusters ?? [];
    const pos = this.themePos;
    const selCount = this.selected ? this.selected.reduce((s, v) => s + v, 0) : 0;
    const f = this.filtered;
    if (!f || f.data !== data || f.theme !== pos || f.mask !== this.search.mask) {
      this.filtered = { data, theme: pos, mask: this.search.mask, positions: filterPositions(data, pos, this.search.mask) };
    }
    const positions = this.filtered!.positions;
    const caption = [pos >= 0 ? `Theme “${themeLabel(clusters[pos], pos)}”` : 'All themes', this.query ? `matching “${this.query}”` : ''].filter(Boolean).join(', ') + ':';
    return html`
      <sheaf-search-bar .query=${this.query} .total=${this.search.mask ? this.search.total : -1} .searching=${this.search.status === SearchStatus.Searching}></sheaf-search-bar>
      <sheaf-error-note .error=${this.search.error} context="Search failed"></sheaf-error-note>
      ${selCount > 0
        ? html`<sheaf-move-bar
            .count=${selCount}
            .clusters=${clusters}
            .busy=${this.triage.busy}
            @move-selected=${(e: CustomEvent<{ clusterId: string }>) => this.moveSelected(e.detail.clusterId)}
            @clear-selection=${() => (this.selected = new Uint8Array(data.ids.length))}
          ></sheaf-move-bar>`
        : nothing}
      <sheaf-error-note .error=${this.triage.error} context="The change was not saved"></sheaf-error-note>
      <div class="work">
        <sheaf-scatter-map
          .xs=${data.xs}
          .ys=${data.ys}
          .styleOf=${data.themeOf}
          .styles=${this.styles}
          .matchMask=${this.search.mask}
          .selected=${this.selected}
          .focusStyle=${pos}
          .hoverText=${this.hoverText}
          @point-hover=${this.onHover}
          @point-open=${(e: CustomEvent<{ index: number }>) => this.openDoc(e.detail.index)}
          @points-select=${this.onSelectPoints}
        ></sheaf-scatter-map>
        <div class="side">
          <section class="panel" aria-labelledby="th-h">
            <h3 id="th-h">Themes</h3>
            <sheaf-theme-list
              .clusters=${clusters}
              .styles=${this.styles}
              .selectedId=${this.themeId}
              .busy=${this.triage.busy}
              @theme-select=${(e: CustomEvent<{ id: string | null }>) => navigate(this, { theme: e.detail.id })}
              @merge=${this.onMerge}
            ></sheaf-theme-list>
          </section>
          <section class="panel">
            <sheaf-theme-panel
              .cluster=${pos >= 0 ? clusters[pos] : null}
              .position=${pos}
              .themeStyle=${pos >= 0 ? this.styles[pos] : null}
              .data=${data}
              .cache=${this.cache}
              .busy=${this.triage.busy}
              @rename=${this.onRename}
              @open-doc=${(e: CustomEvent<{ index: number }>) => this.openDoc(e.detail.index)}
            ></sheaf-theme-panel>
          </section>
        </div>
      </div>
      <div class="lower">
        <section class="panel">
          <h3>Documents</h3>
          <sheaf-document-list
            .positions=${positions}
            .page=${this.page}
            .data=${data}
            .cache=${this.cache}
            .clusters=${clusters}
            .styles=${this.styles}
            .selected=${this.selected}
            .caption=${caption}
            @page-change=${(e: CustomEvent<{ page: number }>) => navigate(this, { page: e.detail.page, replace: true })}
            @toggle-select=${this.onToggle}
            @open-doc=${(e: CustomEvent<{ index: number }>) => this.openDoc(e.detail.index)}
          ></sheaf-document-list>
        </section>
        <section class="panel">
          <h3>How many themes?</h3>
          <sheaf-silhouette-chart .byK=${a.silhouetteByK ?? null} .reference=${a.referenceByK ?? null} .chosen=${a.k ?? clusters.length}></sheaf-silhouette-chart>
          <p class="small muted">Silhouette (Rousseeuw, 1987) runs from −1 to 1: higher means documents sit closer to their own theme than to the next one.</p>
        </section>
      </div>
      <sheaf-document-dialog
        .doc=${this.dialogDoc}
        .themePos=${this.dialogIndex >= 0 ? data.themeOf[this.dialogIndex] : -1}
        .silhouette=${this.dialogIndex >= 0 ? data.silhouette[this.dialogIndex] : NaN}
        .clusters=${clusters}
        .busy=${this.triage.busy}
        @move=${this.onDialogMove}
      ></sheaf-document-dialog>
    `;
  }

  override render() {
    if (!this.analysisId) {
      if (this.corpusId && this.pick.status === TaskStatus.Pending) return html`<p class="muted">Looking for analyses…</p>`;
      return html`<div class="panel stack">
        <h2>No analysis open</h2>
        <p>Pick a corpus and find its themes first.</p>
        <button class="primary" @click=${() => navigate(this, { view: 'corpora' })}>Go to corpora</button>
      </div>`;
    }
    const l = this.load;
    if (l.status === TaskStatus.Error && !this.analysis) return html`<sheaf-error-note .error=${l.error} context="Could not open the analysis"></sheaf-error-note>`;
    const a = this.analysis;
    if (!a) return html`<p class="muted">Loading the analysis…</p>`;
    const corpus = l.value?.corpus ?? null;
    if (a.status === 'queued' || a.status === 'running') {
      return html`<div class="panel stack"><h2>Finding themes…</h2><sheaf-job-progress kind="analyses" .jobId=${a.id} @job-ended=${this.onJobEnded}></sheaf-job-progress></div>`;
    }
    if (a.status === 'failed' || a.status === 'cancelled') {
      return html`<div class="panel stack">
        <h2>${a.status === 'failed' ? 'This analysis failed' : 'This analysis was cancelled'}</h2>
        ${a.error ? html`<div class="note bad">${a.error.message}</div>` : nothing}
        <button @click=${() => navigate(this, { view: 'corpora', corpus: a.corpusId })}>Back to the corpus</button>
      </div>`;
    }
    return html`<sheaf-analysis-header .analysis=${a} .corpus=${corpus}></sheaf-analysis-header> ${this.data ? this.renderWork(a, this.data) : html`<p class="muted">Loading the map…</p>`}`;
  }
}

function snippet(text: string): string {
  const t = text.replace(/\s+/g, ' ').trim();
  return t.length > 240 ? `${t.slice(0, 239)}…` : t;
}

customElements.define('sheaf-analysis-page', SheafAnalysisPage);
