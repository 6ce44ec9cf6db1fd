import type { RouterKeyRecord, RouterRecord } from '../api.js';
import { statementCache, type Db } from './open-database.js';

interface RouterRow {
  id: string;
  source: string;
  params: string;
  job_id: string;
  version: number;
  created_at: string;
  labels: string | null;
  document_count: number | null;
  evaluation: string | null;
  abstain_threshold: number | null;
}

interface KeyRow {
  id: string;
  router_id: string;
  hash: string;
  prefix: string;
  created_at: string;
  revoked_at: string | null;
  last_used_at: string | null;
}

const SELECT_ROUTER = `SELECT r.*, v.labels, v.document_count, v.evaluation, v.abstain_threshold
  FROM routers r LEFT JOIN router_versions v ON v.router_id = r.id AND v.version = r.version`;

function toRouter(r: RouterRow): RouterRecord {
  return {
    id: r.id,
    source: JSON.parse(r.source),
    params: JSON.parse(r.params),
    jobId: r.job_id,
    version: r.version,
    createdAt: r.created_at,
    labels: r.labels ? JSON.parse(r.labels) : [],
    documentCount: r.document_count ?? 0,
    evaluation: r.evaluation ? JSON.parse(r.evaluation) : null,
    abstainThreshold: r.abstain_threshold,
  };
}

function toKey(r: KeyRow): RouterKeyRecord {
  return { id: r.id, routerId: r.router_id, hash: r.hash, prefix: r.prefix, createdAt: r.created_at, revokedAt: r.revoked_at, lastUsedAt: r.last_used_at };
}

/** SQLite implementation of routers: each training makes a version; `routers.version` is the serving one. */
export class SqliteRouters {
  private readonly q: ReturnType<typeof statementCache>;

  constructor(private readonly db: Db) {
    this.q = statementCache(db);
  }

  async createRouter(id: string, jobId: string, source: Record<string, unknown>, params: Record<string, unknown>): Promise<void> {
    this.q('INSERT INTO routers (id, source, params, job_id, created_at) VALUES (?, ?, ?, ?, ?)')
      .run(id, JSON.stringify(source), JSON.stringify(params), jobId, new Date().toISOString());
  }

  async setRouterJob(id: string, jobId: string, params: Record<string, unknown>): Promise<void> {
    this.q('UPDATE routers SET job_id = ?, params = ? WHERE id = ?').run(jobId, JSON.stringify(params), id);
  }

  async getRouter(id: string): Promise<RouterRecord | null> {
    const row = this.q(`${SELECT_ROUTER} WHERE r.id = ?`).get(id) as RouterRow | undefined;
    return row ? toRouter(row) : null;
  }

  async listRouters(): Promise<RouterRecord[]> {
    return (this.q(`${SELECT_ROUTER} ORDER BY r.created_at, r.id`).all() as RouterRow[]).map(toRouter);
  }

  async saveRouterVersion(
    id: string,
    model: unknown,
    labels: string[],
    documentCount: number,
    evaluation: Record<string, unknown>,
    abstainThreshold: number,
  ): Promise<number> {
    return this.db.transaction(() => {
      const next = (this.q('SELECT coalesce(max(version), 0) + 1 AS v FROM router_versions WHERE router_id = ?').get(id) as { v: number }).v;
      this.q(
          'INSERT INTO router_versions (router_id, version, model, labels, document_count, evaluation, abstain_threshold, created_at) VALUES (?, ?, ?, ?, ?, ?, ?, ?)',
        )
        .run(id, next, JSON.stringify(model), JSON.stringify(labels), documentCount, JSON.stringify(evaluation), abstainThreshold, new Date().toISOString());
      this.q('UPDATE routers SET version = ? WHERE id = ?').run(next, id);
      // Keep the serving version and the one before it; older models only take space.
      this.q('DELETE FROM router_versions WHERE router_id = ? AND version < ?').run(id, next - 1);
      return next;
    })();
  }

  async servingVersion(id: string): Promise<number | null> {
    const v = this.q('SELECT version FROM routers WHERE id = ?').pluck().get(id) as number | undefined;
    return v ?? null;
  }

  async loadRouterModel(id: string): Promise<{ version: number; model: unknown } | null> {
    const row = this.q('SELECT v.version, v.model FROM routers r JOIN router_versions v ON v.router_id = r.id AND v.version = r.version WHERE r.id = ?')
      .get(id) as { version: number; model: string } | undefined;
    return row ? { version: row.version, model: JSON.parse(row.model) } : null;
  }

  async deleteRouter(id: string): Promise<boolean> {
    return this.q('DELETE FROM routers WHERE id = ?').run(id).changes > 0;
  }

  async addKey(key: RouterKeyRecord): Promise<void> {
    this.q('INSERT INTO router_keys (id, router_id, hash, prefix, created_at) VALUES (?, ?, ?, ?, ?)')
      .run(key.id, key.routerId, key.hash, key.prefix, key.createdAt);
  }

  async listKeys(routerId: string): Promise<RouterKeyRecord[]> {
    return (this.q('SELECT * FROM router_keys WHERE router_id = ? ORDER BY created_at, id').all(routerId) as KeyRow[]).map(toKey);
  }

  async findKeyByHash(hash: string): Promise<RouterKeyRecord | null> {
    const row = this.q('SELECT * FROM router_keys WHERE hash = ?').get(hash) as KeyRow | undefined;
    return row ? toKey(row) : null;
  }

  async revokeKey(routerId: string, keyId: string): Promise<boolean> {
    return (
      this.q('UPDATE router_keys SET revoked_at = ? WHERE router_id = ? AND id = ? AND revoked_at IS NULL')
        .run(new Date().toISOString(), routerId, keyId).changes > 0
    );
  }

  async touchKey(keyId: string): Promise<void> {
    this.q('UPDATE router_keys SET last_used_at = ? WHERE id = ?').run(new Date().toISOString(), keyId);
  }
}
