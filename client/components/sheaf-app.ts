import { LitElement, css, html } from 'lit';
import { sharedStyles } from '../lib/shared-styles.js';
import { EMPTY_URL_STATE, readUrlState, writeUrlState, type UrlState, type View } from '../lib/url-state.js';
import './sheaf-corpus-page.js';
import './sheaf-analysis-page.js';
import './sheaf-router-page.js';

/** Detail of the `navigate` event children send to change what the page shows. */
export type NavigateDetail = Partial<UrlState> & { replace?: boolean };

/**
 * Dispatches a `navigate` request from any element; the app merges it into the URL state.
 * @param from the element sending it
 * @param detail fields to change; `replace: true` edits the current history entry instead of adding one
 */
export function navigate(from: HTMLElement, detail: NavigateDetail): void {
  from.dispatchEvent(new CustomEvent<NavigateDetail>('navigate', { detail, bubbles: true, composed: true }));
}

/**
 * The application shell: a header with the three pages, and the page the URL names. The URL
 * query string is the single source of the state a shared link restores.
 */
export class SheafApp extends LitElement {
  static override properties = { state: { state: true } };
  state: UrlState = EMPTY_URL_STATE;

  static override styles = [
    sharedStyles,
    css`
      :host { min-height: 100vh; display: flex; flex-direction: column; }
      header {
        display: flex; align-items: center; gap: 1.5rem; padding: 0.6rem 1.4rem;
        background: var(--surface); border-bottom: 1px solid var(--line);
      }
      .mark { font-weight: 700; font-size: 1.15rem; letter-spacing: 0.02em; color: var(--accent); display: flex; gap: 0.45rem; align-items: center; }
      .mark svg { width: 22px; height: 22px; }
      nav { display: flex; gap: 0.25rem; }
      nav a {
        padding: 0.35rem 0.75rem; border-radius: 999px; color: var(--muted); text-decoration: none; font-size: 0.93rem;
      }
      nav a[aria-current='page'] { background: var(--accent-soft); color: var(--accent); font-weight: 600; }
      nav a:hover { color: var(--ink); }
      main { flex: 1; padding: 1.2rem 1.4rem 2rem; max-width: 1500px; width: 100%; margin: 0 auto; }
    `,
  ];

  private readonly onPop = () => {
    this.state = readUrlState(location.search);
  };

  private readonly onNavigate = (ev: Event) => {
    const { replace, ...change } = (ev as CustomEvent<NavigateDetail>).detail;
    const next: UrlState = { ...this.state, ...change };
    // Leaving an analysis drops what only made sense inside it.
    if (change.analysis !== undefined && this.state.analysis !== null && change.analysis !== this.state.analysis && change.theme === undefined) next.theme = null;
    if (change.corpus !== undefined && this.state.corpus !== null && change.corpus !== this.state.corpus && change.analysis === undefined) next.analysis = null;
    if ((change.q !== undefined && change.q !== this.state.q) || (change.theme !== undefined && change.theme !== this.state.theme)) {
      if (change.page === undefined) next.page = 0;
    }
    const url = `${location.pathname}${writeUrlState(next)}`;
    if (replace) history.replaceState(null, '', url);
    else history.pushState(null, '', url);
    this.state = next;
  };

  override connectedCallback(): void {
    super.connectedCallback();
    this.state = readUrlState(location.search);
    window.addEventListener('popstate', this.onPop);
    this.addEventListener('navigate', this.onNavigate);
  }

  override disconnectedCallback(): void {
    window.removeEventListener('popstate', this.onPop);
    this.removeEventListener('navigate', this.onNavigate);
    super.disconnectedCallback();
  }

  private link(view: View, label: string) {
    const target: UrlState = { ...this.state, view };
    const href = `${location.pathname}${writeUrlState(target)}`;
    return html`<a
      href=${href}
      aria-current=${this.state.view === view ? 'page' : 'false'}
      @click=${(e: MouseEvent) => {
        if (e.ctrlKey || e.metaKey || e.shiftKey || e.button !== 0) return;
        e.preventDefault();
        navigate(this, { view });
      }}
      >${label}</a
    >`;
  }

  protected override updated(): void {
    const page = { corpora: 'Corpora', analysis: 'Themes', routers: 'Routers' }[this.state.view];
    document.title = `${page} · sheaf`;
  }

  override render() {
    const s = this.state;
    return html`
      <header>
        <span class="mark" aria-label="sheaf">
          <svg viewBox="0 0 32 32" aria-hidden="true"><rect width="32" height="32" rx="7" fill="#24454a" /><path d="M16 27 V8 M16 27 L9.5 9.5 M16 27 L22.5 9.5 M16 27 L5.5 14 M16 27 L26.5 14" stroke="#f6f5f1" stroke-width="2" fill="none" stroke-linecap="round" /><path d="M11 20.5 H21" stroke="#E69F00" stroke-width="3" stroke-linecap="round" /></svg>
          sheaf
        </span>
        <nav aria-label="Pages">
          ${this.link('corpora', 'Corpora')} ${this.link('analysis', 'Themes')} ${this.link('routers', 'Routers')}
        </nav>
      </header>
      <main>
        ${s.view === 'corpora'
          ? html`<sheaf-corpus-page .corpusId=${s.corpus}></sheaf-corpus-page>`
          : s.view === 'analysis'
            ? html`<sheaf-analysis-page .corpusId=${s.corpus} .analysisId=${s.analysis} .themeId=${s.theme} .query=${s.q} .page=${s.page}></sheaf-analysis-page>`
            : html`<sheaf-router-page .routerId=${s.router} .analysisId=${s.analysis} .corpusId=${s.corpus}></sheaf-router-page>`}
      </main>
    `;
  }
}
customElements.define('sheaf-app', SheafApp);
