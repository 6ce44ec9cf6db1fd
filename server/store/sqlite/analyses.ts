import type { AnalysisArrays, AnalysisRecord, AnalysisSummary, ClusterRecord } from '../api.js';
import { statementCache, type Db } from './open-database.js';

interface ClusterRow {
  id: string;
  name: string | null;
  size: number;
  terms: string;
  representative_ids: string;
  silhouette: number;
  no_content: number;
}

const ARRAY_TYPES = { Int32Array, Float32Array, Uint32Array } as const;
type ArrayTypeName = keyof typeof ARRAY_TYPES;

function toBlob(a: Int32Array | Float32Array | Uint32Array): Buffer {
  return Buffer.from(a.buffer, a.byteOffset, a.byteLength);
}

function fromBlob(type: ArrayTypeName, data: Buffer): Int32Array | Float32Array | Uint32Array {
  // Copy into a fresh, aligned buffer: SQLite blobs may start at any byte offset.
  const bytes = new Uint8Array(data.byteLength);
  bytes.set(data);
  return new ARRAY_TYPES[type](bytes.buffer);
}

/** SQLite implementation of analyses: summary and clusters as rows, per-document arrays as blobs. */
export class SqliteAnalyses {
  private readonly q: ReturnType<typeof statementCache>;

  constructor(private readonly db: Db) {
    this.q = statementCache(db);
  }

  async createAnalysis(id: string, corpusId: string, params: Record<string, unknown>): Promise<void> {
    this.q('INSERT INTO analyses (id, corpus_id, params, created_at) VALUES (?, ?, ?, ?)')
      .run(id, corpusId, JSON.stringify(params), new Date().toISOString());
  }

  private clusters(id: string): ClusterRecord[] {
    const rows = this.q('SELECT * FROM clusters WHERE analysis_id = ? ORDER BY ord').all(id) as ClusterRow[];
    return rows.map((r) => ({
      id: r.id,
      name: r.name,
      size: r.size,
      terms: JSON.parse(r.terms),
      representativeIds: JSON.parse(r.representative_ids),
      silhouette: r.silhouette,
      noContent: r.no_content === 1,
    }));
  }

  private toRecord(r: { id: string; corpus_id: string; revision: number; params: string; summary: string | null; created_at: string }): AnalysisRecord {
    return {
      id: r.id,
      corpusId: r.corpus_id,
      revision: r.revision,
      params: JSON.parse(r.params),
      createdAt: r.created_at,
      summary: r.summary ? (JSON.parse(r.summary) as AnalysisSummary) : null,
      clusters: this.clusters(r.id),
    };
  }

  async getAnalysis(id: string): Promise<AnalysisRecord | null> {
    const row = this.q('SELECT id, corpus_id, revision, params, summary, created_at FROM analyses WHERE id = ?').get(id) as
      | Parameters<SqliteAnalyses['toRecord']>[0]
      | undefined;
    return row ? this.toRecord(row) : null;
  }

  async listAnalyses(corpusId: string): Promise<AnalysisRecord[]> {
    const rows = this.q('SELECT id, corpus_id, revision, params, summary, created_at FROM analyses WHERE corpus_id = ? ORDER BY created_at, id')
      .all(corpusId) as Parameters<SqliteAnalyses['toRecord']>[0][];
    return rows.map((r) => this.toRecord(r));
  }

  private writeClusters(id: string, clusters: ClusterRecord[]): void {
    this.q('DELETE FROM clusters WHERE analysis_id = ?').run(id);
    const ins = this.q(
      'INSERT INTO clusters (analysis_id, ord, id, name, size, terms, representative_ids, silhouette, no_content) VALUES (?, ?, ?, ?, ?, ?, ?, ?, ?)',
    );
    clusters.forEach((c, i) =>
      ins.run(id, i, c.id, c.name, c.size, JSON.stringify(c.terms), JSON.stringify(c.representativeIds), c.silhouette, c.noContent ? 1 : 0),
    );
  }

  private writeArrays(id: string, arrays: AnalysisArrays): void {
    const up = this.q('INSERT OR REPLACE INTO analysis_arrays (analysis_id, name, type, data) VALUES (?, ?, ?, ?)');
    for (const [name, a] of Object.entries(arrays)) up.run(id, name, a.constructor.name, toBlob(a));
  }

  async saveAnalysisResult(
    id: string,
    summary: AnalysisSummary,
    clusters: ClusterRecord[],
    arrays: AnalysisArrays,
    extra: Record<string, unknown>,
  ): Promise<void> {
    this.db.transaction(() => {
      this.q('UPDATE analyses SET summary = ?, extra = ? WHERE id = ?').run(JSON.stringify(summary), JSON.stringify(extra), id);
      this.writeClusters(id, clusters);
      this.writeArrays(id, arrays);
    })();
  }

  async saveTriage(id: string, clusters: ClusterRecord[], arrays: AnalysisArrays, silhouette: number): Promise<void> {
    this.db.transaction(() => {
      const row = this.q('SELECT summary FROM analyses WHERE id = ?').get(id) as { summary: string | null };
      const summary = JSON.parse(row.summary ?? '{}') as AnalysisSummary;
      summary.silhouette = silhouette;
      summary.k = clusters.filter((c) => !c.noContent).length;
      this.q('UPDATE analyses SET summary = ?, revision = revision + 1 WHERE id = ?').run(JSON.stringify(summary), id);
      this.writeClusters(id, clusters);
      this.writeArrays(id, arrays);
    })();
  }

  async renameCluster(analysisId: string, clusterId: string, name: string | null): Promise<boolean> {
    return this.db.transaction(() => {
      const changed = this.q('UPDATE clusters SET name = ? WHERE analysis_id = ? AND id = ?').run(name, analysisId, clusterId).changes > 0;
      if (changed) this.q('UPDATE analyses SET revision = revision + 1 WHERE id = ?').run(analysisId);
      return changed;
    })();
  }

  async loadArrays(id: string, names: string[]): Promise<AnalysisArrays> {
    const out: AnalysisArrays = {};
    const get = this.q('SELECT type, data FROM analysis_arrays WHERE analysis_id = ? AND name = ?');
    for (const name of names) {
      const row = get.get(id, name) as { type: ArrayTypeName; data: Buffer } | undefined;
      if (row) out[name] = fromBlob(row.type, row.data);
    }
    return out;
  }

  async loadExtra(id: string): Promise<Record<string, unknown>> {
    const row = this.q('SELECT extra FROM analyses WHERE id = ?').get(id) as { extra: string | null } | undefined;
    return row?.extra ? JSON.parse(row.extra) : {};
  }
}
