import { ApiError } from './api-error.js';
import type {
  Analysis,
  AnalysisRequest,
  Assignment,
  Corpus,
  CorpusCreated,
  CorpusSummary,
  DocumentPage,
  KeySummary,
  RouteResult,
  Router,
  RouterRequest,
} from './types.js';

/** Root of every API path; the UI is served by the same origin. */
export const API_ROOT = '/api/v1';

async function readError(res: Response): Promise<ApiError> {
  let body: unknown = null;
  try {
    body = await res.json();
  } catch {
    // Not JSON (a proxy page, an empty body): fall back to the status line.
  }
  const e = (body as { error?: { code?: unknown; message?: unknown; details?: unknown } } | null)?.error;
  if (e && typeof e.code === 'string') {
    const details = e.details && typeof e.details === 'object' ? (e.details as Record<string, unknown>) : {};
    return new ApiError(res.status, e.code, typeof e.message === 'string' ? e.message : '', details);
  }
  return new ApiError(res.status, res.status >= 500 ? 'internal' : 'bad_request', `The server answered ${res.status} ${res.statusText}.`);
}

/**
 * Calls the API and returns the parsed JSON body; throws {@link ApiError} on any failure.
 * @param path path under /api/v1, starting with `/`
 * @param init fetch options; a plain object `json` is sent as the JSON body
 */
export async function request<T>(path: string, init: RequestInit & { json?: unknown } = {}): Promise<T> {
  const { json, ...rest } = init;
  const headers = new Headers(rest.headers);
  headers.set('accept', 'application/json');
  if (json !== undefined) headers.set('content-type', 'application/json; charset=utf-8');
  let res: Response;
  try {
    res = await fetch(API_ROOT + path, { ...rest, headers, body: json !== undefined ? JSON.stringify(json) : rest.body });
  } catch (err) {
    if (err instanceof DOMException && err.name === 'AbortError') throw err;
    throw new ApiError(0, 'network', '');
  }
  if (!res.ok) throw await readError(res);
  if (res.status === 204) return undefined as T;
  const text = await res.text();
  return (text ? JSON.parse(text) : undefined) as T;
}

const enc = encodeURIComponent;

/** Typed calls of the sheaf API v1, one per endpoint the UI uses. */
export const api = {
  listCorpora: (signal?: AbortSignal) => request<CorpusSummary[]>('/corpora', { signal }),
  getCorpus: (cid: string, signal?: AbortSignal) => request<Corpus>(`/corpora/${enc(cid)}`, { signal }),
  deleteCorpus: (cid: string) => request<void>(`/corpora/${enc(cid)}`, { method: 'DELETE' }),
  uploadCorpus: (form: FormData, signal?: AbortSignal) =>
    request<CorpusCreated>('/corpora', { method: 'POST', body: form, signal }),
  documents: (cid: string, q: { offset?: number; limit?: number; q?: string; clusterId?: string; analysisId?: string }, signal?: AbortSignal) => {
    const p = new URLSearchParams();
    p.set('offset', String(q.offset ?? 0));
    p.set('limit', String(q.limit ?? 100));
    if (q.q) p.set('q', q.q);
    return request<DocumentPage>(`/corpora/${enc(cid)}/documents?${p}`, { signal });
  },
  listAnalyses: (cid: string, signal?: AbortSignal) => request<Analysis[]>(`/corpora/${enc(cid)}/analyses`, { signal }),
  startAnalysis: (cid: string, body: Partial<AnalysisRequest>) =>
    request<{ id: string; status: string }>(`/corpora/${enc(cid)}/analyses`, { method: 'POST', json: body }),
  getAnalysis: (aid: string, signal?: AbortSignal) => request<Analysis>(`/analyses/${enc(aid)}`, { signal }),
  cancelAnalysis: (aid: string) => request<unknown>(`/analyses/${enc(aid)}/cancel`, { method: 'POST' }),
  assignments: (aid: string, signal?: AbortSignal) => request<Assignment[]>(`/analyses/${enc(aid)}/assignments`, { signal }),
  renameCluster: (aid: string, clid: string, name: string, signal?: AbortSignal) =>
    request<Analysis>(`/analyses/${enc(aid)}/clusters/${enc(clid)}`, { method: 'PATCH', json: { name }, signal }),
  mergeClusters: (aid: string, clusterIds: string[], name?: string, signal?: AbortSignal) =>
    request<Analysis>(`/analyses/${enc(aid)}/merge`, { method: 'POST', json: name ? { clusterIds, name } : { clusterIds }, signal }),
  moveDocuments: (aid: string, documentIds: string[], clusterId: string, signal?: AbortSignal) =>
    request<Analysis>(`/analyses/${enc(aid)}/moves`, { method: 'POST', json: { documentIds, clusterId }, signal }),
  exportUrl: (aid: string, format: 'csv' | 'ndjson') => `${API_ROOT}/analyses/${enc(aid)}/assignments?format=${format}`,
  eventsUrl: (kind: 'analyses' | 'routers', id: string) => `${API_ROOT}/${kind}/${enc(id)}/events`,
  listRouters: (signal?: AbortSignal) => request<Router[]>('/routers', { signal }),
  startRouter: (body: RouterRequest) => request<{ id: string; status: string }>('/routers', { method: 'POST', json: body }),
  deleteRouter: (rid: string) => request<void>(`/routers/${enc(rid)}`, { method: 'DELETE' }),
  getRouter: (rid: string, signal?: AbortSignal) => request<Router>(`/routers/${enc(rid)}`, { signal }),
  cancelRouter: (rid: string) => request<unknown>(`/routers/${enc(rid)}/cancel`, { method: 'POST' }),
  createKey: (rid: string) => request<{ key: string; id?: string }>(`/routers/${enc(rid)}/keys`, { method: 'POST', json: {} }),
  listKeys: (rid: string, signal?: AbortSignal) => request<KeySummary[] | { items: KeySummary[] }>(`/routers/${enc(rid)}/keys`, { signal }),
  revokeKey: (rid: string, kid: string) => request<void>(`/routers/${enc(rid)}/keys/${enc(kid)}`, { method: 'DELETE' }),
  route: (rid: string, key: string, text: string) =>
    request<{ results: RouteResult[] }>(`/routers/${enc(rid)}/route`, {
      method: 'POST',
      json: { text },
      headers: { authorization: `Bearer ${key}` },
    }),
};
