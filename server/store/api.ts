/**
 * The storage interface. Everything the server keeps goes through `Store`; SQLite is the
 * embedded default, and a PostgreSQL backend can implement the same interface (every method is
 * async for that reason, and job claiming is an explicit operation so several replicas can share
 * one queue).
 */

/** A corpus as listed. */
export interface CorpusRecord {
  id: string;
  name: string;
  documentCount: number;
  createdAt: string;
  /** Metadata field names seen in the upload (not including the text or id field). */
  fields: string[];
}

/** One stored document. `meta` holds every other field of the upload. */
export interface DocumentRecord {
  id: string;
  text: string;
  meta: Record<string, unknown>;
}

/** A page of documents. */
export interface DocumentPage {
  total: number;
  items: DocumentRecord[];
}

export interface DocumentQuery {
  offset: number;
  limit: number;
  /** Case-insensitive substring filter on the text. */
  q?: string;
}

/** Storage of corpora and their documents. */
export interface CorpusStore {
  /**
   * Imports a corpus as one unit: the batches are written as they arrive, but the corpus becomes
   * visible only once the last batch is in. If `batches` throws, everything written is removed and
   * the error is rethrown. A crash midway leaves an invisible remainder that `open()` removes.
   */
  importCorpus(name: string, batches: AsyncIterable<DocumentRecord[]>, fields: () => string[]): Promise<CorpusRecord>;
  listCorpora(): Promise<CorpusRecord[]>;
  getCorpus(id: string): Promise<CorpusRecord | null>;
  /** Removes a corpus, its documents and its analyses. Routers keep working. */
  deleteCorpus(id: string): Promise<boolean>;
  listDocuments(corpusId: string, query: DocumentQuery): Promise<DocumentPage>;
  /** The ids of a corpus's documents in corpus order. */
  loadDocumentIds(corpusId: string): Promise<string[]>;
  /** All documents of a corpus in corpus order (for analyses and training). */
  loadDocuments(corpusId: string): Promise<DocumentRecord[]>;
}

export type JobKind = 'analysis' | 'training';
export type JobStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

export interface JobError {
  code: string;
  message: string;
}

export interface JobRecord {
  id: string;
  kind: JobKind;
  /** The analysis or router the job works for. */
  targetId: string;
  status: JobStatus;
  stage: string;
  fraction: number;
  error: JobError | null;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
}

/** Storage of the job queue shared by analyses and router training. */
export interface JobStore {
  createJob(id: string, kind: JobKind, targetId: string): Promise<void>;
  getJob(id: string): Promise<JobRecord | null>;
  /**
   * Takes the oldest queued job (of the given kinds) and marks it running, atomically; null when
   * none is queued. With several replicas each one calls this; only one gets a given job.
   */
  claimJob(kinds: JobKind[]): Promise<JobRecord | null>;
  updateProgress(id: string, stage: string, fraction: number): Promise<void>;
  finishJob(id: string, status: 'done' | 'failed' | 'cancelled', error?: JobError): Promise<void>;
  /** Marks jobs left `running` (by a crash) as failed with the given reason; returns how many. */
  failInterrupted(reason: string): Promise<number>;
  /** Cancels a queued job at once (it never starts); false when it is not queued. */
  cancelQueued(id: string): Promise<boolean>;
  countQueued(): Promise<number>;
}

/** A cluster of an analysis as stored (triage edits change name, membership and descriptions). */
export interface ClusterRecord {
  id: string;
  name: string | null;
  size: number;
  terms: string[];
  representativeIds: string[];
  silhouette: number;
  noContent: boolean;
}

/** The summary part of an analysis result (the arrays are stored apart). */
export interface AnalysisSummary {
  k: number;
  silhouette: number;
  silhouetteByK: { k: number; silhouette: number }[];
  /** The same curve on a structureless (shuffled) copy of the documents; empty when k was given. */
  referenceByK?: { k: number; silhouette: number }[];
  kRule: string;
  timings: Record<string, number>;
  termCount: number;
}

