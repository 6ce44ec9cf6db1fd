import Database from 'better-sqlite3';
import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import { MIGRATIONS } from './migrations.js';

export type Db = Database.Database;

/**
 * Opens (creating if needed) the SQLite database under `dataDir`, in WAL mode so readers never
 * wait for the writer, and applies pending migrations in one transaction each.
 */
export function openDatabase(dataDir: string): Db {
  mkdirSync(dataDir, { recursive: true });
  const db = new Database(join(dataDir, 'sheaf.db'));
  db.pragma('journal_mode = WAL');
  // NORMAL is durable across process crashes in WAL mode (only an OS crash can lose the last commits).
  db.pragma('synchronous = NORMAL');
  db.pragma('foreign_keys = ON');
  db.pragma('busy_timeout = 5000');
  const applied = db.pragma('user_version', { simple: true }) as number;
  if (applied > MIGRATIONS.length) {
    throw new Error(`The database in ${dataDir} was written by a newer sheaf (schema ${applied}, this one knows ${MIGRATIONS.length}).`);
  }
  for (let i = applied; i < MIGRATIONS.length; i++) {
    db.transaction(() => {
      db.exec(MIGRATIONS[i]);
      db.pragma(`user_version = ${i + 1}`);
    })();
  }
  return db;
}

/**
 * A prepare-once cache: statements are compiled on first use and reused, which matters on hot
 * paths such as key lookups on every routing request.
 */
export function statementCache(db: Db): (sql: string) => Database.Statement {
  const cache = new Map<string, Database.Statement>();
  return (sql) => {
    let s = cache.get(sql);
    if (!s) {
      s = db.prepare(sql);
      cache.set(sql, s);
    }
    return s;
  };
}
