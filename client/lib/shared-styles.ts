import { css } from 'lit';

/**
 * Styles every component shares: controls, panels, tables, notes. Each element adopts these and
 * adds its own, so buttons and fields look the same everywhere.
 */
export const sharedStyles = css`
  *, *::before, *::after { box-sizing: border-box; }
  :host { display: block; color: var(--ink); font: inherit; }
  :host([hidden]) { display: none; }
  h2, h3, h4 { margin: 0 0 0.5rem; line-height: 1.25; font-weight: 620; }
  h2 { font-size: 1.2rem; }
  h3 { font-size: 1.02rem; }
  h4 { font-size: 0.92rem; color: var(--muted); text-transform: none; }
  p { margin: 0.3rem 0; }
  button, .button {
    font: inherit; font-size: 0.9rem; line-height: 1.2;
    padding: 0.42rem 0.8rem; border-radius: var(--radius);
    border: 1px solid var(--line-strong); background: var(--surface); color: var(--ink);
    cursor: pointer; text-decoration: none; display: inline-flex; align-items: center; gap: 0.35rem;
  }
  button:hover:not(:disabled), .button:hover { border-color: var(--accent); }
  button.primary { background: var(--accent); border-color: var(--accent); color: #fff; }
  button.primary:hover:not(:disabled) { background: #1a3437; }
  button.quiet { border-color: transparent; background: transparent; color: var(--accent); padding: 0.3rem 0.45rem; }
  button.danger { color: var(--bad-ink); }
  button:disabled { opacity: 0.55; cursor: not-allowed; }
  :focus-visible { outline: 2px solid var(--focus); outline-offset: 2px; }
  input, select, textarea {
    font: inherit; font-size: 0.92rem; padding: 0.38rem 0.5rem; border-radius: var(--radius);
    border: 1px solid var(--line-strong); background: var(--surface); color: var(--ink);
  }
  textarea { width: 100%; resize: vertical; }
  label { font-size: 0.88rem; color: var(--muted); }
  .panel { background: var(--surface); border: 1px solid var(--line); border-radius: 10px; padding: 1rem 1.1rem; }
  .row { display: flex; gap: 0.6rem; align-items: center; flex-wrap: wrap; }
  .spread { justify-content: space-between; }
  .stack > * + * { margin-top: 0.6rem; }
  .muted { color: var(--muted); }
  .small { font-size: 0.85rem; }
  .num { font-variant-numeric: tabular-nums; text-align: right; }
  .note { padding: 0.55rem 0.75rem; border-radius: var(--radius); font-size: 0.9rem; }
  .note.bad { background: var(--bad-bg); color: var(--bad-ink); }
  .note.warn { background: var(--warn-bg); color: var(--warn-ink); }
  .note.info { background: var(--accent-soft); color: var(--accent); }
  table { border-collapse: collapse; width: 100%; font-size: 0.88rem; }
  th, td { padding: 0.32rem 0.5rem; border-bottom: 1px solid var(--line); text-align: left; vertical-align: top; }
  th { font-weight: 600; color: var(--muted); }
  .doc-text { white-space: pre-wrap; overflow-wrap: anywhere; }
  .visually-hidden { position: absolute; width: 1px; height: 1px; overflow: hidden; clip: rect(0 0 0 0); white-space: nowrap; }
`;
