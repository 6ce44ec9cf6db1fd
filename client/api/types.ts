/**
 * Shapes of the sheaf HTTP API v1 as the client reads them (/work/shared/api-v1.md plus the
 * announced extensions). Every field the client does not strictly need is optional, so a server
 * that omits an extension still renders.
 */

/** The body of every 4xx/5xx answer. */
export interface ApiErrorBody {
  error: { code: string; message: string; details?: Record<string, unknown> };
}

/** One line the server did not import, with the reason. */
export interface SkippedLine {
  line: number;
  reason: string;
}

/** An entry of `GET /corpora`. */
export interface CorpusSummary {
  id: string;
  name: string;
  documentCount: number;
  createdAt: string;
}

/** `GET /corpora/:cid`. */
export interface Corpus extends CorpusSummary {
  fields: string[];
}

/** `201` answer of `POST /corpora`. */
export interface CorpusCreated {
  id: string;
  name: string;
  documentCount: number;
  skipped: SkippedLine[];
  fields: string[];
}

/** One document of `GET /corpora/:cid/documents`. */
export interface DocumentItem {
  id: string;
  text: string;
  meta: Record<string, unknown>;
}

/** A page of documents. */
export interface DocumentPage {
  total: number;
  items: DocumentItem[];
}

/** Job states shared by analyses and routers. */
export type JobStatus = 'queued' | 'running' | 'done' | 'failed' | 'cancelled';

/** Clustering method names fixed by the contract. */
export type ClusterMethod = 'kmeans' | 'agglomerative';
/** Linkage names fixed by the contract. */
export type Linkage = 'average' | 'complete' | 'ward';

/** Body of `POST /corpora/:cid/analyses`. */
export interface AnalysisRequest {
  method: ClusterMethod;
  k: 'auto' | number;
  kMin: number;
  kMax: number;
  linkage: Linkage;
  seed: number;
  /** Extension: passes of the map layout; "auto" keeps large maps quick, "fine" makes at least 200. */
  mapEpochs: 'auto' | 'fine' | number;
}

/** One theme (cluster) of an analysis. */
export interface Cluster {
  id: string;
  name: string | null;
  size: number;
  terms: string[];
  representativeIds: string[];
  silhouette: number | null;
  /** Extension: the cluster gathers documents with no usable terms. */
  noContent?: boolean;
}

/** `GET /analyses/:aid`. */
export interface Analysis {
  id: string;
  corpusId: string;
  status: JobStatus;
  progress?: { stage: string; fraction: number; detail?: string } | null;
  error: { code: string; message: string } | null;
  params?: Partial<AnalysisRequest>;
  k?: number | null;
  silhouette?: number | null;
  silhouetteByK?: Record<string, number> | null;
  /** Extension: the silhouette curve of a shuffled, structureless copy (the yardstick of k = "auto"). */
  referenceByK?: Record<string, number> | null;
  clusters?: Cluster[];
  timings?: Record<string, number>;
  /** Extension: how k was chosen, in words. */
  kRule?: string;
  createdAt?: string;
}

/** One row of `GET /analyses/:aid/assignments`. */
export interface Assignment {
  documentId: string;
  clusterId: string;
  x: number;
  y: number;
  silhouette: number | null;
}

/** A progress event of `/events` streams. */
export interface ProgressEvent {
  stage?: string;
  /** The engine phase inside the stage, when it differs. */
  detail?: string;
  fraction?: number;
  status?: JobStatus;
}

/** Body of `POST /routers`. */
export type RouterRequest =
  | { analysisId: string; folds?: number; alpha?: number; targetPrecision?: number }
  | { corpusId: string; labelField: string; folds?: number; alpha?: number; targetPrecision?: number };

/** Per-label measures of a router evaluation. */
export interface LabelMeasures {
  label: string;
  precision: number;
  recall: number;
  specificity?: number;
  f1: number;
  support: number;
  auc: number | null;
}

/** Cross-validated evaluation of a router (contract plus the announced extension). */
export interface Evaluation {
  folds: number;
  accuracy: number;
  errorRate?: number;
  macroF1: number;
  perLabel: LabelMeasures[];
  confusion: { labels: string[]; matrix: number[][] };
  roc?: { label: string; points: [number, number][] }[];
  threshold?: {
    value: number;
    targetPrecision: number;
    precision: number;
    coverage: number;
    reached: boolean;
  };
  thresholdCurve?: { threshold: number; precision: number; coverage: number }[];
}

/** `GET /routers/:rid`. */
export interface Router {
  id: string;
  status: JobStatus;
  progress?: { stage: string; fraction: number; detail?: string } | null;
  error?: { code: string; message: string } | null;
  labels?: string[];
  documentCount?: number;
  evaluation?: Evaluation | null;
  abstainThreshold?: number | null;
  /** Where the training labels came from. */
  source?: { analysisId?: string; corpusId?: string; labelField?: string } | null;
  /** Times the router was trained (retraining adds one). */
  version?: number;
  createdAt?: string;
  name?: string | null;
}

/** An API key as listed (never the secret itself). */
export interface KeySummary {
  id: string;
  createdAt?: string;
  prefix?: string;
  label?: string;
  lastUsedAt?: string | null;
  /** Set once the key was revoked; it no longer works. */
  revokedAt?: string | null;
}

/** One routed message. */
export interface RouteResult {
  id: string;
  label: string;
  confidence: number;
  abstained: boolean;
  scores: Record<string, number>;
  evidence: string[];
}
