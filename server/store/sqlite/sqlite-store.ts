import type { Store } from '../api.js';
import { SqliteAnalyses } from './analyses.js';
import { SqliteCorpora } from './corpora.js';
import { SqliteJobs } from './jobs.js';
import { openDatabase, type Db } from './open-database.js';
import { SqliteRouters } from './routers.js';

/**
 * The embedded store: one SQLite file `sheaf.db` under the data directory. The parts are kept
 * in one file each; this class only forwards to them.
 */
export function openSqliteStore(dataDir: string): Store {
  const db: Db = openDatabase(dataDir);
  const parts = [new SqliteCorpora(db), new SqliteJobs(db), new SqliteAnalyses(db), new SqliteRouters(db)];
  const store = {
    async integrityCheck() {
      const rows = db.pragma('integrity_check') as { integrity_check: string }[];
      return rows.length === 1 && rows[0].integrity_check === 'ok';
    },
    async getSetting(key: string) {
      const row = db.prepare('SELECT value FROM settings WHERE key = ?').get(key) as { value: string } | undefined;
      return row?.value ?? null;
    },
    async setSetting(key: string, value: string) {
      db.prepare('INSERT INTO settings (key, value) VALUES (?, ?) ON CONFLICT(key) DO UPDATE SET value = excluded.value').run(key, value);
    },
    async close() {
      db.pragma('wal_checkpoint(TRUNCATE)');
      db.close();
    },
  } as Store;
  for (const part of parts) {
    const proto = Object.getPrototypeOf(part) as Record<string, unknown>;
    for (const name of Object.getOwnPropertyNames(proto)) {
      const fn = proto[name];
      if (name === 'constructor' || typeof fn !== 'function' || name.startsWith('_')) continue;
      (store as unknown as Record<string, unknown>)[name] = (fn as (...a: unknown[]) => unknown).bind(part);
    }
  }
  return store;
}