export interface AnalysisRecord {
  id: string;
  corpusId: string;
  /** Bumped by every triage edit (rename, merge, move). */
  revision: number;
  params: Record<string, unknown>;
  createdAt: string;
  summary: AnalysisSummary | null;
  clusters: ClusterRecord[];
}

/** Numeric arrays of an analysis, by name: `labels` (Int32), `silhouettes`, `xy`, `reduced` (Float32), `tfidf.*`. */
export type AnalysisArrays = Record<string, Int32Array | Float32Array | Uint32Array>;

export interface AnalysisStore {
  createAnalysis(id: string, corpusId: string, params: Record<string, unknown>): Promise<void>;
  getAnalysis(id: string): Promise<AnalysisRecord | null>;
  listAnalyses(corpusId: string): Promise<AnalysisRecord[]>;
  /** Stores a finished analysis: summary, clusters and arrays, in one transaction. */
  saveAnalysisResult(id: string, summary: AnalysisSummary, clusters: ClusterRecord[], arrays: AnalysisArrays, extra: Record<string, unknown>): Promise<void>;
  /** Replaces clusters and some arrays after a triage edit, in one transaction. */
  saveTriage(id: string, clusters: ClusterRecord[], arrays: AnalysisArrays, silhouette: number): Promise<void>;
  renameCluster(analysisId: string, clusterId: string, name: string | null): Promise<boolean>;
  loadArrays(id: string, names: string[]): Promise<AnalysisArrays>;
  /** JSON side data saved with the result (e.g. term labels). */
  loadExtra(id: string): Promise<Record<string, unknown>>;
}

export interface RouterRecord {
  id: string;
  source: Record<string, unknown>;
  params: Record<string, unknown>;
  createdAt: string;
  /** Id of the job training the newest version. */
  jobId: string;
  /** Version currently serving (0 = none yet). */
  version: number;
  labels: string[];
  documentCount: number;
  evaluation: Record<string, unknown> | null;
  abstainThreshold: number | null;
}

export interface RouterKeyRecord {
  id: string;
  routerId: string;
  hash: string;
  prefix: string;
  createdAt: string;
  revokedAt: string | null;
  lastUsedAt: string | null;
}

export interface RouterStore {
  createRouter(id: string, jobId: string, source: Record<string, unknown>, params: Record<string, unknown>): Promise<void>;
  /** Points a router at a new training job (retraining); the serving version stays until the job succeeds. */
  setRouterJob(id: string, jobId: string, params: Record<string, unknown>): Promise<void>;
  getRouter(id: string): Promise<RouterRecord | null>;
  listRouters(): Promise<RouterRecord[]>;
  /** Stores a newly trained version and makes it the serving one, in one transaction. */
  saveRouterVersion(id: string, model: unknown, labels: string[], documentCount: number, evaluation: Record<string, unknown>, abstainThreshold: number): Promise<number>;
  /** The serving version alone (cheap: checked on every routing request); null for an unknown router. */
  servingVersion(id: string): Promise<number | null>;
  loadRouterModel(id: string): Promise<{ version: number; model: unknown } | null>;
  deleteRouter(id: string): Promise<boolean>;
  addKey(key: RouterKeyRecord): Promise<void>;
  listKeys(routerId: string): Promise<RouterKeyRecord[]>;
  findKeyByHash(hash: string): Promise<RouterKeyRecord | null>;
  revokeKey(routerId: string, keyId: string): Promise<boolean>;
  touchKey(keyId: string): Promise<void>;
}

/** The whole store. */
export interface Store extends CorpusStore, JobStore, AnalysisStore, RouterStore {
  /** A small persistent setting (e.g. whether the demo corpus was ever loaded); null when unset. */
  getSetting(key: string): Promise<string | null>;
  setSetting(key: string, value: string): Promise<void>;
  /** Checks the database (for tests and operators); true when intact. */
  integrityCheck(): Promise<boolean>;
  close(): Promise<void>;
}
