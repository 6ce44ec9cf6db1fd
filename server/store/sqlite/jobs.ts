import type { JobError, JobKind, JobRecord } from '../api.js';
import { statementCache, type Db } from './open-database.js';

interface JobRow {
  id: string;
  kind: JobKind;
  target_id: string;
  status: JobRecord['status'];
  stage: string;
  fraction: number;
  error: string | null;
  created_at: string;
  started_at: string | null;
  finished_at: string | null;
}

function toJob(r: JobRow): JobRecord {
  return {
    id: r.id,
    kind: r.kind,
    targetId: r.target_id,
    status: r.status,
    stage: r.stage,
    fraction: r.fraction,
    error: r.error ? (JSON.parse(r.error) as JobError) : null,
    createdAt: r.created_at,
    startedAt: r.started_at,
    finishedAt: r.finished_at,
  };
}

/** SQLite implementation of the job queue. One process owns the file, so claiming is one transaction. */
export class SqliteJobs {
  private readonly q: ReturnType<typeof statementCache>;

  constructor(private readonly db: Db) {
    this.q = statementCache(db);
  }

  async createJob(id: string, kind: JobKind, targetId: string): Promise<void> {
    const seq = (this.q('SELECT coalesce(max(seq), 0) + 1 AS s FROM jobs').get() as { s: number }).s;
    this.q("INSERT INTO jobs (id, kind, target_id, status, created_at, seq) VALUES (?, ?, ?, 'queued', ?, ?)")
      .run(id, kind, targetId, new Date().toISOString(), seq);
  }

  async getJob(id: string): Promise<JobRecord | null> {
    const row = this.q('SELECT * FROM jobs WHERE id = ?').get(id) as JobRow | undefined;
    return row ? toJob(row) : null;
  }

  async claimJob(kinds: JobKind[]): Promise<JobRecord | null> {
    const marks = kinds.map(() => '?').join(',');
    return this.db.transaction(() => {
      const row = this.q(`SELECT * FROM jobs WHERE status = 'queued' AND kind IN (${marks}) ORDER BY seq LIMIT 1`)
        .get(...kinds) as JobRow | undefined;
      if (!row) return null;
      const startedAt = new Date().toISOString();
      this.q("UPDATE jobs SET status = 'running', started_at = ? WHERE id = ?").run(startedAt, row.id);
      return toJob({ ...row, status: 'running', started_at: startedAt });
    })();
  }

  async updateProgress(id: string, stage: string, fraction: number): Promise<void> {
    this.q("UPDATE jobs SET stage = ?, fraction = ? WHERE id = ? AND status = 'running'").run(stage, fraction, id);
  }

  async finishJob(id: string, status: 'done' | 'failed' | 'cancelled', error?: JobError): Promise<void> {
    this.q('UPDATE jobs SET status = ?, error = ?, finished_at = ?, fraction = CASE WHEN ? = \'done\' THEN 1 ELSE fraction END WHERE id = ?')
      .run(status, error ? JSON.stringify(error) : null, new Date().toISOString(), status, id);
  }

  async failInterrupted(reason: string): Promise<number> {
    const error = JSON.stringify({ code: 'interrupted', message: reason });
    return this.q("UPDATE jobs SET status = 'failed', error = ?, finished_at = ? WHERE status = 'running'")
      .run(error, new Date().toISOString()).changes;
  }

  async cancelQueued(id: string): Promise<boolean> {
    return (
      this.q("UPDATE jobs SET status = 'cancelled', finished_at = ? WHERE id = ? AND status = 'queued'")
        .run(new Date().toISOString(), id).changes > 0
    );
  }

  async countQueued(): Promise<number> {
    return (this.q("SELECT count(*) AS n FROM jobs WHERE status = 'queued'").get() as { n: number }).n;
  }
}
