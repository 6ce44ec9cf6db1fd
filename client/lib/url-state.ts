/**
 * The state that matters for a shared link, kept in the page's query string:
 * `/?view=analysis&corpus=…&analysis=…&theme=…&q=…`. Ids are opaque, so they are only
 * percent-encoded, never parsed.
 */

/** Top-level pages. */
export type View = 'corpora' | 'analysis' | 'routers';

/** Everything a link restores. */
export interface UrlState {
  view: View;
  corpus: string | null;
  analysis: string | null;
  /** Selected theme (cluster id). */
  theme: string | null;
  router: string | null;
  /** Text search over documents. */
  q: string;
  /** 0-based page of the document list. */
  page: number;
}

/** State of an empty query string. */
export const EMPTY_URL_STATE: UrlState = { view: 'corpora', corpus: null, analysis: null, theme: null, router: null, q: '', page: 0 };

const VIEWS: readonly View[] = ['corpora', 'analysis', 'routers'];

/**
 * Reads the state from a query string; unknown or malformed values fall back to defaults.
 * @param search `location.search` (with or without the leading `?`)
 */
export function readUrlState(search: string): UrlState {
  const p = new URLSearchParams(search);
  const view = p.get('view');
  const page = Number(p.get('page') ?? '0');
  const nonEmpty = (k: string) => {
    const v = p.get(k);
    return v ? v : null;
  };
  const state: UrlState = {
    view: VIEWS.includes(view as View) ? (view as View) : EMPTY_URL_STATE.view,
    corpus: nonEmpty('corpus'),
    analysis: nonEmpty('analysis'),
    theme: nonEmpty('theme'),
    router: nonEmpty('router'),
    q: p.get('q') ?? '',
    page: Number.isInteger(page) && page >= 0 ? page : 0,
  };
  // An analysis link without the view still opens the analysis.
  if (!view && state.analysis) state.view = 'analysis';
  if (!view && state.router) state.view = 'routers';
  return state;
}

/**
 * Writes the state as a query string, leaving defaults out so links stay short.
 * @param s the state
 * @returns `?…`, or `''` for the default state
 */
export function writeUrlState(s: UrlState): string {
  const p = new URLSearchParams();
  if (s.view !== EMPTY_URL_STATE.view) p.set('view', s.view);
  if (s.corpus) p.set('corpus', s.corpus);
  if (s.analysis) p.set('analysis', s.analysis);
  if (s.theme) p.set('theme', s.theme);
  if (s.router) p.set('router', s.router);
  if (s.q) p.set('q', s.q);
  if (s.page > 0) p.set('page', String(s.page));
  const out = p.toString();
  return out ? `?${out}` : '';
}
