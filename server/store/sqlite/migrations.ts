/**
 * Schema migrations, applied in order at start. Never edit a released migration: add a new one.
 * `user_version` records how many have been applied.
 */
export const MIGRATIONS: readonly string[] = [
  // 1: corpora and documents. `ready = 0` marks an import in progress (invisible to readers).
  `CREATE TABLE corpora (
     id TEXT PRIMARY KEY,
     name TEXT NOT NULL,
     document_count INTEGER NOT NULL DEFAULT 0,
     fields TEXT NOT NULL DEFAULT '[]',
     ready INTEGER NOT NULL DEFAULT 0,
     created_at TEXT NOT NULL
   );
   -- A rowid table: documents are hundreds of bytes, too large for WITHOUT ROWID to pay off.
   CREATE TABLE documents (
     corpus_id TEXT NOT NULL REFERENCES corpora(id) ON DELETE CASCADE,
     ord INTEGER NOT NULL,
     doc_id TEXT NOT NULL,
     text TEXT NOT NULL,
     meta TEXT NOT NULL DEFAULT '{}'
   );
   CREATE UNIQUE INDEX documents_by_ord ON documents(corpus_id, ord);
   CREATE UNIQUE INDEX documents_by_id ON documents(corpus_id, doc_id);
   CREATE TABLE settings (key TEXT PRIMARY KEY, value TEXT NOT NULL);`,
  // 2: the job queue.
  `CREATE TABLE jobs (
     id TEXT PRIMARY KEY,
     kind TEXT NOT NULL,
     target_id TEXT NOT NULL,
     status TEXT NOT NULL,
     stage TEXT NOT NULL DEFAULT '',
     fraction REAL NOT NULL DEFAULT 0,
     error TEXT,
     created_at TEXT NOT NULL,
     started_at TEXT,
     finished_at TEXT,
     seq INTEGER NOT NULL
   );
   CREATE INDEX jobs_queued ON jobs(status, seq);`,
  // 3: analyses, their clusters and numeric arrays.
  `CREATE TABLE analyses (
     id TEXT PRIMARY KEY,
     corpus_id TEXT NOT NULL REFERENCES corpora(id) ON DELETE CASCADE,
     params TEXT NOT NULL,
     summary TEXT,
     extra TEXT,
     created_at TEXT NOT NULL
   );
   CREATE INDEX analyses_by_corpus ON analyses(corpus_id, created_at);
   CREATE TABLE clusters (
     analysis_id TEXT NOT NULL REFERENCES analyses(id) ON DELETE CASCADE,
     ord INTEGER NOT NULL,
     id TEXT NOT NULL,
     name TEXT,
     size INTEGER NOT NULL,
     terms TEXT NOT NULL,
     representative_ids TEXT NOT NULL,
     silhouette REAL NOT NULL,
     no_content INTEGER NOT NULL DEFAULT 0,
     PRIMARY KEY (analysis_id, id)
   ) WITHOUT ROWID;
   CREATE TABLE analysis_arrays (
     analysis_id TEXT NOT NULL REFERENCES analyses(id) ON DELETE CASCADE,
     name TEXT NOT NULL,
     type TEXT NOT NULL,
     data BLOB NOT NULL,
     PRIMARY KEY (analysis_id, name)
   ) WITHOUT ROWID;`,
  // 4: routers, their versions and keys. Routers outlive the corpus they were trained on.
  `CREATE TABLE routers (
     id TEXT PRIMARY KEY,
     source TEXT NOT NULL,
     params TEXT NOT NULL,
     job_id TEXT NOT NULL,
     version INTEGER NOT NULL DEFAULT 0,
     created_at TEXT NOT NULL
   );
   CREATE TABLE router_versions (
     router_id TEXT NOT NULL REFERENCES routers(id) ON DELETE CASCADE,
     version INTEGER NOT NULL,
     model TEXT NOT NULL,
     labels TEXT NOT NULL,
     document_count INTEGER NOT NULL,
     evaluation TEXT NOT NULL,
     abstain_threshold REAL NOT NULL,
     created_at TEXT NOT NULL,
     PRIMARY KEY (router_id, version)
   ) WITHOUT ROWID;
   CREATE TABLE router_keys (
     id TEXT PRIMARY KEY,
     router_id TEXT NOT NULL REFERENCES routers(id) ON DELETE CASCADE,
     hash TEXT NOT NULL UNIQUE,
     prefix TEXT NOT NULL,
     created_at TEXT NOT NULL,
     revoked_at TEXT,
     last_used_at TEXT
   );`,
  // 5: a revision per analysis, bumped by every triage edit, so exports can be cached safely.
  `ALTER TABLE analyses ADD COLUMN revision INTEGER NOT NULL DEFAULT 0;`,
];
